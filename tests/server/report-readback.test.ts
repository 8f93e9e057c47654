/**
 * Report read-back on generated PDFs with known numbers: the text comes back page by page
 * (pdfjs-dist), an agreeing report gives no findings, a disagreeing one lists each difference
 * with its page, an unreadable one is stored with a finding, and an explanation is recorded.
 */
import { PDFDocument, PDFHexString, PDFName } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EvidenceList } from '../../constants/schemas/evidence';
import { auditLog } from '../../db/schema';
import { makePdf } from '../../seeds/documents';
import { compareReport, extractPdfText, type FilingNumbers } from '../../server/services/report-readback';
import { EVIDENCE_DEVICE } from './support/evidence-filing';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

// V8's own, taken before any PDF is read in this file.
const NATIVE = { parse: JSON.parse, stringify: JSON.stringify, push: Array.prototype.push };

// The numbers of EVIDENCE_DEVICE: Band 12 tune-up 24 dBm; hotspot 10 mm, body-worn 5 mm.
const NUMBERS: FilingNumbers = {
  model: 'KH2-LTE',
  tuneUps: [{ transmitterId: 'LTE-B12', band: 'Band 12', tuneUpPowerDbm: 24 }],
  separations: [
    { kind: 'hotspot', separationMm: 10 },
    { kind: 'body-worn', separationMm: 5 },
  ],
  highestReportedSar: [{ kind: 'body-worn', sarWPerKg: 1.19 }],
};

const cover = ['SAR test report for model KH2-LTE', 'Applicant: Halden Ridge Instruments'];
const agreeing = [
  cover,
  ['Conducted power', 'LTE Band 12 maximum tune-up power: 24.0 dBm'],
  ['Test positions', 'Body-worn separation distance: 5 mm', 'Hotspot separation distance: 10 mm'],
  ['Results', 'Highest reported SAR body-worn 1.19 W/kg (1 g)', 'Reported SAR body-worn, channel 23060: 0.98 W/kg'],
];
const disagreeing = [
  cover,
  ['Conducted power', 'LTE Band 12 maximum tune-up power: 23.5 dBm'],
  ['Test positions', 'Body-worn separation distance: 10 mm', 'Hotspot separation distance: 10 mm'],
  ...Array.from({ length: 10 }, (_, i) => [`Plot ${i + 1}`]),
  ['Results', 'Highest reported SAR body-worn 1.12 W/kg (1 g)'],
];

describe('PDF text', () => {
  it('comes back page by page, one line per baseline', async () => {
    const text = await extractPdfText(await makePdf(agreeing));
    expect(text.status).toBe('read');
    expect(text.pages).toHaveLength(4);
    expect(text.pages[1].split('\n')).toEqual(['Conducted power', 'LTE Band 12 maximum tune-up power: 24.0 dBm']);
  });

  it('is read in a worker thread, so pdfjs leaves the server’s globals alone', async () => {
    const text = await extractPdfText(await makePdf(agreeing));
    expect(text.pages).toHaveLength(4);
    // The legacy pdfjs build installs core-js polyfills (slow JSON and push) and globals wherever it is loaded.
    expect(JSON.parse).toBe(NATIVE.parse);
    expect(JSON.stringify).toBe(NATIVE.stringify);
    expect(Array.prototype.push).toBe(NATIVE.push);
    expect('pdfjsLib' in globalThis).toBe(false);
    expect('pdfjsWorker' in globalThis).toBe(false);
  });

  it('of a damaged file is unreadable, with why', async () => {
    const text = await extractPdfText(new Uint8Array(Buffer.from('%PDF-1.7\n1 0 obj << /Type /Catalog >>\ngarbage without xref')));
    expect(text).toMatchObject({ status: 'unreadable', reason: expect.stringMatching(/could not be read/) });
  });

  it('of a password-protected file is unreadable and says it is encrypted', async () => {
    const text = await extractPdfText(await encryptedPdf());
    expect(text).toMatchObject({ status: 'unreadable', reason: expect.stringMatching(/encrypted/) });
  });
});

