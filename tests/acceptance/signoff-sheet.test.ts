import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SHEET_CAUTIONS } from '../../server/signoff/cautions.js';
import { engineScore, SEED_CANDIDATES, seedAuditedProject } from '../support/signoff-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

type TestApp = Awaited<ReturnType<typeof createTestApp>>;
let t: TestApp;
let s: StudioFixture;
let other: StudioFixture;
let signOff: { id: number; recordHash: string };
let chosen: (typeof SEED_CANDIDATES)[number];

/** Writes the PDF to a temp file for Debian's poppler-utils (pdftotext, pdfimages). */
function tempPdf(pdf: Buffer): string {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'wm-signoff-')), 'sheet.pdf');
  fs.writeFileSync(file, pdf);
  return file;
}

const binary = (res: NodeJS.ReadableStream & { setEncoding(e: string): void }, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

beforeAll(async () => {
  t = await createTestApp();
  [s, other] = await Promise.all([createStudioWithRoles(t), createStudioWithRoles(t)]);
  const p = await seedAuditedProject(t.deps, s, { title: 'Sheet atlas', score: engineScore, samples: 2000 });
  const round = await s.editor.post(`/api/projects/${p.projectId}/rounds`, {
    auditId: p.auditId, candidateIds: p.candidateIds.slice(0, 2), recommendation: 'Albers keeps areas true.\n\n- best area spread', reviewerEmails: [s.users.client.email],
  });
  expect(round.status).toBe(201);
  const approved = await s.client.post(`/api/rounds/${round.body.id}/approve`, { candidateId: p.candidateIds[0], signature: s.users.client.name, comment: 'Approved for print.' });
  expect(approved.status).toBe(201);
  signOff = approved.body;
  chosen = SEED_CANDIDATES[0];
});
afterAll(async () => t?.close());

describe('sign-off sheet (PDF)', () => {
  it('is a PDF whose text holds the record hash, the definition, the approver and every caution', async () => {
    const res = await s.editor.get(`/api/signoffs/${signOff.id}/sheet.pdf`).buffer(true).parse(binary as never);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const file = tempPdf(res.body as Buffer);
    const text = execFileSync('pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(text).toContain(signOff.recordHash);
    expect(text).toContain(chosen.resolved);
    expect(text).toMatch(/PROJCS\["Albers/);
    expect(text).toContain(s.users.client.name);
    expect(text).toContain('Approved for print.');
    expect(text).toContain('Sheet atlas');
    expect(text).toContain('best area spread');
    for (const caution of SHEET_CAUTIONS) expect(text).toContain(caution);
    // The three heatmaps are embedded as images (pdfimages lists one row per image after two header lines).
    const images = execFileSync('pdfimages', ['-list', file], { encoding: 'utf8' }).trim().split('\n').slice(2);
    expect(images.length).toBeGreaterThanOrEqual(3);
  });

  it('is there for the reviewer too, and for nobody outside the studio', async () => {
    const res = await s.client.get(`/api/signoffs/${signOff.id}/sheet.pdf`).buffer(true).parse(binary as never);
    expect(res.status).toBe(200);
    expect((res.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect((await other.editor.get(`/api/signoffs/${signOff.id}/sheet.pdf`)).status).toBe(404);
    expect((await (await s.anonymous()).get(`/api/signoffs/${signOff.id}/sheet.pdf`)).status).toBe(401);
  });
});
