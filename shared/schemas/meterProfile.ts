import { z } from 'zod';

export const MeterType = z.enum(['averageResponding', 'trueRmsAc', 'trueRmsAcDc', 'peakResponding']);
export type MeterType = z.infer<typeof MeterType>;

/** A meter as its data sheet describes it. */
export const MeterProfile = z.object({
  name: z.string().max(120).optional(),
  type: MeterType,
  /** −3 dB frequency of the AC path, modelled as a first-order low-pass; null for unlimited. */
  bandwidthHz: z.number().positive().nullable().optional(),
  /** Crest factor the converter handles at full scale of the range. */
  crestFactorLimit: z.number().min(1).nullable().optional(),
  /** The range in use: its full-scale value and the display's counts (e.g. 6000). */
  range: z.object({ fullScale: z.number().positive(), displayCounts: z.number().int().positive() }).nullable().optional(),
  /** Accuracy spec: ±(percentOfReading % of reading + counts digits). */
  accuracy: z.object({ percentOfReading: z.number().min(0), counts: z.number().min(0) }).nullable().optional(),
});
export type MeterProfile = z.infer<typeof MeterProfile>;

export const MeterFlag = z.object({
  code: z.enum(['crestFactorExceeded', 'overRange', 'belowSpecifiedRange', 'fundamentalAboveBandwidth', 'bandwidthNotModelled', 'dcBlocked']),
  message: z.string(),
});
export type MeterFlag = z.infer<typeof MeterFlag>;

export const MeterPrediction = z.object({
  reading: z.number(),
  low: z.number(),
  high: z.number(),
  /** The true value the meter is meant to show: AC RMS, or AC+DC RMS for an AC+DC meter. */
  trueValue: z.number(),
  errorPercent: z.number().nullable(),
  trueValueInsideInterval: z.boolean(),
  flags: z.array(MeterFlag),
});
export type MeterPrediction = z.infer<typeof MeterPrediction>;
