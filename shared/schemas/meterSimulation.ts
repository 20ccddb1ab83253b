import { z } from 'zod';

/** Time constants the simulation accepts, in seconds: the brief's 1 ms to 10 s, stable over all of it. */
export const TAU_MIN_S = 1e-3;
export const TAU_MAX_S = 10;
/** Samples a simulation reads from a capture; a longer span answers 400 naming this limit. */
export const MAX_SIMULATION_SPAN_SAMPLES = 2_000_000;

const Tau = z.number().min(TAU_MIN_S, `Time constants start at ${TAU_MIN_S} s`).max(TAU_MAX_S, `Time constants end at ${TAU_MAX_S} s`);

/**
 * A meter's analog front end: input coupling, converter, averaging, crest-factor headroom and display.
 * Readings come out in the channel's unit.
 */
export const FrontEndProfile = z.object({
  type: z.enum(['averaging', 'peak', 'trueRms']),
  coupling: z.enum(['dc', 'ac']),
  /** AC coupling capacitor's time constant; 1 s when not given. */
  couplingTauS: Tau.optional(),
  /** RC of the averaging filter (averaging and true RMS), or the hold capacitor's discharge (peak). */
  averagingTauS: Tau,
  /** Full-wave, or half-wave (scaled ×2 by averaging converters); full when not given. */
  rectifier: z.enum(['full', 'half']).optional(),
  /** Display updates per second (sample-and-hold); 3 when not given. */
  displayRateHz: z.number().min(0.1).max(50).optional(),
  /** Display counts (e.g. 6000); no quantisation when not given. */
  counts: z.number().int().min(10).max(10_000_000).optional(),
  /** Crest factor the input stage handles at full scale; with rangeFullScale it sets the clipping level. */
  crestFactorLimit: z.number().min(1).max(20).optional(),
  /** Full scale of the range in use, in the channel's unit; auto-ranging when not given. */
  rangeFullScale: z.number().positive().max(1e9).optional(),
  /** One RC section, or two in cascade (a critically damped two-pole filter); 1 when not given. */
  filterOrder: z.union([z.literal(1), z.literal(2)]).optional(),
  /** Peak converters: the diode's charging time constant; an ideal diode when not given. */
  chargeTauS: z.number().min(1e-6).max(TAU_MAX_S).optional(),
  /** True RMS converters: the implicit loop (default) or explicit square, average, root. */
  rmsConverter: z.enum(['implicit', 'explicit']).optional(),
});
export type FrontEndProfile = z.infer<typeof FrontEndProfile>;

/** Body of POST /api/captures/:id/meter-simulation. */
export const MeterSimulationRequest = z.object({
  channel: z.number().int().min(0),
  profile: FrontEndProfile,
  /** The span in capture time (seconds); the whole record when not given. */
  fromS: z.number().optional(),
  toS: z.number().optional(),
  /** Loop the span until the reading has settled (bounded in time and work). */
  repeat: z.literal(true).optional(),
  /** 'connected': the meter is connected at the span's start; 'settled': it has long been reading the span's first cycle. */
  start: z.enum(['connected', 'settled']).optional(),
});
export type MeterSimulationRequest = z.infer<typeof MeterSimulationRequest>;

/** A value at a time, in seconds from the start of the run. */
export const TimePoint = z.object({ tS: z.number(), value: z.number() });
export type TimePoint = z.infer<typeof TimePoint>;

/** One sentence on what to do with this meter on this waveform, and its kind. */
export const MeterAdvice = z.object({
  kind: z.enum(['wait', 'unsteady', 'clipped', 'overRange', 'notSettled', 'noSignal']),
  sentence: z.string(),
});
export type MeterAdvice = z.infer<typeof MeterAdvice>;

/** What the simulated meter does over time, and where it settles. */
export const MeterSimulationResponse = z.object({
  /** The converter output (in reading units) against seconds since the start; min and max of each bucket, at most 2,000 points. */
  trace: z.array(TimePoint),
  /** What the display shows from each update on; null while it shows over-range. */
  display: z.array(z.object({ tS: z.number(), value: z.number().nullable() })),
  /**
   * Where the reading settles: on the looped span, or (played once) on the span's last cycles, where a
   * waveform that changes on the way leaves it.
   */
  settled: z.object({
    /** The final reading as the display shows it (rounded to its counts). */
    value: z.number(),
    /** When the period-averaged reading enters and stays within 1 % of the final one; null if not within the run. */
    settlingTimeS: z.number().nullable(),
    /** Peak-to-peak ripple of the converter output once settled. */
    ripplePeakToPeak: z.number(),
    /** Of that, the slow wander: the swing left after averaging over each fundamental period (a hunting motor, a cycling load). */
    wanderPeakToPeak: z.number(),
  }),
  /** The converter's mean output once every filter has settled on the looped span, at the capture's own rate. */
  steadyStateReading: z.number(),
  advice: MeterAdvice,
  run: z.object({
    fromS: z.number(),
    toS: z.number(),
    start: z.enum(['connected', 'settled']),
    simulatedS: z.number(),
    loops: z.number(),
    /** Fundamental found in the span (Hz), or null when aperiodic. */
    fundamentalHz: z.number().nullable(),
    /** Rate of the simulated run: the capture's, or lower by `decimation` for long looped runs. */
    sampleRateHz: z.number(),
    decimation: z.number(),
    /** Final reading of the decimated run against the full-rate one, in %; null without decimation. */
    decimationErrorPercent: z.number().nullable(),
  }),
  /** Display resolution (one count) in the channel's unit, or null without counts. */
  resolution: z.number().nullable(),
  /** Share of the simulated samples the input stage clipped (crest-factor headroom). */
  clippedFraction: z.number(),
  notes: z.array(z.string()),
});
export type MeterSimulationResponse = z.infer<typeof MeterSimulationResponse>;
