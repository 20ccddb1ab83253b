/**
 * A protection engineer uploads COMTRADE records: a .cfg with its .dat in one request, or a 2013 .cff.
 * Expected figures: a 50 Hz sine of 325 V peak has a true RMS of 325/√2 = 229.81 V (standard calculus);
 * the scaling value = a·x + b and the ratio primary/secondary follow DOMAIN.md §8e.
 */
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { waitSettled } from '../helpers/captures';
import { cffBytes, cfgText, datBytes, type TestRecord } from '../helpers/comtradeWriter';
import { resetDatabase, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof userAgent>>;
const LIMIT = 256 * 1024;

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1', UPLOAD_LIMIT_BYTES: String(LIMIT) });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'prot@ct.example', name: 'Pat Protection', role: 'engineer' });
});
afterAll(() => app.stop());

/** 0.2 s of 50 Hz at 4000 S/s: 325 V peak on a VT secondary (ratio 11000:110), a CT current, a trip contact that closes at sample 300. */
function feeder(ft: TestRecord['ft'], n = 800): TestRecord {
  return {
    station: 'North Yard 11kV',
    device: 'Feeder relay 3',
    analog: [
      { id: 'VA', phase: 'A', circuit: 'Feeder 3', unit: 'V', a: 0.0325, b: 0, primary: 11000, secondary: 110, ps: 'S' },
      { id: 'IA', phase: 'A', circuit: 'Feeder 3', unit: 'A', a: 0.01, b: 0, primary: 400, secondary: 5, ps: 'P' },
    ],
    digital: [{ id: 'TRIP' }],
    rates: [[4000, n]],
    start: '02/06/2025,08:15:00.000000',
    trigger: '02/06/2025,08:15:00.050000',
    ft,
    raw: Array.from({ length: n }, (_, i) => [Math.round(1e4 * Math.sin((2 * Math.PI * 50 * i) / 4000)), Math.round(2000 * Math.sin((2 * Math.PI * 50 * i) / 4000 - 0.3))]),
    states: Array.from({ length: n }, (_, i) => [i >= 300 ? 1 : 0]),
  };
}

