import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { SHEET_CAUTIONS } from './cautions.js';
import { renderSheetPdf, type SheetData } from './sheet-pdf.js';
import { toWinAnsi } from './sheet-fonts.js';

/** Text of a PDF as Debian's poppler-utils `pdftotext` reads it, whitespace collapsed. */
function pdfText(pdf: Buffer): string {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'wm-sheet-')), 'sheet.pdf');
  fs.writeFileSync(file, pdf);
  return execFileSync('pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
}

async function sample(): Promise<SheetData> {
  const png = await sharp({ create: { width: 32, height: 32, channels: 4, background: { r: 200, g: 80, b: 20, alpha: 1 } } }).png().toBuffer();
  return {
    projectTitle: 'Rivers of the Loire basin', clientName: 'Blue Press', purposeLabel: 'Equal-area thematic', scaleBandLabel: 'Country',
    regionLine: 'Loire basin, 117 000 km²', candidateLabel: 'Albers, one-sixth rule', definitionEntered: '+proj=aea +lat_1=44 +lat_2=49',
    projString: '+proj=aea +lat_0=46 +lon_0=2 +lat_1=44 +lat_2=49 +x_0=0 +y_0=0 +ellps=WGS84 +units=m +no_defs',
    wkt: 'PROJCS["Albers",GEOGCS["WGS 84"]]',
    metrics: [{ label: 'Areal scale, mean', value: '1.000000' }],
    heatmaps: [{ title: 'Areal scale', png, legend: 'blue below 1, red above' }],
    recommendation: 'We recommend Albers.\n\n- least areal error',
    recordHash: '0123456789abcdef'.repeat(4), regionHash: 'f'.repeat(64), engineVersion: 'test-1', samplingLine: '2 000 samples, seed 7',
    reviewerName: 'Ana Reviewer', reviewerEmail: 'ana@example.test', signature: 'Ana Reviewer', approvedAtUtc: '2026-12-02 10:00:00 UTC',
    roundNumber: 2, comment: null, generatedAtUtc: '2026-12-02 10:01 UTC',
  };
}

describe('renderSheetPdf', () => {
  it('writes a PDF whose text holds the hash, the PROJ string and every caution', async () => {
    const d = await sample();
    const pdf = await renderSheetPdf(d);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = pdfText(pdf);
    expect(text).toContain(d.recordHash);
    expect(text).toContain(d.projString);
    expect(text).toContain('Ana Reviewer');
    expect(text).toContain('least areal error');
    for (const c of SHEET_CAUTIONS) expect(text).toContain(c.replace(/\s+/g, ' '));
  });
});

describe('toWinAnsi', () => {
  it('keeps Latin-1 and CP1252 punctuation, spells out symbols and strips other accents', () => {
    expect(toWinAnsi('Zürich – “ω ≤ 1°” Łódź 東')).toBe('Zürich – “omega <= 1°” Lódz ?');
  });
});
