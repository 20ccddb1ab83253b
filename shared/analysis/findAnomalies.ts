import { findClipping, sampleRange, type ClippingFinding } from './clipping';
import { risingZeroCrossings } from './frequency';
import type { Samples } from './samples';

export interface AnomalySuggestion {
  kind: 'clipping' | 'spike' | 'dropout' | 'sag' | 'swell' | 'frequency' | 'dip' | 'interruption';
  startS: number;
  endS: number;
  severity: 'info' | 'warning' | 'fault';
  label: string;
  /** Why it was raised, with the figures that triggered it. */
  reason: string;
}

export interface AnomalyOptions {
  /** Sag/swell band around the nominal cycle RMS (IEC 61000-4-30 uses ±10 % of nominal for dips and swells [from memory]). */
  bandPercent?: number;
  /** Nominal RMS; the median cycle RMS when not given. */
  nominalRms?: number;
  /** A sample further than this many cycle-RMS from the same point one cycle away is a spike. */
  spikeFactor?: number;
  /** A cycle whose period differs by more than this from the record's is a frequency deviation. */
  frequencyPercent?: number;
  /** The record's clipping when already found (findClipping over all of x with its extremes). */
  clipping?: ClippingFinding[];
  /** The record's extremes when already known (sampleRange of x). */
  range?: { min: number; max: number };
}

const MAX_PER_KIND = 20;

/** Runs [first, last] of consecutive indices 0..n−1 where `flagged(i)` holds; no flag array is built. */
function runs(n: number, flagged: (i: number) => boolean): [number, number][] {
  const out: [number, number][] = [];
  let start = -1;
  for (let i = 0; i < n; i++) {
    const f = flagged(i);
    if (f && start < 0) start = i;
    else if (!f && start >= 0) {
      out.push([start, i - 1]);
      start = -1;
    }
  }
  if (start >= 0) out.push([start, n - 1]);
  return out;
}

const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  return s.length ? s[Math.floor(s.length / 2)] : 0;
};

/**
 * Suggests marks for what an engineer looks for in a capture: clipping at the rails, spikes, dropouts
 * (flat or missing stretches), sags and swells of the cycle RMS, and cycles off the record's frequency.
 * Cycle-based checks need the fundamental; without one only clipping, dropouts and spikes are looked for.
 *
 * @param x samples; NaN marks missing ones
 * @param sampleRate samples per second
 * @param t0 time of x[0] in seconds
 * @param frequency fundamental in Hz, or null
 */