describe('comparing a report with the filing', () => {
  it('finds nothing in a report that agrees', async () => {
    const text = await extractPdfText(await makePdf(agreeing));
    expect(compareReport(text.pages, NUMBERS)).toEqual([]);
  });

  it('lists each disagreement with its page', async () => {
    const text = await extractPdfText(await makePdf(disagreeing));
    const messages = compareReport(text.pages, NUMBERS).map((f) => f.message);
    expect(messages).toEqual([
      'Report page 2 gives a tune-up power of 23.5 dBm for Band 12; the filing’s is 24 dBm.',
      'Report page 14 says 1.12 W/kg for body-worn; the filing’s highest reported is 1.19 W/kg.',
      'Report page 3 gives a body-worn separation of 10 mm; the filing’s body-worn separation is 5 mm.',
    ]);
  });

  it('says when the report never names the model', () => {
    expect(compareReport(['A report about something else'], NUMBERS).map((f) => f.kind)).toEqual(['model']);
  });
});

describe('read-back through the evidence API', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
    await seedUsers(t);
  }, 60_000);
  afterAll(() => t.close());

  it('flags the disagreeing report, keeps an unreadable one with a finding, and records an explanation', async () => {
    const specialist = await signIn(t, 'specialist@fieldfile.test');
    const engineer = await signIn(t, 'engineer@fieldfile.test');
    const id = (await specialist.post('/api/filings/import').send(EVIDENCE_DEVICE)).body.filing.id;
    const upload = async (bytes: Buffer, fileName: string) => {
      const res = await engineer.post(`/api/filings/${id}/evidence`).field('category', 'test-report').attach('file', bytes, fileName);
      expect(res.status).toBe(201);
      return res.body.record.id as number;
    };
    const good = await upload(await makePdf(agreeing), 'agreeing.pdf');
    const bad = await upload(await makePdf(disagreeing), 'disagreeing.pdf');
    const locked = await upload(await encryptedPdf(), 'locked.pdf');

    let list: EvidenceList = (await engineer.get(`/api/filings/${id}/evidence`)).body;
    // No lab results exist yet, so the filing has no reported SAR to compare against.
    expect(list.findings.filter((f) => f.evidenceId === good)).toEqual([]);
    expect(list.findings.filter((f) => f.evidenceId === bad).map((f) => [f.kind, f.page])).toEqual([
      ['tune-up-power', 2],
      ['separation', 3],
    ]);
    expect(list.findings.find((f) => f.evidenceId === locked)).toMatchObject({ kind: 'unreadable', message: expect.stringMatching(/encrypted/) });

    const finding = list.findings.find((f) => f.evidenceId === bad && f.kind === 'tune-up-power')!;
    const approver = await signIn(t, 'approver@fieldfile.test');
    expect((await approver.post(`/api/filings/${id}/evidence/${bad}/findings/explain`).send({ key: finding.key, reason: 'Lab used the old table' })).status).toBe(403);
    expect((await engineer.post(`/api/filings/${id}/evidence/${bad}/findings/explain`).send({ key: finding.key, reason: '' })).status).toBe(422);
    const res = await engineer
      .post(`/api/filings/${id}/evidence/${bad}/findings/explain`)
      .send({ key: finding.key, reason: 'The report quotes the conducted target; the tune-up limit with tolerance is 24 dBm.' });
    expect(res.status).toBe(200);
    list = res.body;
    expect(list.findings.find((f) => f.key === finding.key)?.explanation).toMatchObject({ reason: expect.stringMatching(/tolerance/), by: expect.any(String) });
    const audit = t.handle.db
      .select()
      .from(auditLog)
      .all()
      .filter((a) => a.action === 'evidence.finding-explain');
    expect(audit).toHaveLength(1);
    // Three uploads, each read back by pdfjs: allow for a busy shared machine (speed is a bench matter).
  }, 120_000);
});

/** A PDF whose trailer names a standard-security encryption the empty password does not open. */
async function encryptedPdf(): Promise<Buffer> {
  const doc = await PDFDocument.load(await makePdf([['secret']]));
  const encrypt = doc.context.obj({
    Filter: PDFName.of('Standard'),
    V: 1,
    R: 2,
    Length: 40,
    P: -44,
    O: PDFHexString.of('11'.repeat(32)),
    U: PDFHexString.of('22'.repeat(32)),
  });
  doc.context.trailerInfo.Encrypt = doc.context.register(encrypt);
  doc.context.trailerInfo.ID = doc.context.obj([PDFHexString.of('33'.repeat(16)), PDFHexString.of('33'.repeat(16))]);
  return Buffer.from(await doc.save({ useObjectStreams: false }));
}
