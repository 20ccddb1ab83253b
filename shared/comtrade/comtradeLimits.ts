import { DEFAULT_READ_LIMITS, type ReadLimits } from '../csv/readLimits';

/**
 * Bounds on what the COMTRADE reader accepts. Every count in a .cfg is the sender's word, so each is
 * checked against these before anything is allocated from it. The channel, line, head and sample
 * bounds are the CSV reader's own (`ReadLimits`): the .cfg (or the text sections of a .cff) is the head.
 */
export interface ComtradeLimits extends Pick<ReadLimits, 'maxChannels' | 'maxLineChars' | 'maxHeadBytes' | 'maxSamples'> {
  /** Digital (status) channels: kept as metadata, so many more are allowed than analog ones. */
  maxDigitalChannels: number;
  /** Sample-rate lines of the .cfg. */
  maxRates: number;
  /** Characters kept of a name (station, device, channel id, unit, phase, circuit): what the database keeps of a channel name. */
  maxNameChars: number;
  /** State changes kept per digital channel; further ones are counted only. */
  maxDigitalChanges: number;
}

export const DEFAULT_COMTRADE_LIMITS: ComtradeLimits = {
  maxChannels: DEFAULT_READ_LIMITS.maxChannels,
  maxLineChars: DEFAULT_READ_LIMITS.maxLineChars,
  maxHeadBytes: DEFAULT_READ_LIMITS.maxHeadBytes,
  maxSamples: DEFAULT_READ_LIMITS.maxSamples,
  maxDigitalChannels: 1024,
  maxRates: 999,
  maxNameChars: 120,
  maxDigitalChanges: 200,
};

/** The defaults with the caller's bounds over them (undefined ones left out). */
export function comtradeLimits(given: Partial<ComtradeLimits> = {}): ComtradeLimits {
  const out = { ...DEFAULT_COMTRADE_LIMITS };
  for (const key of Object.keys(out) as (keyof ComtradeLimits)[]) if (given[key] !== undefined) out[key] = given[key];
  return out;
}
