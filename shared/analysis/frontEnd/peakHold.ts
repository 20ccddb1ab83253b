import type { StatefulStage } from './stage';

const MAX_SETTLE_ITERATIONS = 60;

/**
 * A peak detector: a diode charging a hold capacitor through a source resistance (time constant
 * `chargeTauS`, or an ideal diode when null), which a resistor discharges all the time (`leakTauS`).
 * Helfrick & Cooper, Modern Electronic Instrumentation and Measurement Techniques, ch. on AC meters
 * (peak-responding voltmeters), from memory.
 *
 * Exact for an input u held over the step that ends at its sample (no step before the first sample
 * after connection). While the diode conducts (u > y) the capacitor tends to
 * y∞ = u·τl/(τc + τl) < u with τe = τc·τl/(τc + τl), so it stays below u and the diode stays on for the
 * whole step. Otherwise it decays as e^(−t/τl) until it meets u (at t* = τl·ln(y/u)), then conducts.
 */
export class PeakHold implements StatefulStage {
  private y = 0;
  private fresh = true;
  private readonly leak: number;
  private readonly stepsPerLeak: number;
  private readonly charge: { share: number; keep: number; stepsPerTau: number } | null;

  constructor(leakTauS: number, chargeTauS: number | null, sampleRateHz: number) {
    this.stepsPerLeak = leakTauS * sampleRateHz;
    this.leak = Math.exp(-1 / this.stepsPerLeak);
    if (chargeTauS === null) {
      this.charge = null;
    } else {
      const tauE = (chargeTauS * leakTauS) / (chargeTauS + leakTauS);
      this.charge = { share: leakTauS / (chargeTauS + leakTauS), keep: Math.exp(-1 / (tauE * sampleRateHz)), stepsPerTau: tauE * sampleRateHz };
    }
  }

  process(buf: Float64Array, n: number): void {
    const { leak, charge } = this;
    let y = this.y;
    let i = 0;
    if (this.fresh && n > 0) {
      // At the moment of connection no time has passed: an ideal diode charges at once, a real one not yet.
      if (charge === null) y = Math.max(0, buf[0]);
      buf[0] = y;
      i = 1;
      this.fresh = false;
    }
    if (charge === null) {
      for (; i < n; i++) {
        const u = buf[i];
        const held = y * leak;
        y = u > held ? u : held;
        buf[i] = y;
      }
    } else {
      for (; i < n; i++) {
        const u = buf[i];
        const target = u * charge.share;
        if (u > y) {
          y = target + (y - target) * charge.keep;
        } else if (u > 0 && y * leak < u) {
          // Decays to u within the step, then conducts for the rest of it.
          const rest = 1 - this.stepsPerLeak * Math.log(y / u);
          y = target + (u - target) * Math.exp(-rest / charge.stepsPerTau);
        } else {
          y *= leak;
        }
        buf[i] = y;
      }
    }
    this.y = y;
  }

  reset(): void {
    this.y = 0;
    this.fresh = true;
  }

  /**
   * The loop maps a start voltage y₀ to an end voltage F(y₀), increasing and contracting; the steady
   * state solves F(y₀) = y₀ in [0, max u] by regula falsi with the Illinois modification, which needs
   * a handful of passes because F is nearly flat once the diode conducts in each loop.
   */
  settle(loop: Float64Array): void {
    const scratch = new Float64Array(loop.length);
    let top = 0;
    for (let i = 0; i < loop.length; i++) top = Math.max(top, loop[i]);
    const gap = (y0: number) => {
      this.y = y0;
      this.fresh = false;
      scratch.set(loop);
      this.process(scratch, loop.length);
      return this.y - y0;
    };
    let lo = 0, glo = gap(0);
    let hi = top, ghi = gap(top);
    let y = glo <= 0 ? 0 : ghi >= 0 ? top : NaN;
    let side = 0;
    for (let k = 0; Number.isNaN(y) && k < MAX_SETTLE_ITERATIONS; k++) {
      const c = hi - (ghi * (hi - lo)) / (ghi - glo);
      const gc = gap(c);
      if (Math.abs(gc) <= 1e-14 * top || hi - lo <= 1e-13 * top) y = c;
      else if (gc > 0) {
        lo = c; glo = gc;
        if (side === 1) ghi /= 2;
        side = 1;
      } else {
        hi = c; ghi = gc;
        if (side === -1) glo /= 2;
        side = -1;
      }
    }
    this.y = Number.isNaN(y) ? (lo + hi) / 2 : y;
    this.process(loop, loop.length);
  }
}
