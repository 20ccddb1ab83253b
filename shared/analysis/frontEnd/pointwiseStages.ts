import type { Stage } from './stage';

/**
 * The input stage's headroom: beyond ±level (crest-factor limit × range full scale) it saturates.
 * Counts the samples it clipped since the last `clipped = 0`.
 */
export class HeadroomClip implements Stage {
  clipped = 0;
  constructor(readonly level: number) {}

  process(buf: Float64Array, n: number): void {
    const top = this.level;
    let clipped = 0;
    for (let i = 0; i < n; i++) {
      const v = buf[i];
      if (v > top) { buf[i] = top; clipped++; }
      else if (v < -top) { buf[i] = -top; clipped++; }
    }
    this.clipped += clipped;
  }
}

/** Precision full-wave rectifier |x|, or a half-wave one max(x, 0) with a gain (2 in averaging converters). */
export class Rectifier implements Stage {
  constructor(readonly kind: 'full' | 'half', readonly halfWaveGain = 1) {}

  process(buf: Float64Array, n: number): void {
    if (this.kind === 'full') {
      for (let i = 0; i < n; i++) buf[i] = Math.abs(buf[i]);
    } else {
      const g = this.halfWaveGain;
      for (let i = 0; i < n; i++) buf[i] = buf[i] > 0 ? g * buf[i] : 0;
    }
  }
}

/** The true RMS converter's squarer, x². */
export class Squarer implements Stage {
  process(buf: Float64Array, n: number): void {
    for (let i = 0; i < n; i++) buf[i] *= buf[i];
  }
}

/** The true RMS converter's root, after its averaging. */
export class SquareRoot implements Stage {
  process(buf: Float64Array, n: number): void {
    for (let i = 0; i < n; i++) buf[i] = Math.sqrt(buf[i]);
  }
}

/** The converter's calibration: π/(2√2) for averaging, 1/√2 for peak converters. */
export class Gain implements Stage {
  constructor(readonly gain: number) {}

  process(buf: Float64Array, n: number): void {
    const g = this.gain;
    for (let i = 0; i < n; i++) buf[i] *= g;
  }
}
