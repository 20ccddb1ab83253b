import { SINE_FORM_FACTOR } from '../meters';
import type { Samples } from '../samples';
import { DoublePoleLowPass } from './doublePoleLowPass';
import { CouplingHighPass, FirstOrderLowPass } from './firstOrderSections';
import { PeakHold } from './peakHold';
import { Gain, HeadroomClip, Rectifier, SquareRoot, Squarer } from './pointwiseStages';
import { clipLevelOf, type ResolvedFrontEnd } from './resolveFrontEnd';
import { isStateful, type Stage } from './stage';

/** A front end built for one sample rate: process blocks in place, reset, or settle on a loop. */
export interface FrontEnd {
  readonly sampleRateHz: number;
  /** How the ripple falls with frequency once ωτ ≫ 1: as 1/f (one pole) or 1/f² (two). */
  readonly rippleOrder: 1 | 2;
  process(buf: Float64Array, n: number): void;
  /** A meter just connected: every capacitor discharged. */
  reset(): void;
  /**
   * Puts every stage into the periodic steady state of `loop` repeated forever and returns the
   * converter output over one loop in that state (a new array; `loop` is left as it is), with the
   * number of samples the input stage clips in each loop.
   */
  settleOn(loop: Samples): { output: Float64Array; clipped: number };
  /** Samples clipped by the input stage since the last call. */
  takeClipped(): number;
}

const lowPass = (order: 1 | 2, tauS: number, fs: number): Stage => (order === 1 ? new FirstOrderLowPass(tauS, fs) : new DoublePoleLowPass(tauS, fs));

/**
 * The converter chains. True RMS, implicit (AD536/AD637 data sheets, "implicit RMS computation", and
 * Analog Devices' RMS-to-DC Converter Application Guide; from memory): the loop averages x²/y into y,
 * τ·dy/dt = x²/y − y. With z = y² that is (τ/2)·dz/dt = x² − z: a linear low-pass of x² with τ/2, then a
 * root. Simulating that form is the exact solution of the loop, needs no division, and starts from
 * y = 0 where the loop as drawn divides by zero. Its second order is a post-filter on the output, as the
 * data sheets add one. Explicit: square, average with τ, root.
 */
function stagesOf(p: ResolvedFrontEnd, fs: number, clip: HeadroomClip | null): Stage[] {
  const stages: Stage[] = [];
  if (p.coupling === 'ac') stages.push(new CouplingHighPass(p.couplingTauS, fs));
  if (clip) stages.push(clip);
  if (p.type === 'averaging') {
    stages.push(new Rectifier(p.rectifier, 2), lowPass(p.filterOrder, p.averagingTauS, fs), new Gain(SINE_FORM_FACTOR));
  } else if (p.type === 'peak') {
    stages.push(new Rectifier(p.rectifier), new PeakHold(p.averagingTauS, p.chargeTauS, fs), new Gain(Math.SQRT1_2));
  } else if (p.rmsConverter === 'explicit') {
    stages.push(new Squarer(), lowPass(p.filterOrder, p.averagingTauS, fs), new SquareRoot());
  } else {
    stages.push(new Squarer(), new FirstOrderLowPass(p.averagingTauS / 2, fs), new SquareRoot());
    if (p.filterOrder === 2) stages.push(new FirstOrderLowPass(p.averagingTauS, fs));
  }
  return stages;
}

/** The front end described by `p` at `sampleRateHz` (samples per second). */
export function buildFrontEnd(p: ResolvedFrontEnd, sampleRateHz: number): FrontEnd {
  const level = clipLevelOf(p);
  const clip = level === null ? null : new HeadroomClip(level);
  const stages = stagesOf(p, sampleRateHz, clip);
  return {
    sampleRateHz,
    rippleOrder: p.filterOrder === 2 && p.type !== 'peak' ? 2 : 1,
    process(buf, n) {
      for (const s of stages) s.process(buf, n);
    },
    reset() {
      for (const s of stages) if (isStateful(s)) s.reset();
    },
    settleOn(loop) {
      const buf = Float64Array.from(loop);
      const before = clip?.clipped ?? 0;
      for (const s of stages) {
        if (isStateful(s)) s.settle(buf);
        else s.process(buf, buf.length);
      }
      const clipped = clip ? clip.clipped - before : 0;
      if (clip) clip.clipped = before;
      return { output: buf, clipped };
    },
    takeClipped() {
      if (!clip) return 0;
      const c = clip.clipped;
      clip.clipped = 0;
      return c;
    },
  };
}
