import type { ThreePhaseSystem } from '../schemas/threePhase';
import { dftBins } from './dft';
import { estimateFrequency } from './frequency';
import { maxDeviationUnbalance } from './lineVoltageUnbalance';
import { abs, argDeg, wrapDeg, type Phasor } from './phasor';
import type { Samples } from './samples';
import { sequenceUnbalance, symmetricalComponents } from './symmetricalComponents';
import { threePhasePower } from './threePhasePower';
import { timeDomainFigures } from './timeDomainFigures';
import { wholeCycleWindow } from './wholeCycleWindow';

type Three<T> = [T, T, T];

export interface ThreePhaseSet {
  /** wye: L1-N, L2-N, L3-N; delta: L1-L2, L2-L3, L3-L1; in V. */
  voltages: Three<Samples>;
  /** Line currents L1, L2, L3 in A, or null. */
  currents: Three<Samples> | null;
  connection: 'wye' | 'delta';
}

export type ThreePhaseFigures = Omit<ThreePhaseSystem, 'voltageChannels' | 'currentChannels' | 'detectedBy'>;

export const UNBALANCE_SOURCE = 'IEC 61000-4-30 and IEC 61000-2-12: u2 = V2/V1, u0 = V0/V1, fundamental symmetrical components (Fortescue)';
export const LINE_UNBALANCE_SOURCE = 'NEMA MG 1 (North American practice): maximum deviation of a line-to-line voltage from their average, over the average';
export const POWER_SOURCE = 'IEEE Std 1459-2010, three-phase effective quantities';

/** RMS of f(k) over samples 0..count−1: the combinations (differences, sums) are formed sample by sample. */
function rmsOf(count: number, f: (k: number) => number): number {
  let s = 0;
  for (let k = 0; k < count; k++) {
    const v = f(k);
    s += v * v;
  }
  return Math.sqrt(s / count);
}

/** The fundamental as an RMS phasor: over whole cycles it falls exactly on DFT bin `cycles`. */
export function fundamentalPhasor(x: Samples, count: number, cycles: number): Phasor {
  const { re, im } = dftBins(x, 0, count, [cycles / count]);
  return { re: (Math.SQRT2 * re[0]) / count, im: (Math.SQRT2 * im[0]) / count };
}

const hasInvalid = (x: Samples, n: number) => {
  for (let i = 0; i < n; i++) if (Number.isNaN(x[i])) return true;
  return false;
};

/**
 * Everything Crestline reports for a three-phase set: line-to-line RMS, fundamental angles, the
 * symmetrical components and unbalance of the voltages, the NEMA line-voltage unbalance, and with
 * currents the IEEE 1459 three-phase powers, all over the largest whole number of cycles of the first
 * voltage channel's fundamental. Null when that channel has no steady fundamental or a channel has
 * invalid (NaN) samples.
 *
 * @param set the channels' samples, same rate and instants
 * @param sampleRate samples per second
 * @param t0 time of the first sample, in s
 */
export function analyzeThreePhase(set: ThreePhaseSet, sampleRate: number, t0 = 0): ThreePhaseFigures | null {
  const all = [...set.voltages, ...(set.currents ?? [])];
  const n = Math.min(...all.map((x) => x.length));
  if (n < 4 || all.some((x) => hasInvalid(x, n))) return null;
  const [va, vb, vc] = set.voltages;
  const freq = estimateFrequency(va.subarray(0, n), sampleRate, timeDomainFigures(va, 0, n));
  const win = wholeCycleWindow(n, sampleRate, freq.hz);
  if (freq.hz === null || win.cycles === null) return null;
  const { sampleCount: count, cycles } = win;

  const phasors = set.voltages.map((x) => fundamentalPhasor(x, count, cycles)) as Three<Phasor>;
  const voltageRms = set.voltages.map((x) => rmsOf(count, (k) => x[k])) as Three<number>;
  const lineToLineRms: Three<number> =
    set.connection === 'wye' ? [rmsOf(count, (k) => va[k] - vb[k]), rmsOf(count, (k) => vb[k] - vc[k]), rmsOf(count, (k) => vc[k] - va[k])] : voltageRms;
  const ref = argDeg(phasors[0]);
  const seq = symmetricalComponents(...phasors);

  let currents: Pick<ThreePhaseFigures, 'currentFundamentalRms' | 'currentAnglesDeg' | 'power' | 'powerSource'> = { currentFundamentalRms: null, currentAnglesDeg: null, power: null, powerSource: null };
  if (set.currents) {
    const [ia, ib, ic] = set.currents;
    const iPhasors = set.currents.map((x) => fundamentalPhasor(x, count, cycles)) as Three<Phasor>;
    // Wye: Σ v·i over the phases. Delta (three wires, Σi = 0): (1/3)·Σ v_xy·(i_x − i_y) is the same power
    // without a neutral point to refer the voltages to.
    let p = 0;
    for (let k = 0; k < count; k++) {
      p += set.connection === 'wye' ? va[k] * ia[k] + vb[k] * ib[k] + vc[k] * ic[k] : (va[k] * (ia[k] - ib[k]) + vb[k] * (ib[k] - ic[k]) + vc[k] * (ic[k] - ia[k])) / 3;
    }
    currents = {
      currentFundamentalRms: iPhasors.map(abs) as Three<number>,
      currentAnglesDeg: iPhasors.map((ph) => wrapDeg(argDeg(ph) - ref)) as Three<number>,
      power: threePhasePower({
        connection: set.connection,
        voltageRms,
        lineToLineRms,
        voltagePhasors: phasors,
        currentRms: set.currents.map((x) => rmsOf(count, (k) => x[k])) as Three<number>,
        neutralCurrentRms: set.connection === 'wye' ? rmsOf(count, (k) => ia[k] + ib[k] + ic[k]) : 0,
        currentPhasors: iPhasors,
        activePower: p / count,
      }),
      powerSource: POWER_SOURCE,
    };
  }
  return {
    kind: 'threePhase',
    connection: set.connection,
    frequency: freq.hz,
    window: { startS: t0, endS: t0 + count / sampleRate, cycles },
    lineToLineRms,
    fundamentalRms: phasors.map(abs) as Three<number>,
    phaseAnglesDeg: phasors.map((ph) => wrapDeg(argDeg(ph) - ref)) as Three<number>,
    sequence: { positive: abs(seq.positive), negative: abs(seq.negative), zero: abs(seq.zero) },
    unbalance: sequenceUnbalance(seq),
    unbalanceSource: UNBALANCE_SOURCE,
    lineVoltageUnbalance: { maxDeviationPercent: maxDeviationUnbalance(lineToLineRms), source: LINE_UNBALANCE_SOURCE },
    ...currents,
  };
}
