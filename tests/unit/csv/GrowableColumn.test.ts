/** The column the reader fills: its growth stops at the budget it is given. */
import { describe, expect, it } from 'vitest';
import { GrowableColumn } from '../../../shared/csv/GrowableColumn';

describe('GrowableColumn', () => {
  it('doubles up to its maximum length and no further', () => {
    const c = new GrowableColumn(16, 40);
    for (let i = 0; i < 40; i++) c.push(i);
    expect(c.values().buffer.byteLength).toBe(40 * 8);
    expect(Array.from(c.values()).slice(-2)).toEqual([38, 39]);
    expect(() => c.push(40)).toThrow(RangeError);
  });
});
