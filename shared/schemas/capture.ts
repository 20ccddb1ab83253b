import { z } from 'zod';
import { ChannelAnalysis } from './analysis';
import { ChannelSetup, UploadChannelSetupField } from './channelSetup';
import { ChannelVoltageEvents } from './powerQuality';
import { SystemSpec, ThreePhaseSystem } from './threePhase';
import { ComtradeSummary } from './comtrade';

export const CaptureStatus = z.enum(['queued', 'processing', 'ready', 'failed']);
export type CaptureStatus = z.infer<typeof CaptureStatus>;

export const CaptureError = z.object({ code: z.string(), message: z.string(), line: z.number().int().optional() });
export type CaptureError = z.infer<typeof CaptureError>;

export const CaptureChannel = z.object({
  index: z.number().int(),
  name: z.string(),
  unit: z.string(),
  invalidCount: z.number().int(),
});
export type CaptureChannel = z.infer<typeof CaptureChannel>;

/** What the reader found in the file, shown beside the capture. */
export const DetectedFormat = z.object({
  encoding: z.string(),
  bom: z.boolean(),
  lineEnding: z.string(),
  delimiter: z.string(),
  decimal: z.string(),
  headerLine: z.number().int().nullable(),
  unitsLine: z.number().int().nullable(),
  dataStartLine: z.number().int(),
  timeColumn: z.string().nullable(),
  timeSource: z.enum(['column', 'preamble', 'given']),
  timeDeviationSamples: z.number(),
  rows: z.number().int(),
});
export type DetectedFormat = z.infer<typeof DetectedFormat>;

export const CaptureSummary = z.object({
  id: z.number().int(),
  projectId: z.number().int(),
  name: z.string(),
  status: CaptureStatus,
  error: CaptureError.nullable(),
  originalName: z.string(),
  sizeBytes: z.number(),
  uploadedBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  createdAt: z.string(),
  sampleRate: z.number().nullable(),
  sampleCount: z.number().nullable(),
  durationS: z.number().nullable(),
  channelCount: z.number().int(),
  tags: z.array(z.string()),
  /** Key figures of the first channel, once analysed. */
  keyFigures: z
    .object({ rms: z.number(), frequency: z.number().nullable(), thdPercent: z.number().nullable(), crestFactor: z.number().nullable(), unit: z.string() })
    .nullable(),
});
export type CaptureSummary = z.infer<typeof CaptureSummary>;

export const CaptureDetail = CaptureSummary.extend({
  t0: z.number().nullable(),
  sha256: z.string(),
  channels: z.array(CaptureChannel),
  detected: DetectedFormat.nullable(),
  metadata: z.array(z.object({ key: z.string(), value: z.string(), line: z.number().int() })),
  engineVersion: z.number().int().nullable(),
  readyAt: z.string().nullable(),
  /** How channels are turned into engineering units (the file itself is never changed). */
  channelSetup: z.array(ChannelSetup),
  /** Three-phase sets as a user stated them, or null when they are found automatically. */
  systemsSpec: z.array(SystemSpec).nullable(),
  declaredVoltage: z.number().nullable(),
  /** A re-analysis is queued or running; the figures shown are the last good ones until it is done. */
  reanalysing: z.boolean(),
  /** 'comtrade': originalName is the .cfg (or .cff), dataName the .dat beside it. */
  format: z.enum(['csv', 'comtrade']),
  dataName: z.string().nullable(),
  comtrade: ComtradeSummary.nullable(),
});
export type CaptureDetail = z.infer<typeof CaptureDetail>;