export function findAnomalies(x: Samples, sampleRate: number, t0: number, frequency: number | null, options: AnomalyOptions = {}): AnomalySuggestion[] {
  const band = (options.bandPercent ?? 10) / 100;
  const spikeFactor = options.spikeFactor ?? 1.5;
  const freqTol = (options.frequencyPercent ?? 1) / 100;
  const t = (i: number) => t0 + i / sampleRate;
  const out: AnomalySuggestion[] = [];
  const { min, max } = options.range ?? sampleRange(x);
  const span = max - min;

  // Clipping: runs of three or more samples on a rail that findClipping judged to be clipped.
  for (const c of options.clipping ?? findClipping(x, 0, x.length, min, max)) {
    for (const [a, b] of runs(x.length, (i) => x[i] === c.value).filter(([a, b]) => b - a >= 2).slice(0, MAX_PER_KIND)) {
      out.push({ kind: 'clipping', startS: t(a), endS: t(b + 1), severity: 'fault', label: 'Clipping', reason: `${b - a + 1} samples flat at the record's ${c.rail === 'max' ? 'maximum' : 'minimum'} (${c.value.toPrecision(4)}): the instrument's range was exceeded.` });
    }
  }

  // Dropouts: missing samples, or the signal flat for at least half a cycle (or 1 % of a non-periodic record).
  const flatMin = Math.max(8, Math.round(frequency ? sampleRate / frequency / 2 : x.length / 100));
  const flatStep = span * 1e-6;
  const flat = (i: number) => Number.isNaN(x[i]) || (i > 0 && Math.abs(x[i] - x[i - 1]) <= flatStep);
  for (const [a, b] of runs(x.length, flat).filter(([a, b]) => b - a + 1 >= flatMin).slice(0, MAX_PER_KIND)) {
    if (out.some((o) => o.kind === 'clipping' && o.startS <= t(a) && o.endS >= t(b))) continue;
    const missing = Number.isNaN(x[a]);
    out.push({ kind: 'dropout', startS: t(a), endS: t(b + 1), severity: 'warning', label: missing ? 'Missing samples' : 'Dropout', reason: missing ? `${b - a + 1} samples are missing or overrange.` : `The signal stays flat for ${((b - a + 1) / sampleRate * 1000).toPrecision(3)} ms.` });
  }

  if (!frequency) return out;
  const period = sampleRate / frequency;
  const cycles = Math.floor(x.length / period);
  if (cycles < 3) return out;
  const cycleRms: number[] = [];
  for (let k = 0; k < cycles; k++) {
    let s = 0;
    const a = Math.round(k * period);
    const b = Math.round((k + 1) * period);
    for (let i = a; i < b; i++) s += x[i] * x[i];
    cycleRms.push(Math.sqrt(s / (b - a)));
  }
  const nominal = options.nominalRms ?? median(cycleRms);

  // Spikes: a sample far from the same point one cycle away, relative to the cycle RMS.
  const p = Math.round(period);
  const spikes: number[] = [];
  const limit = spikeFactor * nominal;
  for (let i = p; i < x.length - p; i++) {
    const v = x[i];
    if (Math.abs(v - x[i - p]) > limit && Math.abs(v - x[i + p]) > limit && Math.abs(v - (x[i - p] + x[i + p]) / 2) > limit) spikes.push(i);
  }
  const spikeRuns: [number, number][] = [];
  for (const i of spikes) {
    const last = spikeRuns[spikeRuns.length - 1];
    if (last && last[1] === i - 1) last[1] = i;
    else spikeRuns.push([i, i]);
  }
  for (const [a, b] of spikeRuns.slice(0, MAX_PER_KIND)) {
    let worst = a;
    for (let i = a; i <= b; i++) if (Math.abs(x[i]) > Math.abs(x[worst])) worst = i;
    out.push({ kind: 'spike', startS: t(a), endS: t(b + 1), severity: 'warning', label: 'Spike', reason: `Reaches ${x[worst].toPrecision(4)} where the neighbouring cycles are near ${((x[worst - p] + x[worst + p]) / 2).toPrecision(4)}: more than ${spikeFactor}× the nominal cycle RMS (${nominal.toPrecision(4)}) away.` });
  }

  // Sags and swells: cycle RMS outside ±band of nominal, merged over consecutive cycles.
  for (const [kind, test] of [['sag', (r: number) => r < (1 - band) * nominal], ['swell', (r: number) => r > (1 + band) * nominal]] as const) {
    for (const [a, b] of runs(cycleRms.length, (k) => test(cycleRms[k])).slice(0, MAX_PER_KIND)) {
      const extreme = kind === 'sag' ? Math.min(...cycleRms.slice(a, b + 1)) : Math.max(...cycleRms.slice(a, b + 1));
      out.push({
        kind,
        startS: t(Math.round(a * period)),
        endS: t(Math.round((b + 1) * period)),
        severity: 'warning',
        label: kind === 'sag' ? 'Sag' : 'Swell',
        reason: `Cycle RMS ${kind === 'sag' ? 'falls' : 'rises'} to ${extreme.toPrecision(4)} (${((100 * extreme) / nominal).toFixed(1)} % of the nominal ${nominal.toPrecision(4)}) for ${b - a + 1} cycle(s); the band is ±${(band * 100).toFixed(0)} %.`,
      });
    }
  }

  // Frequency deviation: rising zero crossings whose spacing departs from the record's period.
  let sum = 0;
  let valid = 0;
  for (const v of x) {
    if (Number.isNaN(v)) continue;
    sum += v;
    valid++;
  }
  const mean = sum / Math.max(1, valid);
  const crossings = risingZeroCrossings(x, mean, nominal, min - mean, max - mean).times;
  const off = (k: number) => Math.abs((crossings[k + 1] - crossings[k]) / period - 1) > freqTol;
  for (const [a, b] of runs(crossings.length - 1, off).slice(0, MAX_PER_KIND)) {
    const len = (crossings[b + 1] - crossings[a]) / (b - a + 1);
    out.push({ kind: 'frequency', startS: t0 + crossings[a] / sampleRate, endS: t0 + crossings[b + 1] / sampleRate, severity: 'info', label: 'Frequency deviation', reason: `${b - a + 1} cycle(s) at about ${(sampleRate / len).toPrecision(4)} Hz against ${frequency.toPrecision(5)} Hz for the record (tolerance ±${(freqTol * 100).toFixed(1)} %).` });
  }
  return out;
}
