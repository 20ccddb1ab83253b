import { z } from 'zod';

/** An analog channel as its .cfg describes it, with the side its values are shown on. */
export const ComtradeAnalogChannel = z.object({
  index: z.number().int(),
  id: z.string(),
  phase: z.string(),
  circuit: z.string(),
  unit: z.string(),
  /** value = a·x + b for a raw data value x. */
  a: z.number(),
  b: z.number(),
  skewUs: z.number(),
  min: z.number().nullable(),
  max: z.number().nullable(),
  primary: z.number().nullable(),
  secondary: z.number().nullable(),
  ps: z.enum(['P', 'S']),
  /** The side Crestline's values are on; differs from the one asked for when the ratio is unusable (see note). */
  side: z.enum(['primary', 'secondary']),
  note: z.string().nullable(),
});
export type ComtradeAnalogChannel = z.infer<typeof ComtradeAnalogChannel>;

/** A digital (status) channel and where it changed state; `changes` keeps the first ones of `changeCount`. */
export const ComtradeDigitalChannel = z.object({
  index: z.number().int(),
  id: z.string(),
  phase: z.string(),
  circuit: z.string(),
  normalState: z.union([z.literal(0), z.literal(1)]),
  initialState: z.union([z.literal(0), z.literal(1)]),
  changeCount: z.number().int(),
  changes: z.array(z.object({ timeS: z.number(), state: z.union([z.literal(0), z.literal(1)]) })),
});
export type ComtradeDigitalChannel = z.infer<typeof ComtradeDigitalChannel>;

/** What a COMTRADE record's configuration says, kept with the capture. */
export const ComtradeSummary = z.object({
  edition: z.union([z.literal(1999), z.literal(2013)]),
  combined: z.boolean(),
  station: z.string(),
  device: z.string(),
  fileType: z.enum(['ASCII', 'BINARY', 'BINARY32', 'FLOAT32']),
  timeMultiplier: z.number(),
  lineFrequencyHz: z.number().nullable(),
  sampleRates: z.array(z.object({ hz: z.number(), endSample: z.number().int() })),
  timeSource: z.enum(['rate', 'timestamps', 'rates']),
  startTime: z.string().nullable(),
  triggerTime: z.string().nullable(),
  /** The trigger on the capture's time axis (0: the axis counts from it), or null when not given or outside the record. */
  triggerS: z.number().nullable(),
  values: z.enum(['primary', 'secondary']),
  timeCode: z.string().nullable(),
  localCode: z.string().nullable(),
  timeQuality: z.string().nullable(),
  leapSecond: z.string().nullable(),
  analog: z.array(ComtradeAnalogChannel),
  digital: z.array(ComtradeDigitalChannel),
});
export type ComtradeSummary = z.infer<typeof ComtradeSummary>;
