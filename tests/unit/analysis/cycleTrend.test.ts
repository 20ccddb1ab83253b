/**
 * Cycle-by-cycle RMS and frequency, and the dips, swells and interruptions found in Urms(1/2).
 * Sources: Urms(1/2) and the event thresholds as IEC 61000-4-30 Ed. 3 defines them (domain notes §8c:
 * one-cycle windows from a zero crossing, refreshed every half cycle; dip 90 %, swell 110 %,
 * interruption 5 %, hysteresis 2 %; details from memory); sine RMS = peak/√2 (standard calculus).
 * Timing: each value stands at the middle of its one-cycle window, so an event's start and end are
 * known to half a cycle and its duration to one cycle (a property of the method, no source).
 */
import { describe, expect, it } from 'vitest';
import { cycleTrend, thinTrend, voltageEvents } from '../../../shared/analysis';

const FS = 10_000;
const F = 50;
const PEAK = 230 * Math.SQRT2;

/** 230 V, 50 Hz for `seconds`, times a gain that may change over time. */
function supply(seconds: number, gain: (t: number) => number, f = (_t: number) => F): Float64Array {
  const n = Math.round(seconds * FS);
  const x = new Float64Array(n);
  let phase = 0;
  for (let i = 0; i < n; i++) {
    const t = i / FS;
    x[i] = gain(t) * PEAK * Math.sin(phase);
    phase += (2 * Math.PI * f(t)) / FS;
  }
  return x;
}

describe('cycleTrend', () => {
  it('rmsHalfCycle of a steady 230 V sine: 230 V every half cycle (10 ms apart)', () => {
    const p = cycleTrend(supply(1, () => 1), FS, F, 'rmsHalfCycle');
    expect(p.length).toBeGreaterThan(95);
    p.forEach((q) => expect(q.value).toBeCloseTo(230, 1));
    p.slice(1).forEach((q, k) => expect(q.tS - p[k].tS).toBeCloseTo(0.01, 4));
  });

  it('rmsCycle gives one value a cycle; frequencyCycle follows a step from 50 to 51 Hz', () => {
    const c = cycleTrend(supply(1, () => 1), FS, F, 'rmsCycle');
    c.slice(1).forEach((q, k) => expect(q.tS - c[k].tS).toBeCloseTo(0.02, 4));
    const f = cycleTrend(supply(1, () => 1, (t) => (t < 0.5 ? 50 : 51)), FS, F, 'frequencyCycle');
    expect(f.filter((q) => q.tS < 0.45).every((q) => Math.abs(q.value - 50) < 0.01)).toBe(true);
    expect(f.filter((q) => q.tS > 0.55).every((q) => Math.abs(q.value - 51) < 0.01)).toBe(true);
  });

  it('a 70 % dip from 0.30 s to 0.40 s: Urms(1/2) reads 161 V inside it, 230 V outside', () => {
    const p = cycleTrend(supply(1, (t) => (t >= 0.3 && t < 0.4 ? 0.7 : 1)), FS, F, 'rmsHalfCycle');
    const inside = p.filter((q) => q.tS > 0.315 && q.tS < 0.385);
    expect(inside.length).toBeGreaterThan(5);
    inside.forEach((q) => expect(q.value).toBeCloseTo(161, 1));
    expect(Math.min(...p.map((q) => q.value))).toBeCloseTo(161, 1);
  });

  it('goes on through an interruption (no zero crossings for 0.1 s), reading about 0 V there', () => {
    const p = cycleTrend(supply(1, (t) => (t >= 0.3 && t < 0.4 ? 0 : 1)), FS, F, 'rmsHalfCycle');
    const gap = p.filter((q) => q.tS > 0.32 && q.tS < 0.38);
    expect(gap.length).toBeGreaterThanOrEqual(5);
    gap.forEach((q) => expect(q.value).toBeLessThan(1));
  });

  it('leaves out windows holding an invalid (NaN) sample', () => {
    const x = supply(0.2, () => 1);
    x[1000] = NaN;
    const p = cycleTrend(x, FS, F, 'rmsHalfCycle');
    expect(p.every((q) => Number.isFinite(q.value))).toBe(true);
    expect(p.some((q) => Math.abs(q.tS - 0.1) < 0.005)).toBe(false);
  });
});

describe('thinTrend', () => {
  it('keeps at most the asked number of points, and keeps the lowest and the highest', () => {
    const points = Array.from({ length: 10_000 }, (_, i) => ({ tS: i / 100, value: 230 + Math.sin(i) }));
    points[4321].value = 12;
    points[777].value = 400;
    const t = thinTrend(points, 100);
    expect(t.length).toBeLessThanOrEqual(100);
    expect(Math.min(...t.map((p) => p.value))).toBe(12);
    expect(Math.max(...t.map((p) => p.value))).toBe(400);
    t.slice(1).forEach((p, k) => expect(p.tS).toBeGreaterThan(t[k].tS));
  });
});

describe('voltageEvents', () => {
  it('a synthetic 70 % dip of 0.1 s: one dip, start within half a cycle, duration within one cycle, residual 161 V', () => {
    const p = cycleTrend(supply(1, (t) => (t >= 0.3 && t < 0.4 ? 0.7 : 1)), FS, F, 'rmsHalfCycle');
    const e = voltageEvents(p, 230);
    expect(e).toHaveLength(1);
    expect(e[0].kind).toBe('dip');
    expect(Math.abs(e[0].startS - 0.3)).toBeLessThanOrEqual(0.01 + 1e-9);
    expect(Math.abs(e[0].durationS - 0.1)).toBeLessThanOrEqual(0.02 + 1e-9);
    expect(e[0].extremeV).toBeCloseTo(161, 1);
    expect(e[0].extremePercent).toBeCloseTo(70, 1);
    expect(e[0].unfinished).toBe(false);
  });

  it('an interruption is reported, inside the dip it also is', () => {
    const p = cycleTrend(supply(1, (t) => (t >= 0.3 && t < 0.4 ? 0 : 1)), FS, F, 'rmsHalfCycle');
    const kinds = voltageEvents(p, 230).map((e) => e.kind);
    expect(kinds).toEqual(['dip', 'interruption']);
  });

  it('a swell to 115 % that lasts to the end of the record is a swell, marked unfinished', () => {
    const p = cycleTrend(supply(0.5, (t) => (t >= 0.3 ? 1.15 : 1)), FS, F, 'rmsHalfCycle');
    const [e] = voltageEvents(p, 230);
    expect(e.kind).toBe('swell');
    expect(e.extremePercent).toBeCloseTo(115, 1);
    expect(e.unfinished).toBe(true);
  });

  it('hysteresis: a voltage hovering between 90 % and 92 % after a dip does not end it', () => {
    const pts = [230, 200, 205, 209, 210, 230].map((v, i) => ({ tS: i * 0.01, value: v }));
    // 90 % of 230 V = 207 V; the dip ends only at 92 % = 211.6 V or more.
    const [e] = voltageEvents(pts, 230);
    expect(e.startS).toBe(0.01);
    expect(e.endS).toBe(0.05);
  });
});
