import type { SystemSpec } from '../schemas/threePhase';
import { wrapDeg } from './phasor';
import { parsePhaseName } from './phaseNames';

/** What detection knows of a channel: its name and unit, and its fundamental at the record's frequency. */
export interface ChannelForDetection {
  name: string;
  unit: string;
  /** Fundamental RMS and angle (degrees) at a common reference frequency, or null without one. */
  fundamental: { rms: number; angleDeg: number } | null;
}

export type DetectedSystem = SystemSpec & { detectedBy: 'names' | 'angles' };

const VOLTAGE_UNITS = new Set(['V', 'mV', 'kV']);

/** Whether channels of these units could hold a three-phase set at all: it takes three voltages. */
export const mayHoldThreePhase = (units: string[]) => units.filter((u) => VOLTAGE_UNITS.has(u)).length >= 3;
const CURRENT_UNITS = new Set(['A', 'mA', 'kA']);
/** Fundamentals of a set may stray this far from 120° apart (an unbalanced or faulted supply still counts). */
const ANGLE_TOLERANCE_DEG = 20;
/** Sets found by angles alone must also have magnitudes within this share of each other. */
const MAGNITUDE_SPREAD = 0.25;
/** Beyond this many unnamed channels of one kind, triples are not searched (C(24,3) = 2024 is cheap). */
const MAX_SEARCHED = 24;

/** How far three angles, taken in order, are from a positive sequence 0°, −120°, +120° (degrees, worst pair). */
function sequenceError(angles: number[]): number {
  return Math.max(Math.abs(wrapDeg(angles[0] - angles[1] - 120)), Math.abs(wrapDeg(angles[1] - angles[2] - 120)), Math.abs(wrapDeg(angles[2] - angles[0] - 120)));
}

/** Named sets: line-to-neutral L1, L2, L3 (wye) or L1-L2, L2-L3, L3-L1 (delta) of one family. */
function byNames(channels: ChannelForDetection[], units: Set<string>, used: Set<number>): { ids: [number, number, number]; connection: 'wye' | 'delta' }[] {
  const groups = new Map<string, (number | undefined)[]>();
  channels.forEach((c, i) => {
    if (!units.has(c.unit) || used.has(i)) return;
    const p = parsePhaseName(c.name);
    if (!p) return;
    // A line-to-line name counts in the order L1-L2, L2-L3, L3-L1 only: L2-L1 would need its sign flipped.
    if (p.to !== null && p.to !== (p.phase + 1) % 3) return;
    const key = `${p.family}:${p.to === null ? 'wye' : 'delta'}`;
    const slots = groups.get(key) ?? [undefined, undefined, undefined];
    slots[p.phase] ??= i;
    groups.set(key, slots);
  });
  return [...groups.entries()]
    .filter(([, s]) => s.every((i) => i !== undefined))
    .map(([key, s]) => ({ ids: s as [number, number, number], connection: key.endsWith('wye') ? ('wye' as const) : ('delta' as const) }));
}

/** Unnamed sets: three channels of similar size whose fundamentals are about 120° apart, best first. */
function byAngles(channels: ChannelForDetection[], units: Set<string>, used: Set<number>): [number, number, number][] {
  const pool = channels.map((c, i) => ({ c, i })).filter(({ c, i }) => units.has(c.unit) && !used.has(i) && c.fundamental && c.fundamental.rms > 0).slice(0, MAX_SEARCHED);
  const found: { ids: [number, number, number]; error: number }[] = [];
  for (let a = 0; a < pool.length; a++)
    for (let b = a + 1; b < pool.length; b++)
      for (let c = b + 1; c < pool.length; c++) {
        const trio = [pool[a], pool[b], pool[c]];
        const mags = trio.map((t) => t.c.fundamental!.rms);
        if (Math.min(...mags) < (1 - MAGNITUDE_SPREAD) * Math.max(...mags)) continue;
        // Either order of the later two may be the positive sequence.
        for (const order of [[0, 1, 2], [0, 2, 1]]) {
          const error = sequenceError(order.map((k) => trio[k].c.fundamental!.angleDeg));
          if (error <= ANGLE_TOLERANCE_DEG) found.push({ ids: order.map((k) => trio[k].i) as [number, number, number], error });
        }
      }
  found.sort((x, y) => x.error - y.error);
  const taken = new Set<number>();
  const out: [number, number, number][] = [];
  for (const f of found) {
    if (f.ids.some((i) => taken.has(i))) continue;
    f.ids.forEach((i) => taken.add(i));
    out.push(f.ids);
  }
  return out;
}

/** Orders a set of three currents like its voltages: the rotation whose angles sit closest to the voltages'. */
function alignCurrents(channels: ChannelForDetection[], volts: [number, number, number], amps: [number, number, number]): [number, number, number] {
  const rotations: [number, number, number][] = [amps, [amps[1], amps[2], amps[0]], [amps[2], amps[0], amps[1]]];
  const gap = (r: [number, number, number]) =>
    r.reduce((s, id, k) => s + Math.abs(wrapDeg((channels[id].fundamental?.angleDeg ?? 0) - (channels[volts[k]].fundamental?.angleDeg ?? 0))), 0);
  return rotations.reduce((best, r) => (gap(r) < gap(best) ? r : best));
}

/**
 * Finds three-phase sets among a capture's channels: first from names (L1/L2/L3, A/B/C, R/S/T, U/V/W,
 * with -N for line-to-neutral, or pairs such as L1-L2 for line-to-line), kept when their fundamentals
 * are about 120° apart; then among the remaining voltage channels, from fundamentals alone. Each set
 * takes three current channels found the same way when there are any left.
 */
export function detectThreePhase(channels: ChannelForDetection[]): DetectedSystem[] {
  const usedV = new Set<number>();
  const usedI = new Set<number>();
  const out: DetectedSystem[] = [];
  const angles = (ids: number[]) => ids.map((i) => channels[i].fundamental?.angleDeg ?? NaN);
  const plausible = (ids: number[]) => sequenceError(angles(ids)) <= ANGLE_TOLERANCE_DEG;
  const namedCurrents = byNames(channels, CURRENT_UNITS, usedI).filter((s) => s.connection === 'wye' && plausible(s.ids));

  const take = (ids: [number, number, number], connection: 'wye' | 'delta', detectedBy: 'names' | 'angles') => {
    ids.forEach((i) => usedV.add(i));
    const named = namedCurrents.find((s) => !s.ids.some((i) => usedI.has(i)));
    const free = named ? named.ids : byAngles(channels, CURRENT_UNITS, usedI)[0];
    const currentChannels = free ? (named ? free : alignCurrents(channels, ids, free)) : null;
    currentChannels?.forEach((i) => usedI.add(i));
    out.push({ voltageChannels: ids, currentChannels, connection, detectedBy });
  };
  for (const s of byNames(channels, VOLTAGE_UNITS, usedV)) if (plausible(s.ids)) take(s.ids, s.connection, 'names');
  for (const ids of byAngles(channels, VOLTAGE_UNITS, usedV)) take(ids, 'wye', 'angles');
  return out;
}
