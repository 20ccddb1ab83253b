/** A complex RMS phasor: magnitude in the channel's unit, angle of the cosine component. */
export interface Phasor {
  re: number;
  im: number;
}

const RAD = Math.PI / 180;

/** The phasor of RMS magnitude `magnitude` at `angleDeg` degrees. */
export const polar = (magnitude: number, angleDeg: number): Phasor => ({ re: magnitude * Math.cos(angleDeg * RAD), im: magnitude * Math.sin(angleDeg * RAD) });

export const add = (a: Phasor, b: Phasor): Phasor => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: Phasor, b: Phasor): Phasor => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: Phasor, b: Phasor): Phasor => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const div = (a: Phasor, b: Phasor): Phasor => {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
};
export const scale = (a: Phasor, k: number): Phasor => ({ re: a.re * k, im: a.im * k });
export const abs = (a: Phasor): number => Math.hypot(a.re, a.im);
/** Angle in degrees, (−180, 180]. */
export const argDeg = (a: Phasor): number => Math.atan2(a.im, a.re) / RAD;

/** An angle folded into (−180, 180] degrees. */
export const wrapDeg = (deg: number): number => {
  const w = ((((deg + 180) % 360) + 360) % 360) - 180;
  return w === -180 ? 180 : w;
};
