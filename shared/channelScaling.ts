import type { CaptureChannel } from './schemas/capture';

/**
 * How a channel's stored values become engineering units: value = stored × scale + offset, in `unit`.
 * Every export of samples goes through here, so the per-channel setup (probe ratio, shunt, offset,
 * unit) changes them in this one place.
 */
export interface ChannelScaling {
  scale: number;
  offset: number;
  unit: string;
}

/** The scaling of a channel. Today the stored values are already in the channel's unit, as read from the file. */
export function channelScalingOf(channel: CaptureChannel): ChannelScaling {
  return { scale: 1, offset: 0, unit: channel.unit };
}

/** Stored values in engineering units, written into `out`; invalid samples (NaN) stay NaN. */
export function toEngineeringUnits(stored: Float32Array, s: ChannelScaling, out: Float64Array = new Float64Array(stored.length)): Float64Array {
  for (let i = 0; i < stored.length; i++) out[i] = stored[i] * s.scale + s.offset;
  return out;
}
