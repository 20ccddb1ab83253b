import { CsvError } from '../csv/CsvError';
import { timeBaseFromColumn } from '../csv/timeBase';
import { secondsBetween } from './cfgValues';
import type { ComtradeConfig } from './ComtradeConfig';
import { ComtradeError, type ComtradePlace } from './ComtradeError';
import type { RecordColumns } from './RecordColumns';

export interface ComtradeTimeBase {
  /** Samples per second. */
  sampleRate: number;
  /** Time of the first sample in seconds, counted from the trigger (negative before it); from the first sample when the .cfg gives no trigger. */
  t0: number;
  /** 'rate': the one sample rate of the .cfg; 'timestamps': the .dat's time stamps; 'rates': the times the .cfg's several rates give. */
  source: 'rate' | 'timestamps' | 'rates';
  /** Largest distance of a time stamp from the steady grid, in sample intervals. */
  deviation: number;
  /** Where the trigger falls on the same time axis (0), or null when it is not given or lies outside the record. */
  triggerS: number | null;
}

/** Whether the time base must come from the .dat's time stamps: no rate, or several different ones. */
export function needsTimestamps(cfg: ComtradeConfig): boolean {
  return cfg.rates.length === 0 || cfg.rates.some((r) => !(r.hz > 0) || r.hz !== cfg.rates[0].hz);
}

/** Sample times in seconds from the rate table: each step at the rate of the sample it leads to. */
function timesFromRates(cfg: ComtradeConfig): Float64Array {
  const t = new Float64Array(cfg.sampleCount);
  let segment = 0;
  for (let i = 1; i < t.length; i++) {
    while (i + 1 > cfg.rates[segment].endSample) segment++;
    t[i] = t[i - 1] + 1 / cfg.rates[segment].hz;
  }
  return t;
}

/**
 * The record's time base. With one sample rate, that rate (1999 clause 6.4.6: the rate is then what
 * counts, the time stamps are secondary; from memory). With several different rates, or none, the
 * times of the samples are checked for steady sampling exactly as the CSV reader checks a time column,
 * and an irregular record is refused with the record where it parts from the grid: Crestline's
 * analysis needs one steady rate and does not resample silently.
 *
 * @param placeOf where a record is in its file (line or byte offset), for errors
 */
export function comtradeTimeBase(cols: RecordColumns, placeOf: (row: number) => ComtradePlace): ComtradeTimeBase {
  const cfg = cols.cfg;
  // The first sample's time relative to the trigger, from the two date/time lines.
  const fromTrigger = cfg.start && cfg.trigger ? secondsBetween(cfg.trigger, cfg.start) : 0;
  const hasTrigger = cfg.start !== null && cfg.trigger !== null;
  const n = cfg.sampleCount;
  const withTrigger = (tb: Omit<ComtradeTimeBase, 'triggerS'>): ComtradeTimeBase => {
    const end = tb.t0 + (n - 1) / tb.sampleRate;
    const inside = hasTrigger && tb.t0 - 1 / tb.sampleRate <= 0 && 0 <= end + 1 / tb.sampleRate;
    return { ...tb, triggerS: inside ? 0 : null };
  };
  if (n < 2) throw new ComtradeError(placeOf(0), `a record needs at least 2 samples; the .cfg declares ${n}.`);
  if (!needsTimestamps(cfg)) return withTrigger({ sampleRate: cfg.rates[0].hz, t0: fromTrigger, source: 'rate', deviation: 0 });

  let times = cols.timestamps as Float64Array;
  let scale = cfg.timeMultiplier * 1e-6;
  let source: ComtradeTimeBase['source'] = 'timestamps';
  if (cols.missingTimestamps > 0) {
    const row = cols.firstMissingTimestamp ?? 0;
    if (cfg.rates.length === 0 || cfg.rates.some((r) => !(r.hz > 0))) {
      throw new ComtradeError(placeOf(row), `this record has no time stamp (${cols.missingTimestamps} in all), and the .cfg gives no sample rate (line ${cfg.lines.rates}) to take its place.`);
    }
    times = timesFromRates(cfg);
    scale = 1;
    source = 'rates';
  }
  try {
    const tb = timeBaseFromColumn(times, scale, (row) => row);
    return withTrigger({ sampleRate: 1 / tb.interval, t0: tb.t0 + fromTrigger, source, deviation: tb.maxDeviation });
  } catch (e) {
    if (!(e instanceof CsvError)) throw e;
    const rates = cfg.rates.length > 1 ? ` The .cfg gives ${cfg.rates.length} sample rates (from line ${cfg.lines.rates}).` : '';
    throw new ComtradeError(placeOf(e.line ?? 0), `${e.message}${rates}`);
  }
}
