import { oneMinusExp, type StatefulStage } from './stage';

/*
 * First-order RC sections, solved exactly for an input that runs linearly from one sample to the next
 * (a first-order hold, the "ramp-invariant" discretisation; Franklin, Powell & Workman, Digital Control
 * of Dynamic Systems, ch. 6, from memory). With r = h/τ, b = 1 − e^(−r) and c = 1 − b/r, one step is
 *   y' = y + b·(u₀ − y) + c·(u₁ − u₀).
 * A held input (zero-order hold) would be exact only for staircases: a sampled waveform lags its
 * staircase by half a sample, which through the coupling stage moves a sine's reading by about
 * h/(2τc) (5·10⁻⁵ at 10 kS/s with τc = 1 s, measured here); the ramp form leaves O(h²). A constant input
 * is still exact: a step from the moment of connection gives 1 − e^(−t/τ) at every sample.
 * e^(−r) lies in (0, 1) for any τ > 0 and h > 0, so the sections are stable at every rate, and the
 * increment form keeps its digits when e^(−r) is within 10⁻⁸ of 1.
 * Circuits: Horowitz & Hill, The Art of Electronics, ch. 1 (RC low-pass and high-pass), from memory.
 */

/** c = 1 − (1 − e^(−r))/r, by its series where the subtraction would cancel. */
export function rampWeight(r: number): number {
  return r < 1e-4 ? r / 2 - (r * r) / 6 + (r * r * r) / 24 : 1 - oneMinusExp(r) / r;
}

/** Shared state of a first-order section: capacitor voltage `y` at the last sample, whose input was `last` (null: just connected). */
abstract class FirstOrderSection implements StatefulStage {
  protected y = 0;
  protected last: number | null = null;
  protected readonly b: number;
  protected readonly c: number;
  private readonly stepsPerTau: number;

  constructor(readonly tauS: number, sampleRateHz: number) {
    this.stepsPerTau = tauS * sampleRateHz;
    this.b = oneMinusExp(1 / this.stepsPerTau);
    this.c = rampWeight(1 / this.stepsPerTau);
  }

  abstract process(buf: Float64Array, n: number): void;
  /** The output's part due to a capacitor voltage `y0` at the start: ±y0·e^(−(n+1)h/τ) at sample n. */
  protected abstract readonly homogeneousSign: 1 | -1;

  reset(): void {
    this.y = 0;
    this.last = null;
  }

  /**
   * Linear, so the steady loop is the loop from zero plus the decay of the steady start voltage y₀.
   * From zero the loop ends at C; periodicity y₀ = e^(−L/(fs·τ))·y₀ + C gives y₀ = C / (1 − e^(−L/(fs·τ))).
   */
  settle(loop: Float64Array): void {
    const L = loop.length;
    this.y = 0;
    this.last = loop[L - 1];
    this.process(loop, L);
    const y0 = this.y / oneMinusExp(L / this.stepsPerTau);
    const a = 1 - this.b;
    let decay = this.homogeneousSign * y0;
    for (let i = 0; i < L; i++) {
      decay *= a;
      loop[i] += decay;
    }
    this.y = y0;
  }
}

/** An RC low-pass of time constant `tauS` at `sampleRateHz`: the capacitor voltage at each sample. */
export class FirstOrderLowPass extends FirstOrderSection {
  protected readonly homogeneousSign = 1;

  process(buf: Float64Array, n: number): void {
    if (n === 0) return;
    const { b, c } = this;
    let y = this.y;
    let i = 0;
    let last = this.last;
    // Just connected: no time has passed at the first sample.
    if (last === null) {
      last = buf[0];
      buf[0] = y;
      i = 1;
    }
    for (; i < n; i++) {
      const u = buf[i];
      y += b * (last - y) + c * (u - last);
      buf[i] = y;
      last = u;
    }
    this.y = y;
    this.last = last;
  }
}

/**
 * An AC coupling capacitor into the input resistance: a first-order high-pass of time constant
 * `tauS`. Its output is the input minus the capacitor's voltage, so a DC step of height A from the
 * moment of connection reads A·e^(−t/τ).
 */
export class CouplingHighPass extends FirstOrderSection {
  protected readonly homogeneousSign = -1;

  process(buf: Float64Array, n: number): void {
    if (n === 0) return;
    const { b, c } = this;
    let y = this.y;
    let i = 0;
    let last = this.last;
    if (last === null) {
      last = buf[0];
      buf[0] = last - y;
      i = 1;
    }
    for (; i < n; i++) {
      const u = buf[i];
      y += b * (last - y) + c * (u - last);
      buf[i] = u - y;
      last = u;
    }
    this.y = y;
    this.last = last;
  }
}
