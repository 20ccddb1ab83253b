import { describe, expect, it } from 'vitest';
import { samplesSeries } from '../../../../src/charts/samplesSeries';

const base = { channel: 0, t0S: 1, stepS: 0.5, startIndex: 0, sampleCount: 3 };

describe('samplesSeries', () => {
  it('raw samples: one point per sample at t0 + i·step, gaps kept as null', () => {
    expect(samplesSeries({ ...base, mode: 'raw', values: [1, null, 3] })).toEqual({ x: [1, 1.5, 2], y: [1, null, 3] });
  });
  it('min/max buckets: the lowest then the highest of each bucket, half a bucket apart', () => {
    expect(samplesSeries({ ...base, mode: 'minmax', min: [-1, -2], max: [1, 2] })).toEqual({ x: [1, 1.25, 1.5, 1.75], y: [-1, 1, -2, 2] });
  });
});
