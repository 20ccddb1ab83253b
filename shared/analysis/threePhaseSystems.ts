import type { SystemSpec, ThreePhaseSystem } from '../schemas/threePhase';
import { analyzeThreePhase, fundamentalPhasor } from './analyzeThreePhase';
import { detectThreePhase, mayHoldThreePhase } from './detectThreePhase';
import { estimateFrequency } from './frequency';
import { abs, argDeg } from './phasor';
import type { Samples } from './samples';
import { timeDomainFigures } from './timeDomainFigures';
import { wholeCycleWindow } from './wholeCycleWindow';

export interface NamedChannel {
  name: string;
  unit: string;
  samples: Samples;
}

/** Prefixed units the three-phase figures are brought back to V and A from. */
const TO_BASE: Record<string, number> = { mV: 1e-3, kV: 1e3, mA: 1e-3, kA: 1e3 };
const VOLTAGE = new Set(['V', 'mV', 'kV']);

const hasInvalid = (x: Samples) => x.some((v) => Number.isNaN(v));

/**
 * Fundamentals of every channel at one reference frequency (the first complete voltage channel's),
 * over its whole cycles, so their angles can be compared. Null without a steady fundamental.
 */
function referenceFundamentals(channels: NamedChannel[], sampleRate: number) {
  const ref = channels.find((c) => VOLTAGE.has(c.unit) && !hasInvalid(c.samples));
  if (!ref) return null;
  const x = ref.samples;
  const freq = estimateFrequency(x, sampleRate, timeDomainFigures(x));
  const win = wholeCycleWindow(x.length, sampleRate, freq.hz);
  if (win.cycles === null) return null;
  const { sampleCount, cycles } = win;
  return channels.map((c) => {
    if (c.samples.length < sampleCount || hasInvalid(c.samples)) return null;
    const p = fundamentalPhasor(c.samples, sampleCount, cycles);
    return { rms: abs(p), angleDeg: argDeg(p) };
  });
}

/**
 * The three-phase systems of a capture: the sets a user stated, or else those found from channel
 * names and fundamentals, each analysed (line-to-line RMS, sequence, unbalance, IEEE 1459 powers).
 * Channels in mV, kV, mA or kA are brought to V and A first. Sets that cannot be analysed (a
 * channel index beyond the capture, no steady fundamental, invalid samples) are left out.
 *
 * @param channels the capture's channels in engineering units, same rate and instants
 * @param sampleRate samples per second
 * @param t0 time of the first sample, in s
 * @param stated the user's sets, or null to find them
 */
export function threePhaseSystems(channels: NamedChannel[], sampleRate: number, t0: number, stated: SystemSpec[] | null): ThreePhaseSystem[] {
  let sets: (SystemSpec & { detectedBy: ThreePhaseSystem['detectedBy'] })[];
  if (stated) {
    sets = stated.filter((s) => [...s.voltageChannels, ...(s.currentChannels ?? [])].every((i) => i < channels.length)).map((s) => ({ ...s, detectedBy: 'user' as const }));
  } else {
    // Most captures have one or two voltages: no set to find, and no fundamental to estimate (35–100 ms
    // on a 1 M-sample channel).
    if (!mayHoldThreePhase(channels.map((c) => c.unit))) return [];
    const fundamentals = referenceFundamentals(channels, sampleRate);
    if (!fundamentals) return [];
    sets = detectThreePhase(channels.map((c, i) => ({ name: c.name, unit: c.unit, fundamental: fundamentals[i] })));
  }
  const inBase = new Map<number, Samples>();
  const base = (i: number): Samples => {
    const c = channels[i];
    const k = TO_BASE[c.unit];
    if (!k) return c.samples;
    if (!inBase.has(i)) inBase.set(i, c.samples.map((v) => v * k));
    return inBase.get(i)!;
  };
  const out: ThreePhaseSystem[] = [];
  for (const s of sets) {
    const [a, b, c] = s.voltageChannels;
    const currents = s.currentChannels ? (s.currentChannels.map(base) as [Samples, Samples, Samples]) : null;
    const r = analyzeThreePhase({ voltages: [base(a), base(b), base(c)], currents, connection: s.connection }, sampleRate, t0);
    if (r) out.push({ ...r, voltageChannels: s.voltageChannels, currentChannels: s.currentChannels ?? null, detectedBy: s.detectedBy });
  }
  return out;
}