export const CaptureListQuery = z.object({
  projectId: z.coerce.number().int().positive().optional(),
  status: CaptureStatus.optional(),
  q: z.string().trim().max(200).optional(),
  tag: z.string().trim().max(40).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  sort: z.enum(['createdAt', 'name', 'status', 'sampleRate', 'sampleCount', 'sizeBytes']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
});
export type CaptureListQuery = z.infer<typeof CaptureListQuery>;

export const CaptureList = z.object({ items: z.array(CaptureSummary), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });
export type CaptureList = z.infer<typeof CaptureList>;

/** Form fields that come with an uploaded file. */
export const UploadFields = z.object({
  name: z.string().trim().max(200).optional(),
  projectId: z.coerce.number().int().positive().optional(),
  sampleRate: z.coerce.number().positive().optional(),
  /** JSON: channel setups to apply from the first analysis on (UploadChannelSetup). */
  channelSetup: UploadChannelSetupField.optional(),
  /** For a COMTRADE record: values on the primary (default) or secondary side of the instrument transformers. */
  comtradeValues: z.enum(['primary', 'secondary']).optional(),
});
export type UploadFields = z.infer<typeof UploadFields>;

/** Which kept file GET /captures/:id/original serves: the uploaded file (a CSV, .cfg or .cff), or the .dat beside a .cfg. */
export const OriginalQuery = z.object({ part: z.enum(['file', 'data']).default('file') });

export const UploadResponse = z.object({ id: z.number().int(), status: CaptureStatus, duplicate: z.boolean() });
export type UploadResponse = z.infer<typeof UploadResponse>;

export const UpdateCaptureRequest = z
  .object({ name: z.string().trim().min(1).max(200).optional(), tags: z.array(z.string().trim().min(1).max(40)).max(20).optional() })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type UpdateCaptureRequest = z.infer<typeof UpdateCaptureRequest>;

/** Shows a COMTRADE capture's values on the other side of its instrument transformers (read again). */
export const ComtradeValuesRequest = z.object({ values: z.enum(['primary', 'secondary']) });
export type ComtradeValuesRequest = z.infer<typeof ComtradeValuesRequest>;

export const SampleRateRequest = z.object({ sampleRate: z.number().positive().max(1e12) });

export const AnalysisResponse = z.object({
  engineVersion: z.number().int(),
  channels: z.array(ChannelAnalysis),
  /** Three-phase sets and their figures. */
  systems: z.array(ThreePhaseSystem),
  /** Dips, swells and interruptions of each voltage channel against its declared voltage. */
  voltageEvents: z.array(ChannelVoltageEvents),
});
export type AnalysisResponse = z.infer<typeof AnalysisResponse>;

export const SamplesQuery = z.object({
  channel: z.coerce.number().int().min(0),
  fromS: z.coerce.number().optional(),
  toS: z.coerce.number().optional(),
  // Up to a million raw samples, for figures of a selected span computed in the browser.
  points: z.coerce.number().int().min(2).max(1_000_000).default(2000),
});
export type SamplesQuery = z.infer<typeof SamplesQuery>;

const SamplesBase = z.object({
  channel: z.number().int(),
  /** Time of element 0, in seconds; element i lies at t0S + i·stepS. */
  t0S: z.number(),
  /** Seconds between elements: one sample period (raw) or one bucket (minmax). */
  stepS: z.number(),
  startIndex: z.number().int(),
  sampleCount: z.number().int(),
});

/** The samples themselves; invalid samples (empty or overrange cells) are null. */
export const RawSamples = SamplesBase.extend({ mode: z.literal('raw'), values: z.array(z.number().nullable()) });
export type RawSamples = z.infer<typeof RawSamples>;

/** Lowest and highest sample of each bucket; a bucket of invalid samples only is null in both. */
export const MinMaxSamples = SamplesBase.extend({ mode: z.literal('minmax'), min: z.array(z.number().nullable()), max: z.array(z.number().nullable()) });
export type MinMaxSamples = z.infer<typeof MinMaxSamples>;

/**
 * A span of one channel: the samples themselves (`raw`), or min/max per bucket (`minmax`) when the span
 * holds more samples than points asked. A union on `mode`, so that every reader handles both answers.
 */
export const SamplesResponse = z.discriminatedUnion('mode', [RawSamples, MinMaxSamples]);
export type SamplesResponse = z.infer<typeof SamplesResponse>;
