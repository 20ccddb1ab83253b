/**
 * Symmetrical components and unbalance. Sources beside each expected value:
 * - the worked example of the domain notes §8a (Va = 230∠0°, Vb = 220∠−118°, Vc = 235∠121° V RMS),
 *   computed there with numpy from Fortescue's definitions (C. L. Fortescue, 1918; e.g. Grainger &
 *   Stevenson, "Power System Analysis", chapter on symmetrical components, chapter cited from memory);
 * - the unbalance definitions of IEC 61000-4-30 / IEC 61000-2-12 (u2 = V2/V1, u0 = V0/V1) and of
 *   NEMA MG 1 (maximum deviation from the average line voltage), definitions as in the notes §8a;
 * - hand calculations written out below.
 */
import { describe, expect, it } from 'vitest';
import { maxDeviationUnbalance, polar, sequenceUnbalance, symmetricalComponents, unbalanceFromLineMagnitudes } from '../../../shared/analysis';
import { abs, sub } from '../../../shared/analysis/phasor';

const worked = [polar(230, 0), polar(220, -118), polar(235, 121)] as const;

describe('symmetricalComponents', () => {
  it('worked example (§8a): V1 228.3105 V, V2 6.3240 V, V0 3.0537 V', () => {
    const c = symmetricalComponents(...worked);
    expect(abs(c.positive)).toBeCloseTo(228.3105, 3);
    expect(abs(c.negative)).toBeCloseTo(6.324, 3);
    expect(abs(c.zero)).toBeCloseTo(3.0537, 3);
  });

  it('balanced positive sequence 230∠0°, ∠−120°, ∠+120°: V1 = 230, V2 = V0 = 0 (definition)', () => {
    const c = symmetricalComponents(polar(230, 0), polar(230, -120), polar(230, 120));
    expect(abs(c.positive)).toBeCloseTo(230, 9);
    expect(abs(c.negative)).toBeLessThan(1e-9);
    expect(abs(c.zero)).toBeLessThan(1e-9);
  });

  it('pure negative sequence 230∠0°, ∠+120°, ∠−120°: V2 = 230, V1 = 0, unbalance undefined (definition)', () => {
    const c = symmetricalComponents(polar(230, 0), polar(230, 120), polar(230, -120));
    expect(abs(c.negative)).toBeCloseTo(230, 9);
    expect(abs(c.positive)).toBeLessThan(1e-9);
    expect(sequenceUnbalance(c).negativePercent).toBeNull();
  });

  it('pure zero sequence 230∠0° on all three: V0 = 230, V1 = V2 = 0 (definition)', () => {
    const c = symmetricalComponents(polar(230, 0), polar(230, 0), polar(230, 0));
    expect(abs(c.zero)).toBeCloseTo(230, 9);
    expect(abs(c.positive) + abs(c.negative)).toBeLessThan(1e-9);
  });
});

describe('sequenceUnbalance', () => {
  it('worked example (§8a): u2 2.7699 %, u0 1.3375 %', () => {
    const u = sequenceUnbalance(symmetricalComponents(...worked));
    expect(u.negativePercent).toBeCloseTo(2.7699, 3);
    expect(u.zeroPercent).toBeCloseTo(1.3375, 3);
  });

  it('amplitude-only unbalance, Va = 1.1·230 V, Vb and Vc 230 V at ∓120° (by hand)', () => {
    // By hand: Vb + Vc = −V, so V0 = (1.1V − V)/3 = 0.1V/3; a·Vb = a²·Vc = V∠0°, so V1 = 3.1V/3;
    // a²·Vb + a·Vc = −V, so V2 = 0.1V/3. Hence u2 = u0 = 0.1/3.1 = 3.2258 %.
    const u = sequenceUnbalance(symmetricalComponents(polar(253, 0), polar(230, -120), polar(230, 120)));
    expect(u.negativePercent).toBeCloseTo((100 * 0.1) / 3.1, 9);
    expect(u.zeroPercent).toBeCloseTo((100 * 0.1) / 3.1, 9);
  });
});

describe('maxDeviationUnbalance (NEMA MG 1 line-voltage unbalance)', () => {
  it('worked example (§8a): line voltages 385.7597, 396.0807, 404.7229 V give 2.4680 %', () => {
    const ll = [sub(worked[0], worked[1]), sub(worked[1], worked[2]), sub(worked[2], worked[0])].map(abs) as [number, number, number];
    expect(ll[0]).toBeCloseTo(385.7597, 3);
    expect(ll[1]).toBeCloseTo(396.0807, 3);
    expect(ll[2]).toBeCloseTo(404.7229, 3);
    expect(maxDeviationUnbalance(ll)).toBeCloseTo(2.468, 3);
  });

  it('amplitude-only case by hand: |1.1∠0° − 1∠−120°| = √3.31, |Vb − Vc| = √3 (×230 V)', () => {
    const a = 230 * Math.sqrt(3.31);
    const b = 230 * Math.sqrt(3);
    const avg = (2 * a + b) / 3;
    expect(maxDeviationUnbalance([a, b, a])).toBeCloseTo((100 * (avg - b)) / avg, 9);
    expect(maxDeviationUnbalance([a, b, a])).toBeCloseTo(3.2504, 3);
  });

  it('three equal line voltages: 0 % (definition)', () => {
    expect(maxDeviationUnbalance([400, 400, 400])).toBe(0);
  });
});

describe('unbalanceFromLineMagnitudes', () => {
  it('worked example (§8a): the same u2 of 2.7699 % from the three line magnitudes alone', () => {
    expect(unbalanceFromLineMagnitudes([385.7597, 396.0807, 404.7229])).toBeCloseTo(2.7699, 3);
  });
});
