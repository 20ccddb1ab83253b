/**
 * Properties of the COMTRADE reader: any record the test writer lays out, in every data file type and
 * as a pair or a combined file, reads back to its values; and any bytes at all end in a record or a
 * ComtradeError, never another exception or a hang.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ComtradeError, readCff, readComtrade, type DataFileType } from '../../../shared/comtrade';
import { cffBytes, cfgText, datBytes, type TestRecord } from '../../helpers/comtradeWriter';

const RAW_RANGE: Record<DataFileType, [number, number]> = { ASCII: [-99998, 99998], BINARY: [-32767, 32767], BINARY32: [-2147483647, 2147483647], FLOAT32: [-1e6, 1e6] };

const record = fc
  .record({
    ft: fc.constantFrom<DataFileType>('ASCII', 'BINARY', 'BINARY32', 'FLOAT32'),
    rev: fc.constantFrom<1999 | 2013>(1999, 2013),
    analog: fc.array(fc.record({ a: fc.double({ min: -10, max: 10, noNaN: true }), b: fc.double({ min: -5, max: 5, noNaN: true }), ps: fc.constantFrom<'P' | 'S'>('P', 'S'), primary: fc.integer({ min: 1, max: 500_000 }), secondary: fc.integer({ min: 1, max: 100 }) }), { minLength: 1, maxLength: 4 }),
    digital: fc.integer({ min: 0, max: 20 }),
    records: fc.integer({ min: 2, max: 50 }),
    rate: fc.constantFrom(600, 1200, 4000, 10_000),
    side: fc.constantFrom<'primary' | 'secondary'>('primary', 'secondary'),
    seed: fc.integer(),
  })
  .chain((s) =>
    fc.record({
      s: fc.constant(s),
      raw: fc.array(fc.array(fc.option(fc.integer({ min: RAW_RANGE[s.ft][0], max: RAW_RANGE[s.ft][1] }), { freq: 12 }), { minLength: s.analog.length, maxLength: s.analog.length }), { minLength: s.records, maxLength: s.records }),
      states: fc.array(fc.array(fc.constantFrom<0 | 1>(0, 1), { minLength: s.digital, maxLength: s.digital }), { minLength: s.records, maxLength: s.records }),
      cuts: fc.array(fc.nat(), { maxLength: 4 }),
    }),
  );

function chunks(b: Uint8Array, cuts: number[]): Uint8Array[] {
  const at = [...new Set(cuts.map((c) => c % (b.length + 1)))].sort((x, y) => x - y);
  return [0, ...at].map((from, i) => b.subarray(from, i < at.length ? at[i] : b.length));
}

describe('round trip', () => {
  it('a record in any data file type, as .cfg + .dat or .cff, reads back to a·x + b on the side asked for', () => {
    fc.assert(
      fc.property(record, fc.boolean(), ({ s, raw, states, cuts }, combined) => {
        const rec: TestRecord = {
          rev: s.rev,
          ft: s.ft,
          analog: s.analog.map((a, i) => ({ id: `A${i}`, unit: 'V', ...a })),
          digital: Array.from({ length: s.digital }, (_, i) => ({ id: `D${i}` })),
          rates: [[s.rate, s.records]],
          raw,
          states,
        };
        const options = { configName: combined ? 'r.cff' : 'r.cfg', values: s.side };
        const bytes = combined ? cffBytes(rec) : datBytes(rec);
        const r = combined ? readCff(chunks(bytes, cuts), bytes.length, options) : readComtrade(new TextEncoder().encode(cfgText(rec)), chunks(bytes, cuts), bytes.length, options);
        expect(r.timeBase.sampleRate).toBe(s.rate);
        s.analog.forEach((a, c) => {
          const k = a.ps === 'P' ? (s.side === 'primary' ? 1 : a.secondary / a.primary) : s.side === 'primary' ? a.primary / a.secondary : 1;
          raw.forEach((row, i) => {
            const got = r.channels[c].samples[i];
            if (row[c] === null) return expect(got).toBeNaN();
            const want = (row[c]! * a.a + a.b) * k;
            expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(want)));
          });
          expect(r.channels[c].invalidCount).toBe(raw.filter((row) => row[c] === null).length);
        });
        r.digital.forEach((d, ch) => {
          const expected = states.flatMap((row, i) => (i > 0 && row[ch] !== states[i - 1][ch] ? [[i, row[ch]]] : []));
          expect(d.initialState).toBe(states[0][ch]);
          expect(d.changes.map((x) => [x.sample, x.state])).toEqual(expected);
        });
      }),
      { numRuns: 300 },
    );
  });
});

function readsOrRefuses(run: () => unknown) {
  try {
    run();
  } catch (e) {
    if (!(e instanceof ComtradeError)) throw e;
    expect(e.message.length).toBeLessThanOrEqual(500);
  }
}

describe('anything at all', () => {
  it('arbitrary bytes as a .cfg and a .dat: a record or a ComtradeError', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 600 }), fc.uint8Array({ maxLength: 600 }), (cfg, dat) => readsOrRefuses(() => readComtrade(cfg, [dat], dat.length, { configName: 'x.cfg' }))), { numRuns: 400 });
  });

  it('arbitrary bytes as a .cff: a record or a ComtradeError', () => {
    const cff = fc.uint8Array({ maxLength: 800 }).map((b) => new Uint8Array([...new TextEncoder().encode('--- file type: CFG ---\r\n'), ...b]));
    fc.assert(fc.property(cff, (b) => readsOrRefuses(() => readCff([b], b.length, { configName: 'x.cff' }))), { numRuns: 400 });
  });

  it('a valid record with bytes changed or cut: a record or a ComtradeError', () => {
    const base: TestRecord = { ft: 'ASCII', analog: [{ id: 'VA', unit: 'V', a: 1, b: 0 }], digital: [{ id: 'T' }], rates: [[1000, 8]], raw: Array.from({ length: 8 }, (_, i) => [i * 10]), states: Array.from({ length: 8 }, (_, i) => [(i > 4 ? 1 : 0) as 0 | 1]) };
    const edit = fc.record({ ft: fc.constantFrom<DataFileType>('ASCII', 'BINARY', 'BINARY32', 'FLOAT32'), at: fc.nat(), byte: fc.integer({ min: 0, max: 255 }), cut: fc.nat(), inCfg: fc.boolean() });
    fc.assert(
      fc.property(edit, ({ ft, at, byte, cut, inCfg }) => {
        const cfg = new TextEncoder().encode(cfgText({ ...base, ft }));
        const dat = datBytes({ ...base, ft });
        const target = inCfg ? cfg : dat;
        target[at % target.length] = byte;
        const d = inCfg ? dat : dat.subarray(0, dat.length - (cut % 3));
        readsOrRefuses(() => readComtrade(cfg, [d], d.length, { configName: 'x.cfg' }));
      }),
      { numRuns: 600 },
    );
  });
});
