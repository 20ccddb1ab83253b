import { channelScaling, type ChannelScaling, type ValuesSide } from './channelScaling';
import type { ComtradeConfig } from './ComtradeConfig';
import { DigitalStates } from './DigitalStates';

/**
 * Where the .dat readers put a record's values: one Float64Array per analog channel, sized once from
 * the .cfg's sample count (already checked against the limits), already scaled to the wanted side.
 */
export class RecordColumns {
  readonly samples: Float64Array[];
  readonly scaling: ChannelScaling[];
  readonly factor: Float64Array;
  readonly offset: Float64Array;
  readonly invalidCount: number[];
  /** Record index of each channel's first invalid (missing) sample. */
  readonly firstInvalid: (number | null)[];
  /** Raw time stamps, kept only when the time base comes from them. */
  readonly timestamps: Float64Array | null;
  missingTimestamps = 0;
  firstMissingTimestamp: number | null = null;
  readonly digital: DigitalStates;
  /** Records read so far. */
  records = 0;

  constructor(
    readonly cfg: ComtradeConfig,
    side: ValuesSide,
    needTimestamps: boolean,
    maxDigitalChanges: number,
  ) {
    const n = cfg.sampleCount;
    this.samples = cfg.analog.map(() => new Float64Array(n));
    this.scaling = cfg.analog.map((ch) => channelScaling(ch, side));
    this.factor = Float64Array.from(this.scaling, (s) => s.factor);
    this.offset = Float64Array.from(this.scaling, (s) => s.offset);
    this.invalidCount = cfg.analog.map(() => 0);
    this.firstInvalid = cfg.analog.map(() => null);
    this.timestamps = needTimestamps ? new Float64Array(n) : null;
    this.digital = new DigitalStates(cfg.digital.length, maxDigitalChanges);
  }

  /** Marks sample `row` of channel `c` invalid (a missing value): stored as NaN and counted. */
  invalid(c: number, row: number): void {
    this.samples[c][row] = NaN;
    if (this.invalidCount[c]++ === 0) this.firstInvalid[c] = row;
  }

  /** Notes a record without a time stamp. */
  missingTimestamp(row: number): void {
    if (this.missingTimestamps++ === 0) this.firstMissingTimestamp = row;
  }
}
