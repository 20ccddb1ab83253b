/**
 * IEC 61000-4-7 grouping. Group/subgroup formulas as summarised from IEC 61000-4-7 Ed. 2.1 (2009),
 * clause on harmonic groups (formula quoted from memory); the unsynchronised reference values are
 * from an independent numpy computation recorded in our domain notes (section 2c).
 */
import { describe, expect, it } from 'vitest';
import { analyzeChannel, iecHarmonicGroups } from '../../../shared/analysis';

const FS = 10000;
const tone = (hz: number, rms: number) => (t: number) => rms * Math.SQRT2 * Math.sin(2 * Math.PI * hz * t);
function record(seconds: number, parts: ((t: number) => number)[]) {
  return Float64Array.from({ length: Math.round(FS * seconds) }, (_, i) => parts.reduce((s, p) => s + p(i / FS), 0));
}

describe('iecHarmonicGroups', () => {
  it('synchronised 50 Hz: groups and subgroups equal the harmonic values; an interharmonic lands in its groups only', () => {
    // 100 V fundamental, 10 V 5th, 2 V interharmonic at 180 Hz (bin 36 of 5 Hz bins: between orders 3 and 4)
    const x = record(1, [tone(50, 100), tone(250, 10), tone(180, 2)]);
    const r = iecHarmonicGroups(x, FS, 50, 50)!;
    expect(r.cyclesPerWindow).toBe(10);
    expect(r.windows).toBe(5);
    const g = (n: number) => r.groups[n - 1];
    expect(g(1).groupRms).toBeCloseTo(100, 9);
    expect(g(5).groupRms).toBeCloseTo(10, 9);
    expect(g(5).subgroupRms).toBeCloseTo(10, 9);
    // bin 36 lies inside the group of order 4 (bins 35½…45½) but outside its subgroup (39…41)
    expect(g(4).groupRms).toBeCloseTo(2, 9);
    expect(g(4).subgroupRms).toBeCloseTo(0, 9);
    // and inside the interharmonic group and centred subgroup between orders 3 and 4
    expect(g(3).interharmonicGroupRms).toBeCloseTo(2, 9);
    expect(g(3).interharmonicSubgroupRms).toBeCloseTo(2, 9);
    expect(g(4).interharmonicGroupRms).toBeCloseTo(0, 9);
    expect(r.thdsPercent).toBeCloseTo(10, 6);
  });

  it('unsynchronised window (true 50.5 Hz, window fixed at 200 ms): groups gather leaked energy', () => {
    // Reference (domain notes §2c, numpy): single bins 98.00 / 6.355, subgroups 99.02 / 9.269, groups 99.45 / 9.866
    const x = record(0.2, [tone(50.5, 100), tone(252.5, 10)]);
    const r = iecHarmonicGroups(x, FS, 50, 50)!;
    expect(r.groups[0].subgroupRms).toBeCloseTo(99.02, 1);
    expect(r.groups[0].groupRms).toBeCloseTo(99.45, 1);
    expect(r.groups[4].subgroupRms).toBeCloseTo(9.269, 2);
    expect(r.groups[4].groupRms).toBeCloseTo(9.866, 2);
  });

  it('a record sampled at 1 MS/s (averaged down before the transform) gives the same groups', () => {
    const fs = 1_000_000;
    const parts = [tone(50, 100), tone(250, 10), tone(180, 2)];
    const x = Float64Array.from({ length: fs * 0.45 }, (_, i) => parts.reduce((s, p) => s + p(i / fs), 0));
    const r = iecHarmonicGroups(x, fs, 50, 50)!;
    expect(r.windows).toBe(2);
    // The averaged-down window holds 10 cycles to within half a sample (2e-5 of a window, inside the
    // standard's synchronisation tolerance of about 3e-4 [from memory]), so values agree to ~1e-5.
    expect(r.groups[0].groupRms).toBeCloseTo(100, 2);
    expect(r.groups[4].subgroupRms).toBeCloseTo(10, 3);
    expect(r.groups[3].groupRms).toBeCloseTo(2, 3);
    expect(r.groups[2].interharmonicSubgroupRms).toBeCloseTo(2, 3);
  });

  it('60 Hz systems use 12-cycle windows', () => {
    const x = record(0.5, [tone(60, 120), tone(180, 6)]);
    const r = iecHarmonicGroups(x, FS, 60, 60)!;
    expect(r.cyclesPerWindow).toBe(12);
    expect(r.groups[2].groupRms).toBeCloseTo(6, 9);
  });

  it('analyzeChannel applies it to mains captures by itself, and not to a 400 Hz one', () => {
    expect(analyzeChannel(record(0.4, [tone(50, 230)]), FS).iec?.mainsHz).toBe(50);
    expect(analyzeChannel(record(0.05, [tone(400, 115)]), FS).iec).toBeNull();
  });
});
