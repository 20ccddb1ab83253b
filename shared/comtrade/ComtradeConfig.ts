/**
 * The content of a COMTRADE configuration (.cfg), as IEEE C37.111-1999 clause 6 and the 2013 edition's
 * configuration clause lay it out (clause numbers from memory; the layout is summarised in DOMAIN.md §8e).
 */

/** How the .dat stores a record (the `ft` line): text, or little-endian int16, int32 or float32 values. */
export type DataFileType = 'ASCII' | 'BINARY' | 'BINARY32' | 'FLOAT32';

export interface AnalogChannelConfig {
  /** `An`: the 1-based channel index written in the file. */
  index: number;
  id: string;
  phase: string;
  /** `ccbm`: the circuit component being monitored. */
  circuit: string;
  unit: string;
  /** value = a·x + b, in `unit`, for a raw data value x. */
  a: number;
  b: number;
  /** Time skew of this channel from the record's sample time, in µs. */
  skewUs: number;
  /** Range of the raw data values. */
  min: number;
  max: number;
  /** Transformer ratio primary:secondary; both 0 or missing in files that give none. */
  primary: number;
  secondary: number;
  /** Whether a·x + b gives primary ('P') or secondary ('S') values. */
  ps: 'P' | 'S';
  /** Line of the .cfg (or .cff) where the channel is described. */
  line: number;
}

export interface DigitalChannelConfig {
  index: number;
  id: string;
  phase: string;
  circuit: string;
  /** `y`: the state of the input when the primary apparatus is in its normal state. */
  normalState: 0 | 1;
  line: number;
}

export interface SampleRateConfig {
  /** `samp`, in samples per second. */
  hz: number;
  /** `endsamp`: the number of the last sample at this rate. */
  endSample: number;
  line: number;
}

/** A date and time of the .cfg (`dd/mm/yyyy,hh:mm:ss.ssssss`), exact to the nanosecond. */
export interface ComtradeTimestamp {
  text: string;
  /** Milliseconds since 1970-01-01 of the whole second (the record's clock, whatever its time zone). */
  secondMs: number;
  /** Nanoseconds after that second. */
  nanos: number;
}

export interface ComtradeConfig {
  station: string;
  device: string;
  revYear: 1999 | 2013;
  analog: AnalogChannelConfig[];
  digital: DigitalChannelConfig[];
  /** `lf`, in Hz; null when left empty. */
  lineFrequencyHz: number | null;
  /** The sample-rate lines; empty when `nrates` is 0 (the time stamps give the time base). */
  rates: SampleRateConfig[];
  /** Records in the .dat: the last `endsamp`. */
  sampleCount: number;
  start: ComtradeTimestamp | null;
  trigger: ComtradeTimestamp | null;
  fileType: DataFileType;
  /** `timemult`: the .dat time stamps count in units of timemult µs. */
  timeMultiplier: number;
  /** 2013 only: `time_code,local_code` and `tmq_code,leapsec`, as written. */
  timeCode: string | null;
  localCode: string | null;
  timeQuality: string | null;
  leapSecond: string | null;
  /** Lines of the single-valued fields, for the file details. */
  lines: { station: number; counts: number; frequency: number; rates: number; start: number; trigger: number; fileType: number; timeMultiplier: number | null; timeCode: number | null; timeQuality: number | null };
}
