/** Sampled three-phase test sets: cosines of given RMS and angle, over whole cycles. */
export interface Wave {
  rms: number;
  angleDeg: number;
  /** Further components: harmonic order, RMS and angle. */
  harmonics?: { order: number; rms: number; angleDeg: number }[];
}

export const F = 50;
export const PER_CYCLE = 400;
export const FS = F * PER_CYCLE;

/** x(t) = √2·V·cos(2πft + φ) + harmonics, at t = i/fs, for `cycles` whole cycles. */
export function wave(w: Wave, cycles = 10): Float64Array {
  const n = PER_CYCLE * cycles;
  const out = new Float64Array(n);
  const parts = [{ order: 1, rms: w.rms, angleDeg: w.angleDeg }, ...(w.harmonics ?? [])];
  for (let i = 0; i < n; i++) {
    const t = i / FS;
    out[i] = parts.reduce((s, p) => s + Math.SQRT2 * p.rms * Math.cos(2 * Math.PI * p.order * F * t + (p.angleDeg * Math.PI) / 180), 0);
  }
  return out;
}

export const three = (a: Wave, b: Wave, c: Wave, cycles = 10): [Float64Array, Float64Array, Float64Array] => [wave(a, cycles), wave(b, cycles), wave(c, cycles)];

/**
 * The fundamental of a record by a plain direct DFT at bin `cycles` (no Goertzel, no FFT): an
 * independent reference for the engine's phasors. Returns the RMS and the angle of the cosine, in degrees.
 */
export function directFundamental(x: Float64Array, cycles: number): { rms: number; angleDeg: number } {
  let re = 0;
  let im = 0;
  for (let n = 0; n < x.length; n++) {
    const a = (-2 * Math.PI * cycles * n) / x.length;
    re += x[n] * Math.cos(a);
    im += x[n] * Math.sin(a);
  }
  return { rms: (Math.SQRT2 * Math.hypot(re, im)) / x.length, angleDeg: (Math.atan2(im, re) * 180) / Math.PI };
}
