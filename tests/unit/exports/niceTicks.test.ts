/** Axis ticks of the report's plots: round steps of 1, 2, 2.5 or 5 × 10^k (common practice for chart axes, no source). */
import { describe, expect, it } from 'vitest';
import { niceTicks } from '../../../server/reports/pdf/niceTicks';

describe('niceTicks', () => {
  it('a ±325 V sine gets steps of 200 V from −400 to 400', () => {
    expect(niceTicks(-325, 325, 5)).toEqual({ ticks: [-400, -200, 0, 200, 400], min: -400, max: 400 });
  });
  it('0 to 0.2 s in steps of 0.05 s', () => {
    const t = niceTicks(0, 0.2, 5);
    expect(t.ticks.map((v) => Number(v.toFixed(12)))).toEqual([0, 0.05, 0.1, 0.15, 0.2]);
  });
  it('a flat line is widened around its value instead of dividing by zero', () => {
    const t = niceTicks(24, 24, 5);
    expect(t.min).toBeLessThan(24);
    expect(t.max).toBeGreaterThan(24);
  });
  it('non-finite input falls back to 0…1', () => {
    expect(niceTicks(Infinity, -Infinity)).toEqual({ ticks: [0, 1], min: 0, max: 1 });
  });
});
