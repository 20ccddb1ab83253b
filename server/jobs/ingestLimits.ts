import type { Config } from '../config';

/**
 * Bytes one channel sample may take while a capture is processed, in the worst layout: the reader keeps
 * Float64 columns for the channel, a time column, an index column and a line number per row (one
 * channel: four Float64 per sample), then Float32 chunks and the pyramid are packed beside them.
 */
const BYTES_PER_SAMPLE_IN_FLIGHT = 40;

/** Time allowed to each parse or analysis task of a file: the floor plus a share per MiB. */
export function taskBudgetMs(config: Config, sizeBytes: number): number {
  return Math.round((config.INGEST_TIME_FLOOR_SECONDS + (sizeBytes / 2 ** 20) * config.INGEST_SECONDS_PER_MB) * 1000);
}

/** The most samples (rows × channels) one capture may hold, from the memory it may take. */
export function maxSamples(config: Config): number {
  return Math.floor((config.INGEST_MEMORY_MB * 2 ** 20) / BYTES_PER_SAMPLE_IN_FLIGHT);
}
