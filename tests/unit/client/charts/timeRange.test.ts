import { describe, expect, it } from 'vitest';
import { clampRange, panBy, zoomAbout } from '../../../../src/charts/timeRange';

const full = [0, 10] as const;

describe('clampRange', () => {
  it('leaves a range inside the record as it is', () => expect(clampRange([2, 4], full)).toEqual([2, 4]));
  it('moves a range that starts before the record to its start, keeping the width', () => expect(clampRange([-1, 3], full)).toEqual([0, 4]));
  it('moves a range that ends after the record to its end, keeping the width', () => expect(clampRange([8, 12], full)).toEqual([6, 10]));
  it('cuts a range wider than the record to the record', () => expect(clampRange([-5, 20], full)).toEqual([0, 10]));
});

describe('panBy', () => {
  it('moves by a fraction of the width: half of a 2 s view is 1 s', () => expect(panBy([2, 4], full, 0.5)).toEqual([3, 5]));
  it('moves earlier for a negative fraction', () => expect(panBy([2, 4], full, -0.5)).toEqual([1, 3]));
  it('stops at the end of the record', () => expect(panBy([7, 9], full, 1)).toEqual([8, 10]));
});

describe('zoomAbout', () => {
  it('halves the width about the middle', () => expect(zoomAbout([2, 6], full, 0.5)).toEqual([3, 5]));
  it('keeps the anchored instant at the same place on the screen', () => {
    // The instant a quarter of the way in (3 s) stays a quarter of the way in.
    const [a, b] = zoomAbout([2, 6], full, 0.5, 0.25);
    expect(a + (b - a) * 0.25).toBeCloseTo(3, 12);
    expect(b - a).toBeCloseTo(2, 12);
  });
  it('never zooms narrower than the least width', () => expect(zoomAbout([2, 4], full, 0.001, 0.5, 0.5)).toEqual([2.75, 3.25]));
  it('zooming out past the record shows the whole record', () => expect(zoomAbout([2, 6], full, 4)).toEqual([0, 10]));
});
