import { z } from 'zod';

const channelIndex = z.number().int().min(0).max(255);
const three = <T extends z.ZodType>(t: T) => z.tuple([t, t, t]);
const distinct = (ids: number[]) => new Set(ids).size === ids.length;

export const Connection = z.enum(['wye', 'delta']);
export type Connection = z.infer<typeof Connection>;

/** One three-phase set as a user states it: which channels, and how the voltages were taken. */
export const SystemSpec = z
  .object({
    /** wye: line-to-neutral L1, L2, L3; delta: line-to-line L1-L2, L2-L3, L3-L1. */
    voltageChannels: three(channelIndex),
    /** Line currents of L1, L2, L3, or none. */
    currentChannels: three(channelIndex).nullable().optional(),
    connection: Connection,
  })
  .strict()
  .refine((s) => distinct([...s.voltageChannels, ...(s.currentChannels ?? [])]), { message: 'A channel can be used only once in a set', path: ['voltageChannels'] });
export type SystemSpec = z.infer<typeof SystemSpec>;

/** The body of PUT /api/captures/:id/systems. */
export const SystemsRequest = z.array(SystemSpec).max(8, 'At most 8 three-phase sets per capture');
export type SystemsRequest = z.infer<typeof SystemsRequest>;

/** IEEE Std 1459-2010 three-phase quantities: V, A, W, var, VA. */
export const ThreePhasePower = z.object({
  Ve: z.number(),
  Ie: z.number(),
  Se: z.number(),
  Ve1: z.number(),
  Ie1: z.number(),
  Se1: z.number(),
  P: z.number(),
  P1plus: z.number(),
  Q1plus: z.number(),
  S1plus: z.number(),
  SU1: z.number(),
  SeN: z.number(),
  PF: z.number().nullable(),
});
export type ThreePhasePower = z.infer<typeof ThreePhasePower>;

/** The analysis of one three-phase set, as GET /api/captures/:id/analysis returns it in `systems`. */
export const ThreePhaseSystem = z.object({
  kind: z.literal('threePhase'),
  voltageChannels: three(z.number().int()),
  currentChannels: three(z.number().int()).nullable(),
  connection: Connection,
  /** How the set was found: from channel names, from fundamentals 120° apart, or set by a user. */
  detectedBy: z.enum(['names', 'angles', 'user']),
  /** Fundamental of the first voltage channel, in Hz. */
  frequency: z.number(),
  window: z.object({ startS: z.number(), endS: z.number(), cycles: z.number().int() }),
  /** True RMS of L1-L2, L2-L3, L3-L1 (wye: from the sample-by-sample differences), in V. */
  lineToLineRms: three(z.number()),
  /** Fundamental RMS of the voltage channels, in V. */
  fundamentalRms: three(z.number()),
  /** Fundamental angles of the voltage channels relative to the first, in degrees. */
  phaseAnglesDeg: three(z.number()),
  /** Fundamental RMS of the currents (A) and their angles relative to the first voltage channel. */
  currentFundamentalRms: three(z.number()).nullable(),
  currentAnglesDeg: three(z.number()).nullable(),
  /** RMS magnitudes of the fundamental symmetrical components of the voltage channels, in V. */
  sequence: z.object({ positive: z.number(), negative: z.number(), zero: z.number() }),
  /** V2/V1 and V0/V1 × 100 (IEC 61000-4-30, IEC 61000-2-12). */
  unbalance: z.object({ negativePercent: z.number().nullable(), zeroPercent: z.number().nullable() }),
  unbalanceSource: z.string(),
  /** Maximum deviation of a line voltage from the average of the three, over the average × 100. */
  lineVoltageUnbalance: z.object({ maxDeviationPercent: z.number().nullable(), source: z.string() }),
  power: ThreePhasePower.nullable(),
  powerSource: z.string().nullable(),
});
export type ThreePhaseSystem = z.infer<typeof ThreePhaseSystem>;
