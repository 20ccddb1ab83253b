/**
 * Bounds on what the COMTRADE reader accepts. Every count in a .cfg is the sender's word, so each is
 * checked against these before anything is allocated from it. The analog-channel and sample bounds
 * are the CSV reader's (64 channels; rows × channels within the server's memory budget).
 */
export interface ComtradeLimits {
  /** Analog channels, the ones analysed (the CSV reader's channel bound). */
  maxChannels: number;
  /** Digital (status) channels: kept as metadata, so many more are allowed. */
  maxDigitalChannels: number;
  /** Sample-rate lines of the .cfg. */
  maxRates: number;
  /** Characters in one line of a .cfg or of an ASCII .dat. */
  maxLineChars: number;
  /** Characters kept of a name (station, device, channel id, unit, phase, circuit). */
  maxNameChars: number;
  /** Bytes of the .cfg (or of the sections of a .cff before its data). */
  maxConfigBytes: number;
  /** Samples in all: records × analog channels. */
  maxSamples: number;
  /** State changes kept per digital channel; further ones are counted only. */
  maxDigitalChanges: number;
}

export const DEFAULT_COMTRADE_LIMITS: ComtradeLimits = {
  maxChannels: 64,
  maxDigitalChannels: 1024,
  maxRates: 999,
  maxLineChars: 16_384,
  maxNameChars: 120,
  maxConfigBytes: 1024 * 1024,
  maxSamples: 200_000_000,
  maxDigitalChanges: 200,
};

/** The defaults with the caller's bounds over them. */
export const comtradeLimits = (given: Partial<ComtradeLimits> = {}): ComtradeLimits => ({ ...DEFAULT_COMTRADE_LIMITS, ...given });
