import { estimateFrequency } from './frequency';
import { harmonics } from './harmonics';
import type { Samples } from './samples';
import { timeDomainFigures } from './timeDomainFigures';
import { wholeCycleWindow } from './wholeCycleWindow';

/** Power quantities of one voltage/current pair, single-phase, after IEEE Std 1459-2010. Units: V, A, W, var, VA. */
export interface PowerQuantities {
  window: { startS: number; endS: number; cycles: number };
  frequency: number;
  voltageRms: number;
  currentRms: number;
  /** P = mean of v·i over whole cycles. */
  activePower: number;
  /** S = V·I, the product of the true RMS values. */
  apparentPower: number;
  /** PF = P/S. */
  powerFactor: number | null;
  /** Fundamental: V1, I1, the angle θ1 by which the current lags the voltage, P1, Q1, S1 and cos θ1. */
  fundamental: { voltage: number; current: number; phaseDeg: number; activePower: number; reactivePower: number; apparentPower: number; displacementPowerFactor: number | null };
  /** P_H = P − P1. */
  harmonicActivePower: number;
  /** N = √(S² − P²). */
  nonActivePower: number;
  /** S_N = √(S² − S1²). */
  nonFundamentalApparentPower: number;
  /** D_I = V1·I_H, D_V = V_H·I1, S_H = V_H·I_H. */
  currentDistortionPower: number;
  voltageDistortionPower: number;
  harmonicApparentPower: number;
  /** I_H/I1 and V_H/V1 (the non-fundamental part, DC included, over the fundamental). */
  thdI: number | null;
  thdV: number | null;
}

/**
 * IEEE 1459 quantities of v and i (same sample rate, same instants) over the largest whole number of
 * cycles of the voltage's fundamental. Null when the voltage has no steady fundamental.
 *
 * @param v voltage samples in V
 * @param i current samples in A
 * @param sampleRate samples per second
 */
export function powerQuantities(v: Samples, i: Samples, sampleRate: number, t0 = 0): PowerQuantities | null {
  const n = Math.min(v.length, i.length);
  if (n < 4) return null;
  const fv = timeDomainFigures(v, 0, n);
  const freq = estimateFrequency(v.subarray(0, n), sampleRate, fv);
  const win = wholeCycleWindow(n, sampleRate, freq.hz);
  if (freq.hz === null || win.cycles === null) return null;
  const count = win.sampleCount;
  let p = 0;
  for (let k = 0; k < count; k++) p += v[k] * i[k];
  const P = p / count;
  const V = timeDomainFigures(v, 0, count).rms;
  const I = timeDomainFigures(i, 0, count).rms;
  const hv = harmonics(v, 0, count, win.cycles, sampleRate, 1).harmonics[0];
  const hi = harmonics(i, 0, count, win.cycles, sampleRate, 1).harmonics[0];
  if (!hv || !hi) return null;
  const V1 = hv.rms;
  const I1 = hi.rms;
  let theta = hv.phaseDeg - hi.phaseDeg;
  theta = ((((theta + 180) % 360) + 360) % 360) - 180;
  const rad = (theta * Math.PI) / 180;
  const P1 = V1 * I1 * Math.cos(rad);
  const Q1 = V1 * I1 * Math.sin(rad);
  const S = V * I;
  const S1 = V1 * I1;
  const VH = Math.sqrt(Math.max(0, V * V - V1 * V1));
  const IH = Math.sqrt(Math.max(0, I * I - I1 * I1));
  return {
    window: { startS: t0, endS: t0 + count / sampleRate, cycles: win.cycles },
    frequency: freq.hz,
    voltageRms: V,
    currentRms: I,
    activePower: P,
    apparentPower: S,
    powerFactor: S > 0 ? P / S : null,
    fundamental: { voltage: V1, current: I1, phaseDeg: theta, activePower: P1, reactivePower: Q1, apparentPower: S1, displacementPowerFactor: S1 > 0 ? P1 / S1 : null },
    harmonicActivePower: P - P1,
    nonActivePower: Math.sqrt(Math.max(0, S * S - P * P)),
    nonFundamentalApparentPower: Math.sqrt(Math.max(0, S * S - S1 * S1)),
    currentDistortionPower: V1 * IH,
    voltageDistortionPower: VH * I1,
    harmonicApparentPower: VH * IH,
    thdI: I1 > 0 ? IH / I1 : null,
    thdV: V1 > 0 ? VH / V1 : null,
  };
}
