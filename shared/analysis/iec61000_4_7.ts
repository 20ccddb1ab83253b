import type { IecAnalysis, IecHarmonicGroup } from '../schemas/analysis';
import { dftPlan } from './dft';
import type { Samples } from './samples';

const CYCLES_PER_WINDOW = { 50: 10, 60: 12 } as const;

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
  const length = Math.round((c * sampleRate) / frequency);
  const windows = Math.floor(x.length / length);
  if (windows < 1 || length < 4) return null;
  const top = Math.min(maxOrder, Math.floor((length / 2 - 1 - c) / c));
  if (top < 1) return null;
  const plan = dftPlan(length);
  const re = new Float64Array(length);
  const im = new Float64Array(length);
  const binSq = new Float64Array((top + 1) * c + 1);
  const sums = Array.from({ length: top + 1 }, () => ({ g: 0, sg: 0, ig: 0, isg: 0 }));
  const half = c / 2;
  for (let w = 0; w < windows; w++) {
    plan.transform(x, w * length, re, im);
    for (let k = 1; k < binSq.length; k++) binSq[k] = (2 * (re[k] ** 2 + im[k] ** 2)) / (length * length);
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

/** The mains system a fundamental belongs to (within ±10 %), or null when it is not mains. */
export function mainsSystemOf(frequency: number | null): 50 | 60 | null {
  if (frequency === null) return null;
  if (Math.abs(frequency - 50) <= 5) return 50;
  if (Math.abs(frequency - 60) <= 6) return 60;
  return null;
}