const upload = (name: string, rec: TestRecord, fields: Record<string, string> = {}) => {
  let req = eng.post('/api/captures').attach('file', Buffer.from(cfgText(rec)), `${name}.cfg`).attach('data', Buffer.from(datBytes(rec)), `${name}.dat`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req;
};

describe('a .cfg and its .dat in one upload', () => {
  let id: number;

  it('is accepted, read, and analysed with values on the primary side', async () => {
    const res = await upload('north-yard', feeder('BINARY'));
    expect(res.status).toBe(202);
    id = res.body.id;
    const c = await waitSettled(eng, id);
    expect(c.status).toBe('ready');
    expect(c).toMatchObject({ format: 'comtrade', originalName: 'north-yard.cfg', dataName: 'north-yard.dat', sampleRate: 4000, sampleCount: 800 });
    expect(c.channels.map((ch: { name: string; unit: string }) => `${ch.name} ${ch.unit}`)).toEqual(['VA V', 'IA A']);
    const analysis = (await eng.get(`/api/captures/${id}/analysis`)).body.channels;
    // 325 V peak secondary × 11000/110 = 32.5 kV peak primary; RMS 32500/√2 = 22 981 V.
    expect(analysis[0].rms).toBeCloseTo(32500 / Math.SQRT2, -1);
    expect(analysis[0].frequency).toBeCloseTo(50, 2);
  });

  it('shows station, device, edition and the channels in the file details', async () => {
    const c = (await eng.get(`/api/captures/${id}`)).body;
    const meta = Object.fromEntries(c.metadata.map((m: { key: string; value: string; line: number }) => [m.key, m]));
    expect(meta.Station).toEqual({ key: 'Station', value: 'North Yard 11kV', line: 1 });
    expect(meta['Recording device'].value).toBe('Feeder relay 3');
    expect(meta.Format.value).toBe('COMTRADE, IEEE C37.111-1999 (.cfg and .dat)');
    expect(meta['Analog A1 VA']).toMatchObject({ line: 3 });
    expect(meta['Analog A1 VA'].value).toMatch(/value = 0\.0325·x \+ 0 \(secondary\).*ratio 11000:110; shown primary/);
    expect(meta['Data file type'].value).toBe('BINARY');
    expect(c.comtrade).toMatchObject({ edition: 1999, station: 'North Yard 11kV', fileType: 'BINARY', lineFrequencyHz: 50, values: 'primary', triggerS: 0, timeSource: 'rate' });
    expect(c.t0).toBeCloseTo(-0.05, 9);
  });

  it('keeps the digital channel as state changes, and marks the trigger on the time axis', async () => {
    const c = (await eng.get(`/api/captures/${id}`)).body;
    expect(c.comtrade.digital).toEqual([{ index: 1, id: 'TRIP', phase: '', circuit: '', normalState: 0, initialState: 0, changeCount: 1, changes: [{ timeS: -0.05 + 300 / 4000, state: 1 }] }]);
    const marks = (await eng.get(`/api/captures/${id}/annotations`)).body.items;
    const trigger = marks.find((m: { label: string }) => m.label === 'Trigger');
    expect(trigger).toMatchObject({ startS: 0, endS: 0, channelIdx: null, state: 'suggested', severity: 'info' });
    expect(trigger.reason).toMatch(/02\/06\/2025,08:15:00\.050000 \(line 10 of north-yard\.cfg\)/);
  });

  it('serves both originals: the .cfg by default, the .dat as part=data', async () => {
    const rec = feeder('BINARY');
    const cfg = await eng.get(`/api/captures/${id}/original`);
    expect(cfg.status).toBe(200);
    expect(cfg.headers['content-disposition']).toMatch(/north-yard\.cfg/);
    expect(cfg.text).toBe(cfgText(rec));
    const dat = await eng.get(`/api/captures/${id}/original?part=data`).buffer(true).parse((res, cb) => {
      const parts: Buffer[] = [];
      res.on('data', (b: Buffer) => parts.push(b));
      res.on('end', () => cb(null, Buffer.concat(parts)));
    });
    expect(dat.headers['content-disposition']).toMatch(/north-yard\.dat/);
    expect(Buffer.compare(dat.body as Buffer, Buffer.from(datBytes(rec)))).toBe(0);
  });

  it('the same pair again is the existing capture', async () => {
    const res = await upload('north-yard-again', feeder('BINARY'));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id, status: 'ready', duplicate: true });
  });

  it('values on the secondary side when asked: 325 V peak, RMS 229.81 V', async () => {
    const res = await upload('north-yard-secondary', feeder('ASCII'), { comtradeValues: 'secondary' });
    const c = await waitSettled(eng, res.body.id);
    expect(c.comtrade.values).toBe('secondary');
    const analysis = (await eng.get(`/api/captures/${c.id}/analysis`)).body.channels;
    expect(analysis[0].rms).toBeCloseTo(325 / Math.SQRT2, 1);
  });

  it('a ready record switches to secondary values and back, read again each time', async () => {
    const res = await eng.post(`/api/captures/${id}/comtrade-values`).send({ values: 'secondary' });
    expect(res.status).toBe(202);
    for (let i = 0; i < 300 && (await eng.get(`/api/captures/${id}`)).body.comtrade.values !== 'secondary'; i++) await new Promise((r) => setTimeout(r, 100));
    expect((await eng.get(`/api/captures/${id}/analysis`)).body.channels[0].rms).toBeCloseTo(325 / Math.SQRT2, 1);
    await eng.post(`/api/captures/${id}/comtrade-values`).send({ values: 'primary' });
    for (let i = 0; i < 300 && (await eng.get(`/api/captures/${id}`)).body.comtrade.values !== 'primary'; i++) await new Promise((r) => setTimeout(r, 100));
    expect((await eng.get(`/api/captures/${id}/analysis`)).body.channels[0].rms).toBeCloseTo(32500 / Math.SQRT2, -1);
    // Read twice more, the trigger is still suggested once.
    const marks = (await eng.get(`/api/captures/${id}/annotations`)).body.items.filter((m: { label: string }) => m.label === 'Trigger');
    expect(marks).toHaveLength(1);
  });

  it('a CSV capture has no sides to switch', async () => {
    const csv = await eng.post('/api/captures').attach('file', Buffer.from('Time (s),CH1 (V)\n0,1\n0.001,2\n0.002,1\n'), 'plain.csv');
    await waitSettled(eng, csv.body.id);
    const res = await eng.post(`/api/captures/${csv.body.id}/comtrade-values`).send({ values: 'secondary' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_comtrade');
  });

  it('every data file type reads to the same figures', async () => {
    for (const ft of ['BINARY32', 'FLOAT32'] as const) {
      const c = await waitSettled(eng, (await upload(`north-yard-${ft}`, feeder(ft))).body.id);
      expect(c.status, JSON.stringify(c.error)).toBe('ready');
      expect((await eng.get(`/api/captures/${c.id}/analysis`)).body.channels[0].rms).toBeCloseTo(32500 / Math.SQRT2, -1);
    }
  });

  it('deleting the capture removes both kept files', async () => {
    const res = await upload('to-delete', { ...feeder('BINARY'), station: 'Another' });
    const c = await waitSettled(eng, res.body.id);
    const dir = path.join(app.ctx.config.DATA_DIR, 'originals');
    const kept = () => readdirSync(dir).filter((n) => n.startsWith(`${c.id}.`)).sort();
    // Once ready, both are compressed in the background.
    for (let i = 0; i < 100 && kept().join() !== `${c.id}.cfg.gz,${c.id}.dat.gz`; i++) await new Promise((r) => setTimeout(r, 50));
    expect(kept()).toEqual([`${c.id}.cfg.gz`, `${c.id}.dat.gz`]);
    expect((await eng.delete(`/api/captures/${c.id}`)).status).toBe(204);
    expect(readdirSync(dir).filter((n) => n.startsWith(`${c.id}.`))).toEqual([]);
  });
});

describe('a 2013 combined file', () => {
  it('is read from the one upload', async () => {
    const res = await eng.post('/api/captures').attach('file', Buffer.from(cffBytes(feeder('BINARY32'))), 'north-yard.cff');
    expect(res.status).toBe(202);
    const c = await waitSettled(eng, res.body.id);
    expect(c).toMatchObject({ status: 'ready', format: 'comtrade', dataName: null });
    expect(c.comtrade).toMatchObject({ edition: 2013, combined: true, timeCode: '0', timeQuality: 'F' });
    const original = await eng.get(`/api/captures/${c.id}/original`);
    expect(original.headers['content-disposition']).toMatch(/north-yard\.cff/);
    expect((await eng.get(`/api/captures/${c.id}/original?part=data`)).status).toBe(404);
  });
});

describe('bad pairs', () => {
  it('a .cfg without its .dat is refused at once, and nothing is kept', async () => {
    const res = await eng.post('/api/captures').attach('file', Buffer.from(cfgText(feeder('BINARY'))), 'lonely.cfg');
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({ code: 'comtrade_pair', message: 'lonely.cfg is a COMTRADE configuration: send its .dat with it, in the form field "data".' });
  });

  it('a .dat beside something that is not a .cfg is refused', async () => {
    const res = await eng.post('/api/captures').attach('file', Buffer.from('Time (s),CH1 (V)\n0,1\n'), 'scope.csv').attach('data', Buffer.from('x'), 'x.dat');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('comtrade_pair');
  });

  it('a .dat cut short fails the capture with the file and the byte offset', async () => {
    const rec = feeder('BINARY');
    const dat = datBytes(rec);
    const res = await eng.post('/api/captures').attach('file', Buffer.from(cfgText(rec)), 'cut.cfg').attach('data', Buffer.from(dat.subarray(0, dat.length - 5)), 'cut.dat');
    const c = await waitSettled(eng, res.body.id);
    expect(c.status).toBe('failed');
    expect(c.error.code).toBe('invalid_comtrade');
    expect(c.error.message).toMatch(/^cut\.dat, byte 11,186: 11,195 bytes of data, but the \.cfg declares 800 BINARY records of 14 bytes \(11,200 bytes\): record 800 is cut short\.$/);
    expect((await eng.get(`/api/captures/${c.id}/samples?channel=0`)).status).toBe(409);
  });

  it('a bad ASCII record fails the capture naming the .dat and its line', async () => {
    const rec = feeder('ASCII', 40);
    const dat = new TextDecoder().decode(datBytes(rec)).replace(/^7,(.*)$/m, '7,$1,1');
    const res = await eng.post('/api/captures').attach('file', Buffer.from(cfgText(rec)), 'bay.cfg').attach('data', Buffer.from(dat), 'bay.dat');
    const c = await waitSettled(eng, res.body.id);
    expect(c.error).toMatchObject({ code: 'invalid_comtrade', line: 7 });
    expect(c.error.message).toMatch(/^bay\.dat, line 7: expected 5 values .* but found 6\.$/);
  });

  it('each file must be within the upload limit; nothing is left behind', async () => {
    const big = Buffer.alloc(LIMIT + 1);
    const res = await eng.post('/api/captures').attach('file', Buffer.from(cfgText(feeder('BINARY'))), 'big.cfg').attach('data', big, 'big.dat');
    expect(res.status).toBe(413);
    expect(readdirSync(path.join(app.ctx.config.DATA_DIR, 'uploads'))).toEqual([]);
  });

  it('a third file field is refused', async () => {
    const res = await eng.post('/api/captures').attach('file', Buffer.from('a'), 'a.cfg').attach('data', Buffer.from('b'), 'a.dat').attach('extra', Buffer.from('c'), 'c.txt');
    expect(res.status).toBe(400);
    expect(existsSync(path.join(app.ctx.config.DATA_DIR, 'uploads'))).toBe(true);
    expect(readdirSync(path.join(app.ctx.config.DATA_DIR, 'uploads'))).toEqual([]);
  });
});
