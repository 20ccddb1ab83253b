import type { Samples } from './samples';

/** The part of a channel setup that changes values. */
export interface ChannelScaling {
  /** Multiplier from the recorded value to the engineering unit (a ×10 probe: 10; a 100 mV/A clamp: 10 A/V). */
  scale: number;
  /** Added after scaling, in the engineering unit. */
  offset: number;
  /** Flips the sign (a probe or clamp the wrong way round). */
  invert: boolean;
}

export const IDENTITY_SCALING: ChannelScaling = { scale: 1, offset: 0, invert: false };

/** Whether a setup leaves the values as recorded. */
export const isIdentityScaling = (s: ChannelScaling) => s.scale === 1 && s.offset === 0 && !s.invert;

/**
 * The samples in engineering units: (invert ? −1 : 1) · scale · x + offset, into a new array (the
 * recorded values are left as they are). NaN (an invalid sample) stays NaN. The one function that
 * applies a channel setup, wherever recorded values are turned into engineering ones.
 *
 * @param samples recorded values, in the file's unit
 * @param setup scale (new unit per recorded unit), offset (new unit), invert
 */
export function applyChannelSetup(samples: Samples, setup: ChannelScaling): Float64Array {
  const k = setup.invert ? -setup.scale : setup.scale;
  const b = setup.offset;
  const out = new Float64Array(samples.length);
  for (let i = 0; i < samples.length; i++) out[i] = k * samples[i] + b;
  return out;
}

/** Scale of a current clamp or probe rated in mV per A (100 mV/A → 10 A/V). */
export const scaleFromMillivoltsPerAmp = (mVPerA: number) => 1000 / mVPerA;

/** Scale of a shunt of `ohms` read in volts: I = V/R. */
export const scaleFromShunt = (ohms: number) => 1 / ohms;
