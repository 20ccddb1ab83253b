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

/**
 * The scaling of a channel's stored values. The channel setup (probe ratio, shunt, offset, invert, unit)
 * is applied at ingest by applyChannelSetup, so stored samples are already in engineering units and in
 * the channel's unit: scaling them again here would apply the setup twice.
 */
export function channelScalingOf(channel: CaptureChannel): ChannelScaling {
  return { scale: 1, offset: 0, unit: channel.unit };
}

/** Stored values in engineering units, written into `out`; invalid samples (NaN) stay NaN. */
export function toEngineeringUnits(stored: Float32Array, s: ChannelScaling, out: Float64Array = new Float64Array(stored.length)): Float64Array {
  for (let i = 0; i < stored.length; i++) out[i] = stored[i] * s.scale + s.offset;
  return out;
}
