import { abs, add, argDeg, div, polar, sub, type Phasor } from './phasor';
import { symmetricalComponents } from './symmetricalComponents';

type Three<T> = [T, T, T];

/** What the IEEE 1459 three-phase quantities are computed from; all RMS, in V and A. */
export interface ThreePhasePowerInput {
  /** 'wye': line-to-neutral voltages and a neutral (four wires); 'delta': line-to-line voltages, three wires. */
  connection: 'wye' | 'delta';
  /** The measured voltage channels' true RMS: line-to-neutral for wye, line-to-line for delta. */
  voltageRms: Three<number>;
  /** Line-to-line true RMS (for wye from the sample-by-sample differences). */
  lineToLineRms: Three<number>;
  /** Fundamental phasors of the measured voltage channels. */
  voltagePhasors: Three<Phasor>;
  currentRms: Three<number>;
  /** True RMS of the neutral current (wye): of i1 + i2 + i3 sample by sample. Ignored for delta. */
  neutralCurrentRms: number;
  currentPhasors: Three<Phasor>;
  /** P, the mean of the instantaneous three-phase power over whole cycles, in W. */
  activePower: number;
}

/** IEEE Std 1459-2010 three-phase quantities. Units: V, A, W, var, VA. */
export interface ThreePhasePower {
  Ve: number;
  Ie: number;
  Se: number;
  Ve1: number;
  Ie1: number;
  Se1: number;
  P: number;
  P1plus: number;
  Q1plus: number;
  S1plus: number;
  SU1: number;
  SeN: number;
  PF: number | null;
}

const sumSq = (v: number[]) => v.reduce((s, x) => s + x * x, 0);
/** Line-to-neutral positive sequence from line-to-line: V_ab+ = √3·V_a+·1∠30°. */
const LL_TO_LN = polar(Math.sqrt(3), 30);

/**
 * Effective voltage and current, effective apparent power and its split into the fundamental
 * positive-sequence, unbalance and non-fundamental parts (IEEE Std 1459-2010, three-phase):
 * - four-wire: Ve = √((3ΣV² + ΣV_LL²)/18), Ie = √((ΣI² + In²)/3);
 * - three-wire: Ve = √(ΣV_LL²/9), Ie = √(ΣI²/3);
 * - Se = 3·Ve·Ie, Se1 from the fundamental parts, S1+ = 3·V1+·I1+, P1+ and Q1+ its real and
 *   imaginary parts, SU1 = √(Se1² − S1+²), SeN = √(Se² − Se1²), PF = P/Se.
 * A positive Q1+ means the current lags the voltage.
 */
export function threePhasePower(x: ThreePhasePowerInput): ThreePhasePower {
  const [v1, v2, v3] = x.voltagePhasors;
  const [i1, i2, i3] = x.currentPhasors;
  const iFund = x.currentPhasors.map(abs);
  let Ve: number, Ie: number, Ve1: number, Ie1: number, vPos: Phasor;
  if (x.connection === 'wye') {
    const llFund = [sub(v1, v2), sub(v2, v3), sub(v3, v1)].map(abs);
    Ve = Math.sqrt((3 * sumSq(x.voltageRms) + sumSq(x.lineToLineRms)) / 18);
    Ve1 = Math.sqrt((3 * sumSq(x.voltagePhasors.map(abs)) + sumSq(llFund)) / 18);
    Ie = Math.sqrt((sumSq(x.currentRms) + x.neutralCurrentRms ** 2) / 3);
    Ie1 = Math.sqrt((sumSq(iFund) + abs(add(add(i1, i2), i3)) ** 2) / 3);
    vPos = symmetricalComponents(v1, v2, v3).positive;
  } else {
    Ve = Math.sqrt(sumSq(x.lineToLineRms) / 9);
    Ve1 = Math.sqrt(sumSq(x.voltagePhasors.map(abs)) / 9);
    Ie = Math.sqrt(sumSq(x.currentRms) / 3);
    Ie1 = Math.sqrt(sumSq(iFund) / 3);
    vPos = div(symmetricalComponents(v1, v2, v3).positive, LL_TO_LN);
  }
  const iPos = symmetricalComponents(i1, i2, i3).positive;
  const S1plus = 3 * abs(vPos) * abs(iPos);
  const theta = ((argDeg(vPos) - argDeg(iPos)) * Math.PI) / 180;
  const Se = 3 * Ve * Ie;
  const Se1 = 3 * Ve1 * Ie1;
  return {
    Ve,
    Ie,
    Se,
    Ve1,
    Ie1,
    Se1,
    P: x.activePower,
    P1plus: S1plus * Math.cos(theta),
    Q1plus: S1plus * Math.sin(theta),
    S1plus,
    SU1: Math.sqrt(Math.max(0, Se1 * Se1 - S1plus * S1plus)),
    SeN: Math.sqrt(Math.max(0, Se * Se - Se1 * Se1)),
    PF: Se > 0 ? x.activePower / Se : null,
  };
}
