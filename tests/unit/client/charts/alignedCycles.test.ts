import { describe, expect, it } from 'vitest';
import type { SamplesResponse } from '../../../../shared/schemas/capture';
import { alignedTraces, envelopeAt, firstRisingCrossing } from '../../../../src/charts/alignedCycles';

const FS = 10_000;
/** A 50 Hz sine of 100 V peak sampled at 10 kS/s from t0, with a phase in radians. */
function sine(phase: number, t0 = 0, n = 800): SamplesResponse {
  return { channel: 0, mode: 'raw', t0S: t0, stepS: 1 / FS, startIndex: 0, sampleCount: n, values: Array.from({ length: n }, (_, i) => 100 * Math.sin(2 * Math.PI * 50 * (i / FS) + phase)) };
}
/** The same sine as min/max buckets of `group` samples. */
function buckets(s: SamplesResponse, group: number): SamplesResponse {
  if (s.mode !== 'raw') throw new Error('raw only');
  const min: number[] = [];
  const max: number[] = [];
  for (let i = 0; i < s.values.length; i += group) {
    const part = s.values.slice(i, i + group) as number[];
    min.push(Math.min(...part));
    max.push(Math.max(...part));
  }
  return { ...s, mode: 'minmax', stepS: s.stepS * group, min, max };
}

describe('firstRisingCrossing', () => {
  // A sine with phase φ rises through zero at t = (2π − φ)/(2π·50) within its first period (standard trigonometry).
  it('finds the rising zero of raw samples to a small part of a sample', () => {
    expect(firstRisingCrossing(sine(Math.PI / 2))!).toBeCloseTo(0.015, 5);
  });
  it('finds it from min/max buckets to within a bucket', () => {
    expect(Math.abs(firstRisingCrossing(buckets(sine(Math.PI / 2), 10))! - 0.015)).toBeLessThan(10 / FS);
  });
  it('gives null when there is nothing to cross', () => {
    expect(firstRisingCrossing({ channel: 0, mode: 'raw', t0S: 0, stepS: 1, startIndex: 0, sampleCount: 2, values: [1, null] })).toBeNull();
  });
});

describe('envelopeAt', () => {
  const raw: SamplesResponse = { channel: 0, mode: 'raw', t0S: 0, stepS: 1, startIndex: 0, sampleCount: 4, values: [0, 10, null, 30] };
  it('interpolates between raw samples', () => expect(envelopeAt(raw, 0.25)).toEqual({ lo: 2.5, hi: 2.5 }));
  it('is null over a gap and outside the samples', () => {
    expect(envelopeAt(raw, 1.5)).toBeNull();
    expect(envelopeAt(raw, -0.5)).toBeNull();
    expect(envelopeAt(raw, 3.5)).toBeNull();
  });
  it('gives the extremes of the bucket holding the instant', () => {
    const mm: SamplesResponse = { channel: 0, mode: 'minmax', t0S: 0, stepS: 2, startIndex: 0, sampleCount: 4, min: [-1, -3], max: [1, 3] };
    expect(envelopeAt(mm, 2.5)).toEqual({ lo: -3, hi: 3 });
  });
});

describe('alignedTraces', () => {
  it('two sines of different phase line up on their rising zero crossings', () => {
    const { x, traces } = alignedTraces([{ samples: sine(0.3), fromS: 0 }, { samples: sine(2.1), fromS: 0 }], 'zeroCrossing', 0.04, 401);
    expect(x[400]).toBeCloseTo(0.04, 12);
    for (let i = 0; i < 401; i += 50) expect(traces[1].lo[i]!).toBeCloseTo(traces[0].lo[i]!, 0);
    expect(traces.every((t) => t.hi === null)).toBe(true);
  });
  it('aligned on the trigger, each starts where its window starts', () => {
    const { traces } = alignedTraces([{ samples: sine(0, 0.01), fromS: 0.01 }], 'trigger', 0.02, 3);
    expect(traces[0].lo[0]).toBeCloseTo(0, 9);
  });
  it('a min/max answer becomes a lower and an upper envelope instead of nothing', () => {
    const { traces } = alignedTraces([{ samples: buckets(sine(0), 20), fromS: 0 }], 'zeroCrossing', 0.03, 61);
    const [t] = traces;
    expect(t.hi).not.toBeNull();
    expect(t.lo.filter((v) => v !== null).length).toBeGreaterThan(50);
    t.lo.forEach((lo, i) => lo !== null && expect(lo).toBeLessThanOrEqual(t.hi![i]!));
  });
});
