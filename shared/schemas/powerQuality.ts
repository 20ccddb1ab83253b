import { z } from 'zod';
import { ThreePhaseSystem } from './threePhase';

export const VoltageEvent = z.object({
  kind: z.enum(['dip', 'swell', 'interruption']),
  startS: z.number(),
  endS: z.number(),
  durationS: z.number(),
  /** Residual voltage of a dip or interruption, maximum of a swell, in V. */
  extremeV: z.number(),
  extremePercent: z.number(),
  unfinished: z.boolean(),
});
export type VoltageEvent = z.infer<typeof VoltageEvent>;

/** The events of one voltage channel against the declared voltage that applied to it. */
export const ChannelVoltageEvents = z.object({
  channel: z.number().int(),
  /** In V; for a line-to-line channel the declared voltage × √3. */
  declaredVoltage: z.number(),
  /** Where the declared voltage came from: the capture, its project, or the nearest nominal voltage. */
  declaredFrom: z.enum(['capture', 'project', 'suggested']),
  thresholdsSource: z.string(),
  events: z.array(VoltageEvent),
});
export type ChannelVoltageEvents = z.infer<typeof ChannelVoltageEvents>;

/** What an analysis finds across channels: three-phase systems and voltage events. */
export const PowerQuality = z.object({ systems: z.array(ThreePhaseSystem), voltageEvents: z.array(ChannelVoltageEvents) });
export type PowerQuality = z.infer<typeof PowerQuality>;

export const TrendKind = z.enum(['rmsHalfCycle', 'rmsCycle', 'frequencyCycle']);

export const TrendQuery = z.object({
  channel: z.coerce.number().int().min(0).max(255),
  kind: TrendKind.default('rmsHalfCycle'),
  fromS: z.coerce.number().optional(),
  toS: z.coerce.number().optional(),
  /** Above this many values in the span, each bucket keeps its lowest and highest. */
  points: z.coerce.number().int().min(10).max(10_000).default(2000),
});
export type TrendQuery = z.infer<typeof TrendQuery>;

export const TrendResponse = z.object({
  channel: z.number().int(),
  kind: TrendKind,
  /** The values' unit: the channel's for RMS, Hz for frequency. */
  unit: z.string(),
  /** Values in the span before thinning. */
  total: z.number().int(),
  points: z.array(z.object({ tS: z.number(), value: z.number() })),
});
export type TrendResponse = z.infer<typeof TrendResponse>;

/** The body of PUT /api/captures/:id/declared-voltage: a voltage in V, or null for the project's or a suggestion. */
export const DeclaredVoltageRequest = z.object({ declaredVoltage: z.number().min(1).max(1_000_000).nullable() }).strict();
export type DeclaredVoltageRequest = z.infer<typeof DeclaredVoltageRequest>;
