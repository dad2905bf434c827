import PDFDocument from 'pdfkit';
import { parseRecommendation } from '../../shared/review/recommendation.js';
import { SHEET_CAUTIONS } from './cautions.js';
import { sheetFonts, toWinAnsi } from './sheet-fonts.js';

export interface SheetHeatmap {
  title: string;
  png: Buffer;
  /** One line under the image: what the colours mean. */
  legend: string;
  /** The colour ramp as stops (t from 0 to 1), drawn as a bar under the image. */
  stops?: Array<{ t: number; color: string }>;
}

export interface SheetData {
  projectTitle: string;
  clientName: string;
  purposeLabel: string;
  scaleBandLabel: string;
  regionLine: string;
  candidateLabel: string;
  definitionEntered: string;
  projString: string;
  wkt: string | null;
  metrics: Array<{ label: string; value: string }>;
  heatmaps: SheetHeatmap[];
  recommendation: string;
  recordHash: string;
  regionHash: string;
  engineVersion: string;
  samplingLine: string;
  reviewerName: string;
  reviewerEmail: string;
  signature: string;
  approvedAtUtc: string;
  roundNumber: number;
  comment: string | null;
  generatedAtUtc: string;
}

const INK = '#1f2933';
const MUTED = '#52606d';
const MARGIN = 50;

/** Renders the A4 sign-off sheet (pdfkit) and resolves with the PDF bytes. */
export function renderSheetPdf(d: SheetData): Promise<Buffer> {
  const fonts = sheetFonts();
  const t = (s: string) => (fonts.builtIn ? toWinAnsi(s) : s);
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN + 10, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: { Title: t(`Sign-off sheet: ${d.projectTitle}`), Author: 'Warpmeter', Subject: `Record ${d.recordHash}` },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const width = doc.page.width - 2 * MARGIN;

  const heading = (text: string) => {
    doc.moveDown(0.8).font(fonts.bold).fontSize(12).fillColor(INK).text(t(text));
    doc.moveDown(0.2);
  };
  const field = (label: string, value: string) => {
    doc.font(fonts.bold).fontSize(9.5).fillColor(MUTED).text(`${t(label)}: `, { continued: true });
    doc.font(fonts.regular).fillColor(INK).text(t(value));
  };
  const mono = (text: string, size = 8.5) => doc.font(fonts.mono).fontSize(size).fillColor(INK).text(t(text), { width });

  doc.font(fonts.bold).fontSize(18).fillColor(INK).text('Projection sign-off sheet');
  doc.font(fonts.regular).fontSize(10).fillColor(MUTED).text(t(`Warpmeter record of the client's approval · generated ${d.generatedAtUtc}`));

  heading('Project');
  field('Project', d.projectTitle);
  field('Client', d.clientName);
  field('Purpose', d.purposeLabel);
  field('Output scale', d.scaleBandLabel);
  field('Region', d.regionLine);

  heading('Decision');
  field('Approved candidate', d.candidateLabel);
  field('Approved by', `${d.reviewerName} <${d.reviewerEmail}>`);
  field('Signature (typed)', d.signature);
  field('Approved at', `${d.approvedAtUtc} (review round ${d.roundNumber})`);
  if (d.comment) field('Reviewer’s comment', d.comment);

  heading('Chosen definition');
  field('As entered', d.definitionEntered.length > 120 ? `${d.definitionEntered.slice(0, 117)}…` : d.definitionEntered);
  doc.font(fonts.bold).fontSize(9.5).fillColor(MUTED).text('PROJ string');
  mono(d.projString);
  doc.moveDown(0.3).font(fonts.bold).fontSize(9.5).fillColor(MUTED).text('WKT');
  mono(d.wkt ?? 'No WKT form could be written for this definition.', 7.5);

  heading('Scorecard over the region');
  const labelW = width * 0.62;
  for (const m of d.metrics) {
    const y = doc.y;
    doc.font(fonts.regular).fontSize(9).fillColor(INK).text(t(m.label), MARGIN, y, { width: labelW });
    const yEnd = doc.y;
    doc.font(fonts.mono).fontSize(9).text(t(m.value), MARGIN + labelW, y, { width: width - labelW, align: 'right' });
    doc.x = MARGIN;
    doc.y = Math.max(yEnd, doc.y) + 1;
  }

  if (d.heatmaps.length) {
    heading('Distortion over the region');
    const gap = 10;
    const size = Math.min(160, (width - gap * (d.heatmaps.length - 1)) / d.heatmaps.length);
    if (doc.y + size + 50 > doc.page.height - MARGIN) doc.addPage();
    const top = doc.y;
    d.heatmaps.forEach((h, i) => {
      const x = MARGIN + i * (size + gap);
      doc.rect(x, top, size, size).lineWidth(0.5).strokeColor('#cbd2d9').stroke();
      doc.image(h.png, x, top, { fit: [size, size], align: 'center', valign: 'center' });
      if (h.stops?.length) {
        const bar = doc.linearGradient(x, 0, x + size, 0);
        for (const st of h.stops) bar.stop(st.t, st.color);
        doc.rect(x, top + size + 3, size, 5).fill(bar);
      }
      doc.font(fonts.bold).fontSize(8.5).fillColor(INK).text(t(h.title), x, top + size + 11, { width: size });
      doc.font(fonts.regular).fontSize(7.5).fillColor(MUTED).text(t(h.legend), x, doc.y, { width: size });
    });
    doc.x = MARGIN;
    doc.y = top + size + 52;
  }

  heading('Recommendation sent with the shortlist');
  for (const block of parseRecommendation(d.recommendation)) {
    doc.font(fonts.regular).fontSize(9.5).fillColor(INK);
    if (block.kind === 'paragraph') doc.text(t(block.text), { width });
    else doc.list(block.items.map(t), { bulletRadius: 1.6, textIndent: 10, bulletIndent: 4, width });
    doc.moveDown(0.3);
  }

  heading('Record');
  doc.font(fonts.bold).fontSize(9.5).fillColor(MUTED).text('Record SHA-256');
  mono(d.recordHash, 9);
  doc.font(fonts.bold).fontSize(9.5).fillColor(MUTED).text('Region geometry SHA-256');
  mono(d.regionHash, 9);
  field('Engine version', d.engineVersion);
  field('Sampling', d.samplingLine);
  doc.font(fonts.regular).fontSize(8.5).fillColor(MUTED).text(
    'Anyone holding the record can re-run the audit from its stored inputs and compare the hash; Warpmeter’s verify action does exactly that.',
    { width },
  );

  heading('Cautions');
  doc.font(fonts.regular).fontSize(9).fillColor(INK).list(SHEET_CAUTIONS.map(t), { bulletRadius: 1.6, textIndent: 10, bulletIndent: 4, width });

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font(fonts.regular).fontSize(7.5).fillColor(MUTED).text(
      t(`Sign-off record ${d.recordHash.slice(0, 16)}… · page ${i + 1} of ${range.count}`),
      MARGIN, doc.page.height - MARGIN + 12, { width, align: 'center', lineBreak: false },
    );
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}
