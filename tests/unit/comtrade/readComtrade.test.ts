/**
 * Reading hand-written records (handRecords.ts): values on both sides of the transformers, missing
 * values, digital changes, the trigger on the time axis, and the time base from rates or time stamps.
 * Expected values are worked out by hand from the scaling of DOMAIN.md §8e (value = a·x + b; ratio =
 * primary/secondary) beside each record.
 */
import { describe, expect, it } from 'vitest';
import { describeRecord, readCff, readComtrade } from '../../../shared/comtrade';
import { EASTFIELD_CFG, EASTFIELD_DAT, EASTFIELD_PRIMARY, EASTFIELD_SECONDARY, WESTGATE_CFG_LINES, westgateDat } from './handRecords';

const bytes = (s: string) => new TextEncoder().encode(s);
const read = (cfg: string, dat: Uint8Array, values?: 'primary' | 'secondary') => readComtrade(bytes(cfg), [dat], dat.length, { configName: 'record.cfg', dataName: 'record.dat', values });
const close = (actual: Float64Array, expected: number[]) => expected.forEach((v, i) => (Number.isNaN(v) ? expect(actual[i]).toBeNaN() : expect(actual[i]).toBeCloseTo(v, 12)));

describe('readComtrade', () => {
  it('1999 ASCII: primary values by default, with missing values as NaN and counted', () => {
    const r = read(EASTFIELD_CFG, bytes(EASTFIELD_DAT));
    expect(r.channels.map((c) => [c.name, c.unit])).toEqual([['VA', 'kV'], ['IA', 'A']]);
    close(r.channels[0].samples, EASTFIELD_PRIMARY.VA);
    close(r.channels[1].samples, EASTFIELD_PRIMARY.IA);
    expect(r.channels.map((c) => [c.invalidCount, c.firstInvalidLine])).toEqual([[1, 3], [1, 4]]);
    expect(r.config).toMatchObject({ station: 'Eastfield 132kV', device: 'Bay 4 relay', revYear: 1999, lineFrequencyHz: 50, fileType: 'ASCII', timeMultiplier: 1 });
    expect(r.config.analog[1]).toMatchObject({ phase: 'A', circuit: 'Line 4', skewUs: 12.5, min: -32767, max: 32767, primary: 600, secondary: 1, ps: 'P' });
  });

  it('1999 ASCII: secondary values when asked', () => {
    const r = read(EASTFIELD_CFG, bytes(EASTFIELD_DAT), 'secondary');
    close(r.channels[0].samples, EASTFIELD_SECONDARY.VA);
    close(r.channels[1].samples, EASTFIELD_SECONDARY.IA);
  });

  it('one sample rate: the time axis counts from the trigger, 2 ms after the first sample', () => {
    const tb = read(EASTFIELD_CFG, bytes(EASTFIELD_DAT)).timeBase;
    expect(tb).toMatchObject({ sampleRate: 1000, source: 'rate', triggerS: 0 });
    expect(tb.t0).toBeCloseTo(-0.002, 12);
  });

  it('a digital channel: its initial state and each change with its time', () => {
    const [trip] = read(EASTFIELD_CFG, bytes(EASTFIELD_DAT)).digital;
    expect(trip.config).toMatchObject({ id: 'TRIP', circuit: 'Line 4 breaker', normalState: 0 });
    expect(trip.initialState).toBe(0);
    expect(trip.changes.map((c) => [c.sample, c.state])).toEqual([[3, 1], [5, 0]]);
    expect(trip.changes[0].timeS).toBeCloseTo(0.001, 12); // -2 ms + 3 samples of 1 ms
  });

  it('a record split into chunks at any byte reads the same', () => {
    const dat = bytes(EASTFIELD_DAT);
    for (let cut = 1; cut < dat.length; cut++) {
      const r = readComtrade(bytes(EASTFIELD_CFG), [dat.subarray(0, cut), dat.subarray(cut)], dat.length, { configName: 'r.cfg' });
      close(r.channels[1].samples, EASTFIELD_PRIMARY.IA);
    }
  });

  it('2013 BINARY32 with nrates 0: the time stamps give 10 kS/s; 0x80000000 is a missing value', () => {
    const r = read(WESTGATE_CFG_LINES.join('\r\n'), westgateDat());
    expect(r.config).toMatchObject({ revYear: 2013, timeCode: '+1h', localCode: '+1h', timeQuality: 'F', leapSecond: '0', rates: [] });
    close(r.channels[0].samples, [1, -1, NaN, 2.5, 0]); // 0.001 A per count, primary
    expect(r.timeBase.source).toBe('timestamps');
    expect(r.timeBase.sampleRate).toBeCloseTo(10_000, 6); // 10 × 10 µs between records
    expect(r.timeBase.t0).toBeCloseTo(-0.0002, 12); // the trigger is 200 µs after the first sample
    expect(r.digital.map((d) => [d.initialState, d.changes.map((c) => [c.sample, c.state])])).toEqual([
      [1, [[3, 0]]],
      [0, [[2, 1]]],
    ]);
  });

  it('the file details list each field with the line it was read from', () => {
    const entries = describeRecord(read(WESTGATE_CFG_LINES.join('\r\n'), westgateDat()));
    const at = (key: string) => entries.find((e) => e.key === key);
    expect(at('Format')).toEqual({ key: 'Format', value: 'COMTRADE, IEEE C37.111-2013 (.cfg and .dat)', line: 1 });
    expect(at('Analog A1 IN')?.line).toBe(3);
    expect(at('Digital D2 TRIP')).toMatchObject({ line: 5, value: 'phase —, circuit Feeder 2 relay, normal state 0; starts at 0, 1 change of state' });
    expect(at('Sample rates')).toMatchObject({ line: 7, value: 'none (nrates 0): the time stamps give the time base; 5 samples' });
    expect(at('Trigger')).toMatchObject({ line: 10, value: '11/11/2024,09:00:00.000200000; 0.0002 s after the first sample' });
    expect(at('Time multiplier')).toMatchObject({ line: 12, value: '10 (time stamps count in units of 10 µs)' });
    expect(at('Time code')).toEqual({ key: 'Time code', value: '+1h, local +1h', line: 13 });
    expect(at('Time quality')).toEqual({ key: 'Time quality', value: 'F, leap second 0', line: 14 });
  });

  it('2013 BINARY32 secondary: primary/secondary 400/5 divides by 80', () => {
    close(read(WESTGATE_CFG_LINES.join('\r\n'), westgateDat(), 'secondary').channels[0].samples, [0.0125, -0.0125, NaN, 0.03125, 0]);
  });

  it('a 2013 combined file holds the same record', () => {
    const dat = westgateDat();
    const head = bytes(`--- file type: CFG ---\r\n${WESTGATE_CFG_LINES.join('\r\n')}\r\n--- file type: INF ---\r\n--- file type: HDR ---\r\nFault on feeder 2\r\n--- file type: DAT BINARY: ${dat.length} ---\r\n`);
    const cff = new Uint8Array([...head, ...dat, 13, 10]);
    const r = readCff([cff], cff.length, { configName: 'westgate.cff' });
    expect(r.combined).toBe(true);
    close(r.channels[0].samples, [1, -1, NaN, 2.5, 0]);
    expect(r.config.lines.station).toBe(2); // lines count within the .cff
  });

  it('a channel without a usable ratio stays on its recorded side, with a note', () => {
    const cfg = EASTFIELD_CFG.replace('132,0.11,S', ',,S');
    const r = read(cfg, bytes(EASTFIELD_DAT));
    expect(r.channels[0].scaling).toMatchObject({ side: 'secondary' });
    expect(r.channels[0].scaling.note).toMatch(/no usable primary\/secondary ratio/);
    close(r.channels[0].samples, EASTFIELD_SECONDARY.VA);
  });
});
