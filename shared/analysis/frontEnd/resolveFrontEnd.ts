import type { MeterProfile } from '../../schemas/meterProfile';
import type { FrontEndProfile } from '../../schemas/meterSimulation';

/** A front end with every default filled in. */
export interface ResolvedFrontEnd {
  type: FrontEndProfile['type'];
  coupling: FrontEndProfile['coupling'];
  couplingTauS: number;
  averagingTauS: number;
  rectifier: 'full' | 'half';
  displayRateHz: number;
  counts: number | null;
  crestFactorLimit: number | null;
  rangeFullScale: number | null;
  filterOrder: 1 | 2;
  chargeTauS: number | null;
  rmsConverter: 'implicit' | 'explicit';
}

/** A 0.1 µF coupling capacitor into a 10 MΩ input is about 1 s (common practice, no source). */
const DEFAULT_COUPLING_TAU_S = 1;
/** Handheld displays update 2 to 5 times a second (common practice, no source). */
const DEFAULT_DISPLAY_RATE_HZ = 3;

/** Fills the profile's defaults, so every later step reads one shape. */
export function resolveFrontEnd(p: FrontEndProfile): ResolvedFrontEnd {
  return {
    type: p.type,
    coupling: p.coupling,
    couplingTauS: p.couplingTauS ?? DEFAULT_COUPLING_TAU_S,
    averagingTauS: p.averagingTauS,
    rectifier: p.rectifier ?? 'full',
    displayRateHz: p.displayRateHz ?? DEFAULT_DISPLAY_RATE_HZ,
    counts: p.counts ?? null,
    crestFactorLimit: p.crestFactorLimit ?? null,
    rangeFullScale: p.rangeFullScale ?? null,
    filterOrder: p.filterOrder ?? 1,
    chargeTauS: p.chargeTauS ?? null,
    rmsConverter: p.rmsConverter ?? 'implicit',
  };
}

/** Clipping level of the input stage: its crest-factor headroom on the chosen range, or null when either is unknown. */
export const clipLevelOf = (p: ResolvedFrontEnd) => (p.crestFactorLimit !== null && p.rangeFullScale !== null ? p.crestFactorLimit * p.rangeFullScale : null);

/**
 * The "Your meter" profile whose settled reading this front end must match, or null when that model
 * has no such meter (DC-coupled averaging or peak converters, half-wave rectifiers). Bandwidth is
 * unlimited: the simulated front end has no band limit before its converter.
 */
export function yourMeterProfileOf(p: FrontEndProfile): MeterProfile | null {
  const r = resolveFrontEnd(p);
  const type =
    r.type === 'trueRms' ? (r.coupling === 'ac' ? 'trueRmsAc' : 'trueRmsAcDc')
    : r.coupling === 'dc' || r.rectifier === 'half' ? null
    : r.type === 'averaging' ? 'averageResponding' : 'peakResponding';
  if (type === null) return null;
  return {
    type,
    bandwidthHz: null,
    crestFactorLimit: r.crestFactorLimit,
    range: r.rangeFullScale !== null && r.counts !== null ? { fullScale: r.rangeFullScale, displayCounts: r.counts } : null,
  };
}
