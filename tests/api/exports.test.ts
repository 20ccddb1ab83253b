/**
 * CSV and JSON exports, read back with csv-parse as a spreadsheet would: an engineer exports figures,
 * harmonics and a span of samples, with a decimal point and with a decimal comma. The capture is an
 * invented two-channel record whose channel names look like spreadsheet formulas, to show they are
 * neutralised. Expected values: a sine's RMS is its peak over √2 (standard calculus); the samples are the
 * file's values to the 7 digits Float32 storage keeps.
 */
import { parse } from 'csv-parse/sync';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { FiguresExport, HarmonicsExport, SamplesExport } from '../../shared/schemas/export';
import { uploadText, waitSettled } from '../helpers/captures';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let viewer: Awaited<ReturnType<typeof signedIn>>;
let id: number;
let failedId: number;
const FS = 10_000;

/** 0.2 s at 10 kS/s: 325 V-peak and 10 A-peak 50 Hz sines, the current with a DC part of −0.5 A. */
function formulaNamedCsv(): string {
  const lines = ['Time (s),=SUM(A1) (V),@cmd (A)'];
  for (let i = 0; i < FS * 0.2; i++) {
    const t = i / FS;
    lines.push(`${t.toFixed(4)},${(325 * Math.sin(2 * Math.PI * 50 * t)).toFixed(4)},${(10 * Math.sin(2 * Math.PI * 50 * t - 0.5) - 0.5).toFixed(5)}`);
  }
  return lines.join('\n') + '\n';
}

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1', EXPORT_MAX_SAMPLES: '1500' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'eng@exports.example', name: 'Eve Engineer', role: 'engineer' });
  viewer = await userAgent(app, { email: 'viewer@exports.example', name: 'Val Viewer', role: 'viewer' });
  id = (await uploadText(eng, 'formula-names.csv', formulaNamedCsv(), { name: 'Bench supply' })).body.id;
  failedId = (await uploadText(eng, 'empty.csv', '')).body.id;
  await waitSettled(eng, id);
  await waitSettled(eng, failedId);
});
afterAll(() => app.stop());

