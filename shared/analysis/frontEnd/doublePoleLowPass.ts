import { rampWeight } from './firstOrderSections';
import { oneMinusExp, type StatefulStage } from './stage';

/** 1 − 2(1 − e^(−r))/r + e^(−r), by its series r²/6 − r³/12 + r⁴/40 where the sum would cancel. */
function secondRampWeight(r: number): number {
  return r < 1e-3 ? (r * r) / 6 - (r * r * r) / 12 + (r * r * r * r) / 40 : 1 - (2 * oneMinusExp(r)) / r + Math.exp(-r);
}

/**
 * Two buffered RC sections of the same time constant in cascade: a critically damped two-pole
 * averaging filter (the "second-order filter" of averaging converters; Horowitz & Hill, The Art of
 * Electronics, ch. 1 and 6, from memory). Its unit-step response is 1 − e^(−t/τ)·(1 + t/τ), so it
 * settles to 1 % after 6.64 τ against 4.61 τ for one section, but its ripple falls as 1/(ωτ)².
 *
 * Solved exactly, as a two-state system, for an input running linearly between samples (as the
 * first-order sections are). With r = h/τ, a = e^(−r), b = 1 − a, one step from input u₀ to u₁ is
 *   s₁' = s₁ + b·(u₀ − s₁) + c₁·(u₁ − u₀),
 *   s₂' = s₂ + b·(u₀ − s₂) − r·a·(u₀ − s₁) + c₂·(u₁ − u₀),
 * where c₁ = 1 − b/r and c₂ = 1 − 2b/r + a are the responses of each state to a unit ramp over the step.
 */
export class DoublePoleLowPass implements StatefulStage {
  private s1 = 0;
  private s2 = 0;
  private last: number | null = null;
  private readonly a: number;
  private readonly b: number;
  private readonly r: number;
  private readonly c1: number;
  private readonly c2: number;

  constructor(readonly tauS: number, sampleRateHz: number) {
    this.r = 1 / (tauS * sampleRateHz);
    this.b = oneMinusExp(this.r);
    this.a = 1 - this.b;
    this.c1 = rampWeight(this.r);
    this.c2 = secondRampWeight(this.r);
  }

  process(buf: Float64Array, n: number): void {
    const { b, c1, c2 } = this;
    const ra = this.r * this.a;
    if (n === 0) return;
    let { s1, s2 } = this;
    // Just connected: no time has passed at the first sample.
    let i = 0;
    let last = this.last;
    if (last === null) {
      last = buf[0];
      buf[0] = s2;
      i = 1;
    }
    for (; i < n; i++) {
      const u = buf[i];
      const du = u - last;
      s2 += b * (last - s2) - ra * (last - s1) + c2 * du;
      s1 += b * (last - s1) + c1 * du;
      buf[i] = s2;
      last = u;
    }
    this.s1 = s1;
    this.s2 = s2;
    this.last = last;
  }

  reset(): void {
    this.s1 = this.s2 = 0;
    this.last = null;
  }

  /**
   * One step's state matrix is a·[[1, 0], [r, 1]], so L steps give g·[[1, 0], [L·r, 1]] with g = e^(−L·r).
   * From zero the loop ends at C; periodicity s = g·[[1, 0], [L·r, 1]]·s + C solves to
   * s₁ = C₁/(1 − g), s₂ = (C₂ + g·L·r·s₁)/(1 − g). The steady loop is the loop from zero plus the
   * decay of that start, a^k·(s₂ + k·r·s₁) after k steps.
   */
  settle(loop: Float64Array): void {
    const L = loop.length;
    this.s1 = this.s2 = 0;
    this.last = loop[L - 1];
    this.process(loop, L);
    const q = oneMinusExp(L * this.r);
    const s1 = this.s1 / q;
    const s2 = (this.s2 + (1 - q) * L * this.r * s1) / q;
    let power = 1;
    for (let i = 0; i < L; i++) {
      power *= this.a;
      loop[i] += power * (s2 + (i + 1) * this.r * s1);
    }
    this.s1 = s1;
    this.s2 = s2;
  }
}
