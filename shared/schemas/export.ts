import { z } from 'zod';
import { Harmonic, IecAnalysis } from './analysis';

const flag = z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true');

/**
 * How a CSV is written. `point` (default): comma-separated, decimal point. `comma`: semicolon-separated,
 * decimal comma, with a UTF-8 byte-order mark so spreadsheets set to such a locale read it as Unicode.
 */
export const CsvQuery = z.object({ decimal: z.enum(['point', 'comma']).default('point'), bom: flag.optional() });
export type CsvQuery = z.infer<typeof CsvQuery>;

/** A span of samples to export, in seconds of the capture's time axis; the whole record when absent. */
export const SamplesExportQuery = CsvQuery.extend({
  fromS: z.coerce.number().finite().optional(),
  toS: z.coerce.number().finite().optional(),
}).refine((q) => q.fromS === undefined || q.toS === undefined || q.toS >= q.fromS, 'toS must not be before fromS');
export type SamplesExportQuery = z.infer<typeof SamplesExportQuery>;

const ExportChannel = z.object({ index: z.number().int(), name: z.string(), unit: z.string() });

/** figures.json: each channel's figures and meter readings by key, with each key's label and unit. */
export const FiguresExport = z.object({
  captureId: z.number().int(),
  name: z.string(),
  quantities: z.array(z.object({ key: z.string(), label: z.string(), unit: z.string().describe('"channel" for the channel unit') })),
  channels: z.array(ExportChannel.extend({ values: z.record(z.string(), z.number().nullable()) })),
});
export type FiguresExport = z.infer<typeof FiguresExport>;

/** harmonics.json: each channel's harmonics (RMS in the channel unit, % of the fundamental) and IEC groups. */
export const HarmonicsExport = z.object({
  captureId: z.number().int(),
  name: z.string(),
  channels: z.array(
    ExportChannel.extend({
      frequency: z.number().nullable(),
      thdPercent: z.number().nullable(),
      thdRPercent: z.number().nullable(),
      harmonics: z.array(Harmonic.extend({ percentOfFundamental: z.number().nullable() })),
      iec: IecAnalysis.nullable(),
    }),
  ),
});
export type HarmonicsExport = z.infer<typeof HarmonicsExport>;

/** samples.json: a span in engineering units; sample i of a channel is at t0S + i·stepS; invalid samples are null. */
export const SamplesExport = z.object({
  captureId: z.number().int(),
  name: z.string(),
  t0S: z.number(),
  stepS: z.number(),
  startIndex: z.number().int(),
  sampleCount: z.number().int(),
  channels: z.array(ExportChannel.extend({ values: z.array(z.number().nullable()) })),
});
export type SamplesExport = z.infer<typeof SamplesExport>;