describe('figures.csv and figures.json', () => {
  it('one row per quantity, one column per channel, units in the header, formula-like names neutralised', async () => {
    const res = await eng.get(`/api/captures/${id}/figures.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toMatch(/Bench-supply-figures\.csv/);
    const rows = parse(res.text) as string[][];
    expect(rows[0]).toEqual(['Quantity', "'=SUM(A1) (V)", "'@cmd (A)"]);
    const rms = rows.find((r) => r[0] === 'True RMS (AC+DC)')!;
    expect(Number(rms[1])).toBeCloseTo(325 / Math.SQRT2, 2);
    const mean = rows.find((r) => r[0] === 'DC mean')!;
    expect(mean[2]).toMatch(/^-0\.5/); // a negative number stays a number, not neutralised
    expect(Number(mean[2])).toBeCloseTo(-0.5, 3);
    expect(rows.find((r) => r[0] === 'Frequency (Hz)')).toBeDefined();
    expect(rows.find((r) => r[0] === 'Average-responding meter error (%)')).toBeDefined();
  });

  it('with ?decimal=comma: a BOM, semicolons and decimal commas that read back as the same numbers', async () => {
    const point = parse((await eng.get(`/api/captures/${id}/figures.csv`)).text) as string[][];
    const res = await eng.get(`/api/captures/${id}/figures.csv?decimal=comma`).buffer(true);
    expect(res.text.charCodeAt(0)).toBe(0xfeff);
    const rows = parse(res.text, { delimiter: ';', bom: true }) as string[][];
    expect(rows[0][1]).toBe("'=SUM(A1) (V)");
    rows.slice(1).forEach((r, k) => {
      expect(r[0]).toBe(point[k + 1][0]);
      for (const c of [1, 2]) expect(r[c].replace(',', '.')).toBe(point[k + 1][c]);
    });
  });

  it('figures.json carries the same values by key', async () => {
    const body = FiguresExport.parse((await eng.get(`/api/captures/${id}/figures.json`)).body);
    expect(body.channels[0].values.rms).toBeCloseTo(325 / Math.SQRT2, 2);
    expect(body.quantities.find((q) => q.key === 'thdF')?.unit).toBe('%');
  });
});

describe('harmonics.csv and harmonics.json', () => {
  it('one row per order, each channel with frequency, RMS, % of the fundamental, phase and IEC groups', async () => {
    const rows = parse((await viewer.get(`/api/captures/${id}/harmonics.csv`)).text) as string[][];
    expect(rows[0].slice(0, 5)).toEqual(['Order', "'=SUM(A1) frequency (Hz)", "'=SUM(A1) RMS (V)", "'=SUM(A1) % of fundamental", "'=SUM(A1) phase (°)"]);
    expect(rows[0]).toContain("'@cmd IEC group (A)");
    expect(rows).toHaveLength(51);
    expect(Number(rows[1][3])).toBe(100);
    const json = HarmonicsExport.parse((await viewer.get(`/api/captures/${id}/harmonics.json`)).body);
    expect(json.channels[1].harmonics[0].rms).toBeCloseTo(10 / Math.SQRT2, 3);
  });
});

describe('samples.csv and samples.json', () => {
  it('streams a span in engineering units: time in seconds, a column per channel', async () => {
    const res = await eng.get(`/api/captures/${id}/samples.csv?fromS=0.01&toS=0.02`);
    expect(res.status).toBe(200);
    const rows = parse(res.text) as string[][];
    expect(rows[0]).toEqual(['Time (s)', "'=SUM(A1) (V)", "'@cmd (A)"]);
    expect(rows).toHaveLength(1 + 101); // 0.01 s to 0.02 s inclusive at 10 kS/s
    expect(Number(rows[1][0])).toBeCloseTo(0.01, 9);
    expect(Number(rows[101][0])).toBeCloseTo(0.02, 9);
    const t = 0.0125;
    expect(Number(rows[26][1])).toBeCloseTo(Number((325 * Math.sin(2 * Math.PI * 50 * t)).toFixed(4)), 3);
  });

  it('the comma variant and samples.json hold the same values', async () => {
    const point = parse((await eng.get(`/api/captures/${id}/samples.csv?fromS=0&toS=0.005`)).text) as string[][];
    const comma = parse((await eng.get(`/api/captures/${id}/samples.csv?fromS=0&toS=0.005&decimal=comma`)).text, { delimiter: ';', bom: true }) as string[][];
    expect(comma.map((r) => r.map((c) => c.replace(',', '.')))).toEqual(point);
    const json = SamplesExport.parse(JSON.parse((await eng.get(`/api/captures/${id}/samples.json?fromS=0&toS=0.005`).buffer(true)).text));
    expect(json.sampleCount).toBe(51);
    expect(json.channels[1].values.map(String)).toEqual(point.slice(1).map((r) => r[2]));
  });

  it('refuses a span over EXPORT_MAX_SAMPLES, naming the limit, and an empty or reversed span', async () => {
    const whole = await eng.get(`/api/captures/${id}/samples.csv`);
    expect(whole.status).toBe(400);
    expect(whole.body.error.code).toBe('span_too_long');
    expect(whole.body.error.message).toMatch(/2,000 samples per channel.*at most 1,500 \(EXPORT_MAX_SAMPLES\)/);
    expect((await eng.get(`/api/captures/${id}/samples.json?fromS=0&toS=0.1499`)).status).toBe(200);
    expect((await eng.get(`/api/captures/${id}/samples.csv?fromS=5&toS=6`)).body.error.code).toBe('empty_span');
    expect((await eng.get(`/api/captures/${id}/samples.csv?fromS=0.02&toS=0.01`)).status).toBe(400);
  });
});

describe('who may export', () => {
  it('every signed-in role; no one without a session; 404 unknown, 409 not ready, 400 a bad dialect', async () => {
    expect((await viewer.get(`/api/captures/${id}/figures.csv`)).status).toBe(200);
    expect((await supertest(app.server).get(`/api/captures/${id}/figures.csv`)).status).toBe(401);
    expect((await eng.get('/api/captures/999999/harmonics.json')).status).toBe(404);
    expect((await eng.get(`/api/captures/${failedId}/samples.csv?fromS=0&toS=0.01`)).status).toBe(409);
    expect((await eng.get(`/api/captures/${id}/figures.csv?decimal=semicolon`)).status).toBe(400);
  });
});
