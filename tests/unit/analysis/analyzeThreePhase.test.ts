/**
 * Three-phase sets sampled over whole cycles, through the engine: line-to-line RMS from sample
 * differences, angles, sequence components and unbalance, and the IEEE Std 1459-2010 three-phase powers.
 * Sources: worked example of the domain notes §8a (numpy, Fortescue's definitions); IEEE 1459-2010
 * three-phase definitions as in the notes §8b (formulas from memory there) and its check "a balanced
 * sinusoidal set gives Se = S1+ = √3·V_LL·I and SU1 = 0"; hand calculations written out beside the rest;
 * a plain direct DFT (tests/helpers/threePhase.ts) as the independent reference for the phasors.
 */
import { describe, expect, it } from 'vitest';
import { analyzeThreePhase } from '../../../shared/analysis';
import { directFundamental, FS, three, type Wave } from '../../helpers/threePhase';

const V = 230;
const I = 10;
const wye = (a: Wave, b: Wave, c: Wave) => three(a, b, c);
const balancedV = wye({ rms: V, angleDeg: 0 }, { rms: V, angleDeg: -120 }, { rms: V, angleDeg: 120 });
/** Currents lagging their voltages by 30°. */
const lagging30 = (extra?: Wave['harmonics'][]) => three(
  { rms: I, angleDeg: -30, harmonics: extra?.[0] },
  { rms: I, angleDeg: -150, harmonics: extra?.[1] },
  { rms: I, angleDeg: 90, harmonics: extra?.[2] },
);

