/**
 * Power quantities after IEEE Std 1459-2010 (definitions; clause numbers from memory). The worked case
 * (230 V sine; 10 A fundamental lagging 30° plus a 4 A 3rd harmonic) and its results were computed
 * independently with numpy for our domain notes (section 3); PF = DPF/√(1 + THD_I²) for a sinusoidal
 * voltage is Mohan, Undeland, Robbins, "Power Electronics", 3rd ed., ch. 3 (from memory).
 */
import { describe, expect, it } from 'vitest';
import { powerQuantities } from '../../../shared/analysis';

const FS = 50_000;
const n = FS * 0.2;
const w = 2 * Math.PI * 50;
const v = Float64Array.from({ length: n }, (_, k) => 230 * Math.SQRT2 * Math.sin(w * (k / FS)));
const i = Float64Array.from({ length: n }, (_, k) => 10 * Math.SQRT2 * Math.sin(w * (k / FS) - Math.PI / 6) + 4 * Math.SQRT2 * Math.sin(3 * w * (k / FS)));

describe('powerQuantities', () => {
  const q = powerQuantities(v, i, FS)!;
  it('active power P = 1991.86 W = P1 (the 3rd harmonic meets no voltage)', () => {
    expect(q.activePower).toBeCloseTo(1991.86, 1);
    expect(q.fundamental.activePower).toBeCloseTo(1991.86, 1);
    expect(Math.abs(q.harmonicActivePower)).toBeLessThan(0.01);
  });
  it('apparent power S = 2477.18 VA and PF = 0.804084 = cos 30°/√1.16', () => {
    expect(q.apparentPower).toBeCloseTo(2477.18, 1);
    expect(q.powerFactor!).toBeCloseTo(0.804084, 5);
    expect(q.powerFactor!).toBeCloseTo(Math.cos(Math.PI / 6) / Math.sqrt(1.16), 5);
  });
  it('Q1 = 1150 var (current lagging), D_I = 920 var, N = 1472.72 var = √(Q1² + D_I²)', () => {
    expect(q.fundamental.phaseDeg).toBeCloseTo(30, 4);
    expect(q.fundamental.reactivePower).toBeCloseTo(1150, 1);
    expect(q.currentDistortionPower).toBeCloseTo(920, 1);
    expect(q.nonActivePower).toBeCloseTo(1472.72, 1);
    expect(q.thdI!).toBeCloseTo(0.4, 6);
    expect(q.thdV!).toBeLessThan(1e-6);
  });
  it('a resistive load: PF 1, no non-active power', () => {
    const r = powerQuantities(v, v.map((x) => x / 23), FS)!;
    expect(r.powerFactor!).toBeCloseTo(1, 9);
    expect(r.nonActivePower).toBeLessThan(1e-3);
  });
  it('null when the voltage has no fundamental', () => {
    expect(powerQuantities(new Float64Array(1000).fill(12), new Float64Array(1000).fill(1), 1000)).toBeNull();
  });
});
