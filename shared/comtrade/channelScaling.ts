import type { AnalogChannelConfig } from './ComtradeConfig';

/** Which side of the instrument transformer values are shown on. */
export type ValuesSide = 'primary' | 'secondary';

export interface ChannelScaling {
  /** value = raw · factor + offset, in the channel's unit, on `side`. */
  factor: number;
  offset: number;
  side: ValuesSide;
  /** Set when the wanted side could not be reached (no usable ratio): the values stay as recorded. */
  note: string | null;
}

/**
 * The scaling from a raw data value to the value on the wanted side: a·x + b gives the side the P/S
 * flag names, and the ratio primary/secondary carries it across (DOMAIN.md §8e). A ratio that is
 * missing, zero or negative cannot be used, so those values stay on the recorded side, with a note.
 */
export function channelScaling(ch: AnalogChannelConfig, wanted: ValuesSide): ChannelScaling {
  const recorded: ValuesSide = ch.ps === 'P' ? 'primary' : 'secondary';
  if (wanted === recorded) return { factor: ch.a, offset: ch.b, side: recorded, note: null };
  const ratio = ch.primary / ch.secondary;
  if (!(ch.primary > 0) || !(ch.secondary > 0) || !Number.isFinite(ratio)) {
    return { factor: ch.a, offset: ch.b, side: recorded, note: `no usable primary/secondary ratio, so its values stay ${recorded}` };
  }
  const k = wanted === 'primary' ? ratio : 1 / ratio;
  return { factor: ch.a * k, offset: ch.b * k, side: wanted, note: null };
}
