import type { ChannelScaling, ValuesSide } from './channelScaling';
import type { ComtradeConfig, DigitalChannelConfig } from './ComtradeConfig';
import type { ComtradeTimeBase } from './comtradeTimeBase';

export interface ComtradeChannel {
  /** The channel id of the .cfg, or A1, A2… when it is empty. */
  name: string;
  unit: string;
  /** Values on `scaling.side`, in `unit`; a missing value is NaN. */
  samples: Float64Array;
  invalidCount: number;
  /** .dat line of the first missing value (ASCII), or null (binary, or none). */
  firstInvalidLine: number | null;
  scaling: ChannelScaling;
}

export interface DigitalChannelStates {
  config: DigitalChannelConfig;
  initialState: 0 | 1;
  /** All changes of state; `changes` keeps the first ones only. */
  changeCount: number;
  /** Time in seconds on the record's time axis, and the state from then on. */
  changes: { sample: number; timeS: number; state: 0 | 1 }[];
}

/** A COMTRADE record read: its configuration, time base and channels, ready for the analysis. */
export interface ComtradeRecord {
  config: ComtradeConfig;
  /** The side asked for; a channel without a usable ratio stays on its recorded side (see its scaling). */
  values: ValuesSide;
  timeBase: ComtradeTimeBase;
  /** Line ending of the .cfg text. */
  lineEnding: 'CRLF' | 'LF';
  /** Whether the record came as one combined .cff. */
  combined: boolean;
  channels: ComtradeChannel[];
  digital: DigitalChannelStates[];
}
