import { z } from 'zod';

/** The span the figures are computed over: whole fundamental cycles when the signal is periodic. */
export const AnalysisWindow = z.object({
  startS: z.number(),
  endS: z.number(),
  /** Whole fundamental cycles in the window, or null when the signal is aperiodic. */
  cycles: z.number().int().nullable(),
  startIndex: z.number().int(),
  sampleCount: z.number().int(),
});
export type AnalysisWindow = z.infer<typeof AnalysisWindow>;

export const Harmonic = z.object({
  order: z.number().int(),
  frequency: z.number(),
  /** RMS value of the component, in the channel's unit. */
  rms: z.number(),
  /** Phase of the cosine component at the window start, in degrees (−180, 180]. */
  phaseDeg: z.number(),
});
export type Harmonic = z.infer<typeof Harmonic>;

export const MeterReading = z.object({
  reading: z.number(),
  /** Which true value the reading is compared against. */
  reference: z.enum(['acRms', 'rms']),
  errorPercent: z.number().nullable(),
  /** The reading against the true RMS of the whole signal (AC+DC): what a DC part hides. */
  errorVsTotalPercent: z.number().nullable(),
});
export type MeterReading = z.infer<typeof MeterReading>;

export const MeterReadings = z.object({
  averageResponding: MeterReading,
  trueRmsAc: MeterReading,
  trueRmsAcDc: MeterReading,
  peakResponding: MeterReading,
});
export type MeterReadings = z.infer<typeof MeterReadings>;

export const WarningCode = z.enum([
  'dcHiddenFromAcMeter',
  'highCrestFactor',
  'averagingMeterError',
  'shortWindow',
  'sampleRateTooLow',
  'clipping',
  'aperiodic',
  'invalidSamples',
]);
export type WarningCode = z.infer<typeof WarningCode>;

export const WarningSeverity = z.enum(['info', 'warning', 'danger']);
export type WarningSeverity = z.infer<typeof WarningSeverity>;

export const AnalysisWarning = z.object({
  code: WarningCode,
  severity: WarningSeverity,
  message: z.string(),
});
export type AnalysisWarning = z.infer<typeof AnalysisWarning>;

export const FrequencyDetail = z.object({
  method: z.enum(['zeroCrossing', 'zeroCrossingSmoothed']),
  /** Rising crossings used for the estimate. */
  crossings: z.number().int(),
  /** Standard deviation of the individual periods, in % of their mean. */
  periodSpreadPercent: z.number(),
  /** Relative change made by the spectral refinement, in %. */
  spectralCorrectionPercent: z.number(),
  confidence: z.enum(['high', 'medium', 'low']),
});
export type FrequencyDetail = z.infer<typeof FrequencyDetail>;

export const IecHarmonicGroup = z.object({
  order: z.number().int(),
  /** Harmonic group G_g,n (RMS), averaged over the windows as the root of the mean of squares. */
  groupRms: z.number(),
  /** Harmonic subgroup G_sg,n: the harmonic bin and its two neighbours. */
  subgroupRms: z.number(),
  /** Interharmonic group C_ig,n: every bin strictly between orders n and n+1. */
  interharmonicGroupRms: z.number(),
  /** Interharmonic centred subgroup C_isg,n: as above, less the bins next to each harmonic. */
  interharmonicSubgroupRms: z.number(),
});
export type IecHarmonicGroup = z.infer<typeof IecHarmonicGroup>;

export const IecAnalysis = z.object({
  mainsHz: z.union([z.literal(50), z.literal(60)]),
  cyclesPerWindow: z.number().int(),
  windows: z.number().int(),
  groups: z.array(IecHarmonicGroup),
  thdgPercent: z.number().nullable(),
  thdsPercent: z.number().nullable(),
});
export type IecAnalysis = z.infer<typeof IecAnalysis>;

export const ChannelAnalysis = z.object({
  window: AnalysisWindow,
  sampleRate: z.number(),
  mean: z.number(),
  rms: z.number(),
  acRms: z.number(),
  rectifiedAverage: z.number(),
  acRectifiedAverage: z.number(),
  peak: z.number(),
  min: z.number(),
  max: z.number(),
  peakToPeak: z.number(),
  crestFactor: z.number().nullable(),
  formFactor: z.number().nullable(),
  frequency: z.number().nullable(),
  frequencyDetail: FrequencyDetail.nullable(),
  harmonics: z.array(Harmonic),
  thdPercent: z.number().nullable(),
  thdRPercent: z.number().nullable(),
  iec: IecAnalysis.nullable(),
  meters: MeterReadings,
  warnings: z.array(AnalysisWarning),
});
export type ChannelAnalysis = z.infer<typeof ChannelAnalysis>;
