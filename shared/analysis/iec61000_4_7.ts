import type { IecAnalysis, IecHarmonicGroup } from '../schemas/analysis';
import { averagingGain, decimateByAverage } from './decimate';
import { dftPlan } from './dft';
import type { Samples } from './samples';

const CYCLES_PER_WINDOW = { 50: 10, 60: 12 } as const;
const MAX_WINDOW = 16384;

/**
 * Harmonic groups and subgroups after IEC 61000-4-7 (Ed. 2.1, 2009): consecutive rectangular windows of
 * 10 cycles (50 Hz systems) or 12 cycles (60 Hz), each synchronised to the measured fundamental so that
 * bins are 5 Hz apart and order n sits on bin k = 10n (or 12n). Per window:
 *
 * - group        G²_g,n  = C²_{k−c/2}/2 + Σ_{|i|<c/2} C²_{k+i} + C²_{k+c/2}/2   (c = cycles per window)
 * - subgroup     G²_sg,n = Σ_{i=−1..1} C²_{k+i}
 * - interharmonic group            C²_ig,n  = Σ_{i=1..c−1} C²_{k+i}
 * - interharmonic centred subgroup C²_isg,n = Σ_{i=2..c−2} C²_{k+i}
 *
 * where C_k is the RMS value of bin k. The windows are aggregated as the root of the mean of squares,
 * as IEC 61000-4-30 aggregates its 10/12-cycle values.
 *
 * Records sampled faster than needed (a window of more than 16,384 samples) are first averaged down by
 * an integer factor and each bin divided by the average's known gain: the groups reach only order 50
 * (2.5–3 kHz) while a 200 ms window at 1 MS/s would cost a 2^19-point Bluestein transform per window
 * (about 100 ms each here) instead of 2^15 (about 6 ms). The window then holds whole cycles to within
 * half a decimated sample, inside the synchronisation tolerance the standard allows.
 *
 * @returns null when the record holds less than one window
 */
export function iecHarmonicGroups(
  x: Samples,
  sampleRate: number,
  frequency: number,
  mainsHz: 50 | 60,
  maxOrder = 50,
): IecAnalysis | null {
  const c = CYCLES_PER_WINDOW[mainsHz];
  const factor = averagingFactor((c * sampleRate) / frequency);
  const y = factor > 1 ? decimateByAverage(x, factor) : x;
  const rate = sampleRate / factor;
  const length = Math.round((c * rate) / frequency);
  const windows = Math.floor(y.length / length);
  if (windows < 1 || length < 4) return null;
  const top = Math.min(maxOrder, Math.floor((length / 2 - 1 - c) / c));
  if (top < 1) return null;
  const plan = dftPlan(length);
  const re = new Float64Array(length);
  const im = new Float64Array(length);
  const binSq = new Float64Array((top + 1) * c + 1);
  const gainSq = binSq.map((_, k) => averagingGain((k * rate) / length, sampleRate, factor) ** 2);
  const sums = Array.from({ length: top + 1 }, () => ({ g: 0, sg: 0, ig: 0, isg: 0 }));
  const half = c / 2;
  for (let w = 0; w < windows; w++) {
    plan.transform(y, w * length, re, im);
    for (let k = 1; k < binSq.length; k++) binSq[k] = (2 * (re[k] ** 2 + im[k] ** 2)) / (length * length) / gainSq[k];
    for (let n = 1; n <= top; n++) {
      const k = n * c;
      let g = (binSq[k - half] + binSq[k + half]) / 2;
      for (let i = -half + 1; i < half; i++) g += binSq[k + i];
      let ig = 0;
      for (let i = 1; i < c; i++) ig += binSq[k + i];
      let isg = 0;
      for (let i = 2; i <= c - 2; i++) isg += binSq[k + i];
      sums[n].g += g;
      sums[n].sg += binSq[k - 1] + binSq[k] + binSq[k + 1];
      sums[n].ig += ig;
      sums[n].isg += isg;
    }
  }
  const groups: IecHarmonicGroup[] = [];
  for (let n = 1; n <= top; n++) {
    const s = sums[n];
    groups.push({
      order: n,
      groupRms: Math.sqrt(s.g / windows),
      subgroupRms: Math.sqrt(s.sg / windows),
      interharmonicGroupRms: Math.sqrt(s.ig / windows),
      interharmonicSubgroupRms: Math.sqrt(s.isg / windows),
    });
  }
  const ratio = (pick: (g: IecHarmonicGroup) => number) => {
    const fundamental = pick(groups[0]);
    if (!(fundamental > 0) || groups.length < 2) return null;
    const sq = groups.slice(1).reduce((sum, g) => sum + pick(g) ** 2, 0);
    return (100 * Math.sqrt(sq)) / fundamental;
  };
  return {
    mainsHz,
    cyclesPerWindow: c,
    windows,
    groups,
    thdgPercent: ratio((g) => g.groupRms),
    thdsPercent: ratio((g) => g.subgroupRms),
  };
}

/**
 * The averaging factor for a window of `exact` input samples: the one (up to twice the least that fits
 * MAX_WINDOW) that leaves the window closest to a whole number of decimated samples, so it stays
 * synchronised with the fundamental.
 */
function averagingFactor(exact: number): number {
  const least = Math.ceil(exact / MAX_WINDOW);
  if (least <= 1) return 1;
  let best = least;
  let bestError = Infinity;
  for (let f = least; f <= 2 * least; f++) {
    const w = exact / f;
    const error = Math.abs(w - Math.round(w)) / w;
    if (error < bestError - 1e-12) {
      best = f;
      bestError = error;
    }
  }
  return best;
}

/** The mains system a fundamental belongs to (within ±10 %), or null when it is not mains. */
export function mainsSystemOf(frequency: number | null): 50 | 60 | null {
  if (frequency === null) return null;
  if (Math.abs(frequency - 50) <= 5) return 50;
  if (Math.abs(frequency - 60) <= 6) return 60;
  return null;
}