describe('analyzeThreePhase, wye', () => {
  it('worked example (§8a): line-to-line 385.7597, 396.0807, 404.7229 V from sample differences; u2, u0, LVUR', () => {
    const v = wye({ rms: 230, angleDeg: 0 }, { rms: 220, angleDeg: -118 }, { rms: 235, angleDeg: 121 });
    const r = analyzeThreePhase({ voltages: v, currents: null, connection: 'wye' }, FS)!;
    expect(r.window.cycles).toBe(10);
    expect(r.frequency).toBeCloseTo(50, 6);
    r.lineToLineRms.forEach((x, k) => expect(x).toBeCloseTo([385.7597, 396.0807, 404.7229][k], 3));
    expect(r.sequence.positive).toBeCloseTo(228.3105, 3);
    expect(r.sequence.negative).toBeCloseTo(6.324, 3);
    expect(r.sequence.zero).toBeCloseTo(3.0537, 3);
    expect(r.unbalance.negativePercent).toBeCloseTo(2.7699, 3);
    expect(r.unbalance.zeroPercent).toBeCloseTo(1.3375, 3);
    expect(r.lineVoltageUnbalance.maxDeviationPercent).toBeCloseTo(2.468, 3);
    expect(r.lineVoltageUnbalance.source).toMatch(/NEMA MG 1/);
    expect(r.unbalanceSource).toMatch(/IEC 61000-4-30/);
    expect(r.power).toBeNull();
  });

  it('angles and fundamentals agree with a plain direct DFT of each channel (independent reference)', () => {
    const v = wye({ rms: 230, angleDeg: 10 }, { rms: 220, angleDeg: -108 }, { rms: 235, angleDeg: 131, harmonics: [{ order: 5, rms: 12, angleDeg: 40 }] });
    const r = analyzeThreePhase({ voltages: v, currents: null, connection: 'wye' }, FS)!;
    const direct = v.map((x) => directFundamental(x, 10));
    direct.forEach((d, k) => {
      expect(r.fundamentalRms[k]).toBeCloseTo(d.rms, 8);
      expect(r.phaseAnglesDeg[k]).toBeCloseTo(((d.angleDeg - direct[0].angleDeg + 540) % 360) - 180, 6);
    });
    // And the design: −118° and +121° from the first.
    expect(r.phaseAnglesDeg[1]).toBeCloseTo(-118, 6);
    expect(r.phaseAnglesDeg[2]).toBeCloseTo(121, 6);
  });

  it('a zero-sequence part of 23 V on a balanced 230 V set: u0 10 %, u2 0, and the line voltages do not see it', () => {
    // By hand: Va = 230∠0° + 23, Vb = 230∠−120° + 23, Vc = 230∠120° + 23; V0 = 23, V1 = 230, V2 = 0;
    // differences cancel the common part, so every line voltage is √3·230 V and the NEMA unbalance is 0.
    const v = wye({ rms: 230, angleDeg: 0 }, { rms: 230, angleDeg: -120 }, { rms: 230, angleDeg: 120 }).map((x) => x.map((s, i) => s + Math.SQRT2 * 23 * Math.cos((2 * Math.PI * 50 * i) / FS))) as [Float64Array, Float64Array, Float64Array];
    const r = analyzeThreePhase({ voltages: v, currents: null, connection: 'wye' }, FS)!;
    expect(r.unbalance.zeroPercent).toBeCloseTo(10, 6);
    expect(r.unbalance.negativePercent).toBeLessThan(1e-6);
    r.lineToLineRms.forEach((x) => expect(x).toBeCloseTo(230 * Math.sqrt(3), 6));
    expect(r.lineVoltageUnbalance.maxDeviationPercent).toBeLessThan(1e-6);
  });

  it('balanced, sinusoidal, current lagging 30°: Se = S1+ = √3·V_LL·I, SU1 = SeN = 0, P = Se·cos 30° (§8b check)', () => {
    const r = analyzeThreePhase({ voltages: balancedV, currents: lagging30(), connection: 'wye' }, FS)!;
    const p = r.power!;
    const vll = Math.sqrt(3) * V;
    expect(p.Ve).toBeCloseTo(V, 6);
    expect(p.Ie).toBeCloseTo(I, 6);
    expect(p.Se).toBeCloseTo(Math.sqrt(3) * vll * I, 4);
    expect(p.S1plus).toBeCloseTo(Math.sqrt(3) * vll * I, 4);
    expect(p.SU1).toBeLessThan(1e-3);
    expect(p.SeN).toBeLessThan(1e-3);
    expect(p.P).toBeCloseTo(3 * V * I * Math.cos(Math.PI / 6), 4);
    expect(p.P1plus).toBeCloseTo(3 * V * I * Math.cos(Math.PI / 6), 4);
    expect(p.Q1plus).toBeCloseTo(3 * V * I * 0.5, 4);
    expect(p.PF).toBeCloseTo(Math.cos(Math.PI / 6), 8);
    expect(r.currentAnglesDeg![0]).toBeCloseTo(-30, 6);
    expect(r.powerSource).toMatch(/IEEE Std 1459-2010/);
  });

  it('balanced fifth-harmonic currents (2 A): SeN = 3·V·I5, Se1 = S1+ (by hand from §8b)', () => {
    // By hand: a balanced 5th is negative sequence, so the neutral carries none; Ie = √(I1² + I5²),
    // Ie1 = I1, Se = 3·V·Ie, Se1 = 3·V·I1, SeN = √(Se² − Se1²) = 3·V·I5.
    const h = (a: number) => [{ order: 5, rms: 2, angleDeg: a }];
    const r = analyzeThreePhase({ voltages: balancedV, currents: lagging30([h(0), h(120), h(-120)]), connection: 'wye' }, FS)!;
    expect(r.power!.Ie).toBeCloseTo(Math.sqrt(I * I + 4), 6);
    expect(r.power!.SeN).toBeCloseTo(3 * V * 2, 3);
    expect(r.power!.SU1).toBeLessThan(1e-3);
  });

  it('one phase of current missing: the unbalance power SU1 appears, and Se1² = S1+² + SU1² (§8b)', () => {
    const i = three({ rms: I, angleDeg: -30 }, { rms: I, angleDeg: -150 }, { rms: 0, angleDeg: 0 });
    const p = analyzeThreePhase({ voltages: balancedV, currents: i, connection: 'wye' }, FS)!.power!;
    expect(p.SU1).toBeGreaterThan(0.3 * p.S1plus);
    expect(p.Se1 ** 2).toBeCloseTo(p.S1plus ** 2 + p.SU1 ** 2, 0);
    // P is still the two loaded phases' power (circuit theory): 2·V·I·cos 30°.
    expect(p.P).toBeCloseTo(2 * V * I * Math.cos(Math.PI / 6), 4);
  });
});

describe('analyzeThreePhase, delta (line-to-line channels, three wires)', () => {
  it('balanced: Ve = V_LL/√3, Se = √3·V_LL·I, P the same as the wye figures (§8b three-wire formulas)', () => {
    const vll = Math.sqrt(3) * V;
    const v = three({ rms: vll, angleDeg: 30 }, { rms: vll, angleDeg: -90 }, { rms: vll, angleDeg: 150 });
    const r = analyzeThreePhase({ voltages: v, currents: lagging30(), connection: 'delta' }, FS)!;
    r.lineToLineRms.forEach((x) => expect(x).toBeCloseTo(vll, 6));
    const p = r.power!;
    expect(p.Ve).toBeCloseTo(V, 6);
    expect(p.Se).toBeCloseTo(Math.sqrt(3) * vll * I, 4);
    expect(p.S1plus).toBeCloseTo(Math.sqrt(3) * vll * I, 4);
    expect(p.P).toBeCloseTo(3 * V * I * Math.cos(Math.PI / 6), 4);
    expect(p.Q1plus).toBeCloseTo(3 * V * I * 0.5, 4);
    expect(p.SU1).toBeLessThan(1e-3);
  });

  it('returns null without a steady fundamental', () => {
    const flat = new Float64Array(4000).fill(1);
    expect(analyzeThreePhase({ voltages: [flat, flat, flat], currents: null, connection: 'wye' }, FS)).toBeNull();
  });
});
