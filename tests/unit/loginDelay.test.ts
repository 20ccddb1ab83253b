import { describe, expect, it } from 'vitest';
import { accountDelayS } from '../../server/services/loginThrottle';

// The schedule is Crestline's own rule (no source): free failures, then doubling from 1 s, capped.
describe('accountDelayS', () => {
  it('no wait after the first 5 failures', () => {
    expect([1, 2, 3, 4, 5].map((n) => accountDelayS(n, 5, 30))).toEqual([0, 0, 0, 0, 0]);
  });

  it('then 1, 2, 4, 8, 16 s, and 30 s from the 11th failure on', () => {
    expect([6, 7, 8, 9, 10, 11, 12, 50, 10_000].map((n) => accountDelayS(n, 5, 30))).toEqual([1, 2, 4, 8, 16, 30, 30, 30, 30]);
  });

  it('with no free failures, the first failure already waits 1 s', () => {
    expect(accountDelayS(1, 0, 30)).toBe(1);
  });
});
