import type { Config } from '../config';

/** Bytes one sample takes while a capture is processed: Float64 as read, Float32 packed, and the pyramid. */
const BYTES_PER_SAMPLE_IN_FLIGHT = 16;

/** Time allowed to each parse or analysis task of a file: the floor plus a share per MiB. */
export function taskBudgetMs(config: Config, sizeBytes: number): number {
  return Math.round((config.INGEST_TIME_FLOOR_SECONDS + (sizeBytes / 2 ** 20) * config.INGEST_SECONDS_PER_MB) * 1000);
}

/** The most samples (rows × channels) one capture may hold, from the memory it may take. */
export function maxSamples(config: Config): number {
  return Math.floor((config.INGEST_MEMORY_MB * 2 ** 20) / BYTES_PER_SAMPLE_IN_FLIGHT);
}
