import { z } from 'zod';
import { ChannelAnalysis } from './analysis';

/** A span of a capture, in seconds on its time axis; the whole record when a bound is left out. */
export const SpanFiguresQuery = z.object({
  fromS: z.coerce.number().optional(),
  toS: z.coerce.number().optional(),
});
export type SpanFiguresQuery = z.infer<typeof SpanFiguresQuery>;

/** The engine's figures of every channel over a span: its analysis, or the reason it cannot be analysed soundly. */
export const SpanFiguresResponse = z.object({
  fromS: z.number(),
  toS: z.number(),
  sampleCount: z.number().int(),
  channels: z.array(z.object({ index: z.number().int(), analysis: ChannelAnalysis.nullable(), reason: z.string().nullable() })),
});
export type SpanFiguresResponse = z.infer<typeof SpanFiguresResponse>;
