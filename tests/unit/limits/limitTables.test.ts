/**
 * The limit tables as published. Sources, per table:
 * - IEEE Std 519-2022 Table 1 (= IEEE Std 519-2014 Table 1): confirmed against secondary texts that
 *   reproduce the standard (our domain notes §4a, [S]); the issue states the same four rows.
 * - IEEE Std 519-2014 Table 2 (numbers unchanged in 2022): secondary texts, e.g. Kusko & Thompson,
 *   "Power Quality in Electrical Systems" (2007), which reproduces it (domain notes §4b, [S]). The
 *   25 % even-harmonic rule is the 2014 edition's [S]; order 2 in the first band follows the 2022
 *   edition's "2 ≤ h < 11" (from memory).
 * - IEC 61000-3-2 Ed. 5.0 (2018) + Amd 1 (2020) Table 1, Class A: secondary texts (domain notes §4c, [S]),
 *   expanded values by arithmetic. Class D (Table 3) and Class C (Table 2): from memory (domain notes §8d
 *   mark the values "M"); verify them against the standard.
 */
import { describe, expect, it } from 'vitest';
import { classALimitAmps, classCLimitPercent, classDLimitAmps, classDLimitMilliampsPerWatt } from '../../../shared/limits/iec61000_3_2Limits';
import { ieee519CurrentLimitPercent, ieee519CurrentRow, IEEE519_2014_TABLE_2 } from '../../../shared/limits/ieee519CurrentLimits';
import { ieee519VoltageRow, IEEE519_2022_TABLE_1 } from '../../../shared/limits/ieee519VoltageLimits';

describe('ieee519VoltageRow (IEEE Std 519-2022 Table 1)', () => {
  it('holds the four rows: 5.0/8.0, 3.0/5.0, 1.5/2.5, 1.0/1.5 %', () => {
    expect(IEEE519_2022_TABLE_1.map((r) => [r.upToVolts, r.individualPercent, r.thdPercent])).toEqual([
      [1000, 5.0, 8.0],
      [69000, 3.0, 5.0],
      [161000, 1.5, 2.5],
      [Infinity, 1.0, 1.5],
    ]);
  });
  it.each([
    [230, 5.0, 8.0],
    [1000, 5.0, 8.0], // "V ≤ 1.0 kV" includes 1 kV
    [1000.001, 3.0, 5.0],
    [69_000, 3.0, 5.0],
    [69_000.1, 1.5, 2.5],
    [161_000, 1.5, 2.5],
    [161_000.1, 1.0, 1.5],
    [400_000, 1.0, 1.5],
  ])('a %s V bus: individual %s %, THD %s %', (v, individual, thd) => {
    expect(ieee519VoltageRow(v)).toMatchObject({ individualPercent: individual, thdPercent: thd });
  });
  it('refuses a voltage that is not positive', () => {
    expect(() => ieee519VoltageRow(0)).toThrow(/positive/);
  });
});

describe('ieee519CurrentRow and ieee519CurrentLimitPercent (IEEE Std 519-2014 Table 2)', () => {
  it('holds the five rows of odd-harmonic limits and TDD', () => {
    expect(IEEE519_2014_TABLE_2.map((r) => [...r.bands, r.tddPercent])).toEqual([
      [4.0, 2.0, 1.5, 0.6, 0.3, 5.0],
      [7.0, 3.5, 2.5, 1.0, 0.5, 8.0],
      [10.0, 4.5, 4.0, 1.5, 0.7, 12.0],
      [12.0, 5.5, 5.0, 2.0, 1.0, 15.0],
      [15.0, 7.0, 6.0, 2.5, 1.4, 20.0],
    ]);
  });
  it.each([
    [19.99, 5.0],
    [20, 8.0], // a row runs from its lower bound inclusive
    [49.99, 8.0],
    [50, 12.0],
    [100, 15.0],
    [999, 15.0],
    [1000, 20.0],
  ])('I_SC/I_L = %s takes the row with TDD %s %', (ratio, tdd) => {
    expect(ieee519CurrentRow(ratio).tddPercent).toBe(tdd);
  });
  it.each([
    [3, 4.0], [9, 4.0], [11, 2.0], [15, 2.0], [17, 1.5], [21, 1.5], [23, 0.6], [33, 0.6], [35, 0.3], [49, 0.3],
    [2, 1.0], [10, 1.0], [12, 0.5], [22, 0.375], [34, 0.15], [50, 0.075], // even: 25 % of the band's odd limit
  ])('row < 20: order %s is limited to %s % of I_L', (order, limit) => {
    expect(ieee519CurrentLimitPercent(order, ieee519CurrentRow(10))).toBeCloseTo(limit, 12);
  });
  it('refuses orders outside 2…50', () => {
    expect(() => ieee519CurrentLimitPercent(1, IEEE519_2014_TABLE_2[0])).toThrow(/2…50/);
    expect(() => ieee519CurrentLimitPercent(51, IEEE519_2014_TABLE_2[0])).toThrow(/2…50/);
  });
});

describe('classALimitAmps (IEC 61000-3-2 Table 1)', () => {
  it.each([
    [2, 1.08], [3, 2.3], [4, 0.43], [5, 1.14], [6, 0.3], [7, 0.77], [8, 0.23], [9, 0.4], [10, 0.184], [11, 0.33], [13, 0.21],
    [15, 0.15], [17, 0.1324], [21, 0.1071], [39, 0.0577], [40, 0.046], [16, 0.115], [30, 0.0613],
  ])('order %s: %s A', (order, amps) => {
    expect(classALimitAmps(order)).toBeCloseTo(amps, 4);
  });
  it('sets no limit outside 2…40', () => {
    expect(classALimitAmps(1)).toBeNull();
    expect(classALimitAmps(41)).toBeNull();
  });
});

describe('Class D and Class C (IEC 61000-3-2 Tables 3 and 2; values from memory)', () => {
  it.each([[3, 3.4], [5, 1.9], [7, 1.0], [9, 0.5], [11, 0.35], [13, 3.85 / 13], [39, 3.85 / 39]])('Class D order %s: %s mA/W', (order, perWatt) => {
    expect(classDLimitMilliampsPerWatt(order)).toBeCloseTo(perWatt, 12);
  });
  it('Class D limits only odd orders 3…39', () => {
    expect(classDLimitMilliampsPerWatt(2)).toBeNull();
    expect(classDLimitMilliampsPerWatt(41)).toBeNull();
  });
  it('Class D at 200 W: 3rd 0.68 A; at 600 W the 15th is capped at Class A, 0.15 A rather than 0.154 A', () => {
    expect(classDLimitAmps(3, 200)).toBeCloseTo(0.68, 12);
    expect(classDLimitAmps(15, 600)).toBeCloseTo(0.15, 12);
  });
  it.each([[2, 2], [3, 27], [5, 10], [7, 7], [9, 5], [11, 3], [39, 3]])('Class C with λ = 0.9: order %s limited to %s % of the fundamental', (order, percent) => {
    expect(classCLimitPercent(order, 0.9)).toBeCloseTo(percent, 12);
  });
  it('Class C sets no limit for even orders above 2', () => {
    expect(classCLimitPercent(4, 0.9)).toBeNull();
  });
});
