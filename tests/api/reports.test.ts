/**
 * PDF reports, read back as text with poppler's pdftotext: an engineer downloads a capture's report with
 * their own title and summary, a viewer the plain one, a client through a share link. Expected values:
 * the invented square-wave fixture of ±230 V reads 230.0 V true RMS (|x| = 230 V throughout; standard
 * calculus) and an averaging meter reads it +11.07 % high (domain notes §1b, computed with numpy).
 */
import { readFileSync } from 'node:fs';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { uploadText, waitSettled } from '../helpers/captures';
import { binary, pdfPagePng, pdfPages, pdfText } from '../helpers/pdf';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let viewer: Awaited<ReturnType<typeof signedIn>>;
let squareId: number;
let rectifierId: number;
let failedId: number;
const anon = () => supertest(app.server);
const pdf = (req: supertest.Test) => req.buffer(true).parse(binary);

/** The rectifier fixture behind two header lines of an invented instrument. */
const withPreamble = (csv: string) => `Instrument,Harbour bench scope HS-4 (invented)\nProbe,100:1 differential\n\n${csv}`;

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'wren@reports.example', name: 'Wren Okafor', role: 'engineer' });
  viewer = await userAgent(app, { email: 'viewer@reports.example', name: 'Vic Viewer', role: 'viewer' });
  squareId = (await uploadText(eng, 'inverter-square-wave.csv', readFileSync('fixtures/waveforms/inverter-square-wave.csv'), { name: 'Emergency lighting inverter' })).body.id;
  rectifierId = (await uploadText(eng, 'rectifier-current.csv', withPreamble(readFileSync('fixtures/waveforms/rectifier-current.csv', 'utf8')))).body.id;
  failedId = (await uploadText(eng, 'empty.csv', '')).body.id;
  for (const id of [squareId, rectifierId, failedId]) await waitSettled(eng, id);
  await eng.post(`/api/captures/${rectifierId}/annotations`).send({ startS: 0.02, endS: 0.03, label: 'Current pulse', note: 'Narrow pulse at the voltage crest: capacitor charging.', severity: 'warning' });
  await eng.post(`/api/captures/${rectifierId}/limit-checks`).send({ standard: 'iec61000-3-2', class: 'A', channel: 1 });
});
afterAll(() => app.stop());

describe('capture reports', () => {
  it('an engineer downloads the report: figures, meters, marks, checks, power and the cautions are text in it', async () => {
    const res = await pdf(eng.get(`/api/captures/${rectifierId}/report.pdf`));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?rectifier-current-report\.pdf"?$/);
    const text = pdfText(res.body);
    const analysis = (await eng.get(`/api/captures/${rectifierId}/analysis`)).body.channels;
    expect(text).toContain('Capture report');
    expect(text).toContain('Harbour bench scope HS-4 (invented)');
    expect(text).toContain('Prepared by');
    expect(text).toContain('Wren Okafor');
    expect(text).toContain('True RMS (AC+DC)');
    // The report prints the stored figure as the figures table does: 4 significant digits with an SI prefix.
    const { formatSI } = await import('../../shared/units');
    expect(text).toContain(formatSI(analysis[1].rms, 'A'));
    expect(text).toContain('Narrow pulse at the voltage crest');
    expect(text).toMatch(/IEC 61000-3-2 Class A/);
    expect(text).toContain('Indicative only');
    expect(text).toContain('Active power P');
    expect(text).toMatch(/qualified\s+persons/);
    expect(text).toMatch(/measurement\s+category/);
    expect(text).toMatch(/local codes/);
    const pages = pdfPages(res.body);
    expect(pages).toBeGreaterThan(2);
    expect(pages).toBeLessThanOrEqual(41);
    pdfPagePng(res.body, 'capture-report', 1);
    pdfPagePng(res.body, 'capture-report', 2);
  });

  it('carries the meter error and its one-sentence explanation', async () => {
    const text = pdfText((await pdf(eng.get(`/api/captures/${squareId}/report.pdf`))).body);
    expect(text).toContain('230.0 V');
    expect(text).toContain('+11.07 %');
    expect(text).toMatch(/form factor/);
    expect(text).toContain('No limit checks were kept with this capture.');
  });

  it('takes a title, a summary, a name and a company by POST, and bounds them', async () => {
    const options = { title: 'Harbourside pumping station: supply survey', summary: 'The control cabinet draws narrow current pulses.', preparedBy: 'W. Okafor', company: 'Tidewater Commissioning Ltd (invented)' };
    const res = await pdf(eng.post(`/api/captures/${rectifierId}/report.pdf`).send(options));
    expect(res.status).toBe(200);
    const text = pdfText(res.body);
    for (const v of Object.values(options)) expect(text).toContain(v);
    expect((await eng.post(`/api/captures/${rectifierId}/report.pdf`).send({ title: 'x'.repeat(201) })).status).toBe(400);
    expect((await eng.post(`/api/captures/${rectifierId}/report.pdf`).send({ summary: 'x'.repeat(4001) })).status).toBe(400);
  });

  it('viewers may download reports; strangers may not; unknown and unready captures are refused', async () => {
    expect((await pdf(viewer.get(`/api/captures/${squareId}/report.pdf`))).status).toBe(200);
    expect((await anon().get(`/api/captures/${squareId}/report.pdf`)).status).toBe(401);
    expect((await eng.get('/api/captures/999999/report.pdf')).status).toBe(404);
    const failed = await eng.get(`/api/captures/${failedId}/report.pdf`);
    expect(failed.status).toBe(409);
    expect(failed.body.error.code).toBe('not_ready');
  });
});

describe('comparison reports', () => {
  let comparisonId: number;
  it('a saved comparison downloads with the overlay and the side-by-side table with differences', async () => {
    comparisonId = (await eng.post('/api/comparisons').send({ name: 'Square against the rectifier supply', captureIds: [squareId, rectifierId] })).body.id;
    const res = await pdf(viewer.get(`/api/comparisons/${comparisonId}/report.pdf`));
    expect(res.status).toBe(200);
    const text = pdfText(res.body);
    expect(text).toContain('Comparison report');
    expect(text).toContain('Square against the rectifier supply');
    expect(text).toContain('Overlay');
    expect(text).toContain('Side by side');
    expect(text).toContain('Emergency lighting inverter');
    expect(text).toMatch(/\(-?\+?[\d.]+ %\)/);
    expect(text).toMatch(/qualified\s+persons/);
    pdfPagePng(res.body, 'comparison-report', 1);
  });
  it('an unknown comparison is 404', async () => {
    expect((await eng.get('/api/comparisons/999999/report.pdf')).status).toBe(404);
  });

  it('opens read-only through a share link: the comparison, each of its captures, nothing else', async () => {
    const { token } = (await eng.post(`/api/comparisons/${comparisonId}/shares`).send({})).body;
    const whole = await pdf(anon().get(`/api/shared/${token}/report.pdf`));
    expect(whole.status).toBe(200);
    expect(pdfText(whole.body)).toMatch(/read-only link shared by\s+Wren Okafor/);
    expect((await pdf(anon().get(`/api/shared/${token}/captures/${rectifierId}/report.pdf`))).status).toBe(200);
    expect((await anon().get(`/api/shared/${token}/captures/${failedId}/report.pdf`)).status).toBe(404);
    expect((await anon().post(`/api/shared/${token}/report.pdf`).send({ title: 'mine' })).status).toBe(405);
  });
});
