import type { TrendPoint } from './cycleTrend';

/** Thresholds in % of the declared voltage. */
export interface EventThresholds {
  dipPercent: number;
  swellPercent: number;
  interruptionPercent: number;
  hysteresisPercent: number;
}

/**
 * IEC 61000-4-30 (class A) as commonly applied: dip below 90 %, swell above 110 %, interruption below
 * 5 % of the declared voltage, each ending past the threshold by a 2 % hysteresis. Source: IEC
 * 61000-4-30 Ed. 3, dips and swells clause (typical values; the standard leaves them to the user),
 * details from memory.
 */
export const IEC_61000_4_30_THRESHOLDS: EventThresholds = { dipPercent: 90, swellPercent: 110, interruptionPercent: 5, hysteresisPercent: 2 };
export const EVENT_THRESHOLDS_SOURCE = 'IEC 61000-4-30 Ed. 3 (class A): dip < 90 %, swell > 110 %, interruption < 5 % of the declared voltage, hysteresis 2 %, on Urms(1/2)';

export interface VoltageEvent {
  kind: 'dip' | 'swell' | 'interruption';
  /** Times (s) of the first Urms(1/2) value past the threshold and of the first one back past threshold ± hysteresis. */
  startS: number;
  endS: number;
  durationS: number;
  /** Residual voltage (lowest Urms(1/2)) of a dip or interruption, highest of a swell, in V. */
  extremeV: number;
  extremePercent: number;
  /** The record ended before the voltage came back. */
  unfinished: boolean;
}

const MAX_EVENTS = 50;

/**
 * Dips, swells and interruptions in a Urms(1/2) trend against a declared voltage. An interruption is
 * also a dip (its voltage passed the dip threshold first), so both are reported, as IEC 61000-4-30
 * flags them separately.
 *
 * @param points Urms(1/2) values in V, in time order
 * @param declared the declared voltage, in V
 */
export function voltageEvents(points: TrendPoint[], declared: number, thresholds: EventThresholds = IEC_61000_4_30_THRESHOLDS): VoltageEvent[] {
  if (!(declared > 0) || points.length === 0) return [];
  const u = declared / 100;
  const h = thresholds.hysteresisPercent * u;
  const kinds = [
    { kind: 'dip' as const, enter: (v: number) => v < thresholds.dipPercent * u, leave: (v: number) => v >= thresholds.dipPercent * u + h, low: true },
    { kind: 'interruption' as const, enter: (v: number) => v < thresholds.interruptionPercent * u, leave: (v: number) => v >= thresholds.interruptionPercent * u + h, low: true },
    { kind: 'swell' as const, enter: (v: number) => v > thresholds.swellPercent * u, leave: (v: number) => v <= thresholds.swellPercent * u - h, low: false },
  ];
  const out: VoltageEvent[] = [];
  for (const k of kinds) {
    let start = -1;
    let extreme = 0;
    const close = (endS: number, unfinished: boolean) => {
      out.push({ kind: k.kind, startS: points[start].tS, endS, durationS: endS - points[start].tS, extremeV: extreme, extremePercent: extreme / u, unfinished });
      start = -1;
    };
    for (let i = 0; i < points.length && out.length < MAX_EVENTS * 3; i++) {
      const v = points[i].value;
      if (start < 0) {
        if (k.enter(v)) {
          start = i;
          extreme = v;
        }
      } else if (k.leave(v)) close(points[i].tS, false);
      else extreme = k.low ? Math.min(extreme, v) : Math.max(extreme, v);
    }
    if (start >= 0) close(points[points.length - 1].tS, true);
  }
  return out.sort((a, b) => a.startS - b.startS);
}
