/**
 * simulateMeter, run from the moment of connection: it must settle on what "Your meter" (meterModel)
 * predicts, agree with the engine's averaging-meter errors, settle when the closed forms say so, and
 * keep its display, trace and limits honest.
 *
 * Sources: square +11.0721 % and triangle −3.80876 % for a sine-calibrated averaging meter (common
 * practice, no source; closed forms k − 1 and k·√3/2 − 1, as in closedForms.test.ts); RC charging
 * 1 − e^(−t/τ), 99 % at ln(100)·τ (Horowitz & Hill, The Art of Electronics, ch. 1, from memory).
 * Each tolerance against meterModel is the size of a real effect the model leaves out, named beside it.
 */
import { describe, expect, it } from 'vitest';
import { analyzeChannel, meterInputOf, meterModel, simulateMeter, yourMeterProfileOf } from '../../../shared/analysis';
import type { FrontEndProfile } from '../../../shared/schemas/meterSimulation';
import { sampled, shapes } from '../../helpers/signals';

const F = 50;
const PER = 2000;
const FS = F * PER;
const A = 3;
const record = (shape: (p: number) => number, cycles = 10) => sampled(shape, PER, cycles);
const yourMeter = (p: FrontEndProfile, x: Float64Array) => meterModel(yourMeterProfileOf(p)!, meterInputOf(analyzeChannel(x, FS))).reading;

describe('simulateMeter: the settled reading is "Your meter"’s reading', () => {
  const waves = {
    sine: shapes.sine(A),
    square: shapes.square(A),
    triangle: shapes.triangle(A),
    'pulses, 10 % duty': shapes.pulse(A, 0.1),
    'DC plus sine': shapes.dcPlusSine(2, A),
    'half-wave rectified sine': shapes.halfWave(A),
  };
  const tauC = 10;
  for (const [name, shape] of Object.entries(waves)) {
    it(`${name}: averaging, peak and true RMS front ends`, () => {
      const x = record(shape);
      // A coupling high-pass passes a sine at f with gain ωτc/√(1 + (ωτc)²), 1 − 5·10⁻⁹ here, and the
      // sampled |x| moves with the phase it adds by well under 10⁻⁶ (measured 10⁻⁷).
      const averaging: FrontEndProfile = { type: 'averaging', coupling: 'ac', couplingTauS: tauC, averagingTauS: 1 };
      expect(Math.abs(simulateMeter(x, FS, averaging).steadyStateReading / yourMeter(averaging, x) - 1)).toBeLessThan(1e-6);
      // The hold capacitor droops between crests (at most one period apart): the mean is low by up to 1/(f·τl).
      const peak: FrontEndProfile = { type: 'peak', coupling: 'ac', couplingTauS: tauC, averagingTauS: 10 };
      const p = simulateMeter(x, FS, peak).steadyStateReading / yourMeter(peak, x) - 1;
      expect(p).toBeLessThanOrEqual(1e-9);
      expect(p).toBeGreaterThan(-1 / (F * 10));
      // The root of a rippling mean square averages below the root of its mean, by about (ripple/mean)²/8
      // at most; and the coupling capacitor's own ripple tilts flat tops by up to ±T/(4τc), whose square
      // adds to the mean square (both derived here).
      const tilt = (1 / (4 * F * tauC)) ** 2;
      for (const rms of [
        { type: 'trueRms', coupling: 'ac', couplingTauS: tauC, averagingTauS: 1 },
        { type: 'trueRms', coupling: 'dc', averagingTauS: 1 },
        { type: 'trueRms', coupling: 'dc', averagingTauS: 1, rmsConverter: 'explicit', filterOrder: 2 },
      ] as FrontEndProfile[]) {
        const r = simulateMeter(x, FS, rms);
        const ripple = r.settled.ripplePeakToPeak / r.steadyStateReading;
        expect(Math.abs(r.steadyStateReading / yourMeter(rms, x) - 1), JSON.stringify(rms)).toBeLessThan(ripple ** 2 / 8 + tilt);
      }
    });
  }

  it('a phase-cut sine reads high through a finite coupling capacitor: its ripple voltage fills the dead time, ~1/(ωτc)', () => {
    // During the dead time the input is 0 and the meter sees the capacitor's own ripple voltage, of
    // order (fundamental)/(ωτc) (derived here): a tenfold τc takes a tenfold smaller error.
    const x = record(shapes.phaseCut(A, Math.PI / 2));
    const err = (tau: number) => {
      const p: FrontEndProfile = { type: 'averaging', coupling: 'ac', couplingTauS: tau, averagingTauS: 1 };
      return simulateMeter(x, FS, p).steadyStateReading / yourMeter(p, x) - 1;
    };
    const [e1, e10] = [err(1), err(10)];
    expect(e1).toBeGreaterThan(0);
    expect(e1).toBeLessThan(1 / (2 * Math.PI * F * 1));
    expect(e1 / e10).toBeCloseTo(10, 0);
  });

  it('agrees with the engine’s averaging-meter errors once settled: square +11.07 %, triangle −3.81 %', () => {
    for (const [shape, expected, acRms] of [[shapes.square(A), 11.0721, A], [shapes.triangle(A), -3.80876, A / Math.sqrt(3)]] as const) {
      const x = record(shape);
      const r = simulateMeter(x, FS, { type: 'averaging', coupling: 'ac', couplingTauS: tauC, averagingTauS: 0.2 }, { repeat: true });
      expect(100 * (r.steadyStateReading / acRms - 1)).toBeCloseTo(expected, 3);
      expect(Math.abs(r.steadyStateReading / analyzeChannel(x, FS).meters.averageResponding.reading - 1)).toBeLessThan(1e-6);
      expect(r.settled.settlingTimeS).not.toBeNull();
    }
  });
});

describe('simulateMeter: settling', () => {
  it('DC into an RC averaging converter: within 1 % after ln(100)·τ = 4.605 τ', () => {
    const tau = 0.05;
    const x = new Float64Array(FS).fill(A);
    const r = simulateMeter(x, FS, { type: 'averaging', coupling: 'dc', averagingTauS: tau });
    expect(r.run.fundamentalHz).toBeNull();
    expect(Math.abs(r.settled.settlingTimeS! - Math.log(100) * tau)).toBeLessThanOrEqual(1 / FS);
    expect(r.advice.kind).toBe('wait');
  });

  it('a sine, looped until settled: 4.605 τ, give or take the ripple and one period', () => {
    // From zero the output is its periodic steady state minus that state's start value decaying as
    // e^(−t/τ); the start value is the mean ± half the ripple, which moves the 1 % time by τ·ripple/mean.
    const tau = 0.3;
    const r = simulateMeter(record(shapes.sine(A)), FS, { type: 'averaging', coupling: 'dc', averagingTauS: tau, displayRateHz: 4, counts: 6000 }, { repeat: true });
    const slack = tau * (r.settled.ripplePeakToPeak / r.steadyStateReading) + 1 / F;
    expect(Math.abs(r.settled.settlingTimeS! - Math.log(100) * tau)).toBeLessThanOrEqual(slack);
    expect(r.run.loops).toBeGreaterThan(1);
    expect(r.run.simulatedS).toBeLessThan(12 * tau + 1);
    // The display shows the settled reading from its first update after 1.38 s: 1.5 s.
    expect(r.advice.sentence).toMatch(/^Wait 1\.5 s after connecting/);
    // The display: a reading every 0.25 s, in whole counts of 1 mV (6000 counts, auto-ranged to 6 V).
    expect(r.resolution).toBe(0.001);
    expect(r.display.map((d) => d.tS).slice(0, 3)).toEqual([0.25, 0.5, 0.75]);
    expect(r.display.every((d) => Math.abs(d.value! * 1000 - Math.round(d.value! * 1000)) < 1e-6)).toBe(true);
    expect(r.settled.value).toBe(2.121); // 3/√2 = 2.1213 on a 6000-count display
    expect(r.trace.length).toBeLessThanOrEqual(2000);
    expect(r.trace.every((p, i) => i === 0 || p.tS > r.trace[i - 1].tS)).toBe(true);
  });

  it('played once, a span shorter than the settling time has not settled, and says to loop it', () => {
    const r = simulateMeter(record(shapes.sine(A)), FS, { type: 'trueRms', coupling: 'ac', averagingTauS: 1 });
    expect(r.settled.settlingTimeS).toBeNull();
    expect(r.advice.kind).toBe('notSettled');
    expect(r.run.simulatedS).toBeCloseTo(0.2, 12);
  });

  it('starting settled, the reading jumps when a dimmer switches and heads for the new level', () => {
    // Full sine for 0.5 s, then phase-cut at 90° for 2 s: the RMS falls from A/√2 to A/2,
    // (A/√2)·√(1 − α/π + sin 2α/(2π)) with α = π/2 (DOMAIN §1a, standard calculus).
    const x = new Float64Array(FS * 2.5);
    x.set(record(shapes.sine(A), 25));
    x.set(record(shapes.phaseCut(A, Math.PI / 2), 100), FS / 2);
    const tau = 0.4;
    const r = simulateMeter(x, FS, { type: 'trueRms', coupling: 'ac', averagingTauS: tau, displayRateHz: 5 }, { start: 'settled' });
    const swing = r.settled.ripplePeakToPeak;
    // Already reading before the span, the display shows a value from its start.
    expect(r.display[0].tS).toBe(0);
    expect(Math.abs(r.display.find((d) => d.tS === 0.4)!.value! - A / Math.SQRT2)).toBeLessThan(swing);
    expect(Math.abs(r.display[r.display.length - 1].value! - A / 2)).toBeLessThan(swing);
    // The implicit converter's mean square falls from A²/2 towards A²/4 as e^(−2t/τ); it is within 1 %
    // of A/2 when the excess is 1.01² − 1 of A²/4: after (τ/2)·ln(1/0.0201) (derived here).
    expect(Math.abs(r.settled.settlingTimeS! - 0.5 - (tau / 2) * Math.log(1 / 0.0201))).toBeLessThan(1 / F);
  });
});

describe('simulateMeter: high sample rates and limits', () => {
  it('at 5 MS/s a long looped run is decimated, and says how far that moves its final reading', () => {
    const fs = 5_000_000;
    // A sine loses (πfD/fs)²/6 to a D-sample average (averagingGain in decimate.ts): ~10⁻⁸ here.
    const sine = simulateMeter(sampled(shapes.sine(A), fs / F, 5), fs, { type: 'averaging', coupling: 'ac', averagingTauS: 1 }, { repeat: true });
    expect(sine.run.decimation).toBeGreaterThan(1);
    expect(Math.abs(sine.run.decimationErrorPercent!)).toBeLessThan(1e-5);
    expect(sine.run.simulatedS).toBeLessThanOrEqual(300);
    expect(sine.settled.settlingTimeS).not.toBeNull();
    // A square wave's edges each fall inside one averaged sample, where |x| dips: at most 2 samples'
    // worth of the reading per period are lost (derived here).
    const square = simulateMeter(sampled(shapes.square(A), fs / F, 5), fs, { type: 'averaging', coupling: 'ac', couplingTauS: 10, averagingTauS: 1 }, { repeat: true });
    expect(Math.abs(square.run.decimationErrorPercent!)).toBeLessThan((100 * 2 * F) / square.run.sampleRateHz);
    expect(100 * (square.steadyStateReading / A - 1)).toBeCloseTo(11.0721, 3);
  });

  it('stays finite for τ from 1 ms to 10 s at 5 MS/s, for every converter', () => {
    const fs = 5_000_000;
    const x = sampled(shapes.sine(A), fs / F, 2);
    for (const tau of [1e-3, 10]) {
      for (const p of [
        { type: 'averaging', coupling: 'ac', averagingTauS: tau, couplingTauS: tau, filterOrder: 2 },
        { type: 'peak', coupling: 'ac', averagingTauS: tau, chargeTauS: 1e-5 },
        { type: 'trueRms', coupling: 'dc', averagingTauS: tau },
      ] as FrontEndProfile[]) {
        const r = simulateMeter(x, fs, p);
        expect(r.trace.every((q) => Number.isFinite(q.value) && Math.abs(q.value) <= 2 * A), `${p.type} τ ${tau}`).toBe(true);
        expect(r.steadyStateReading).toBeGreaterThan(0);
      }
    }
  });

  it('clips at the crest-factor headroom exactly when "Your meter" flags the crest factor', () => {
    const x = record(shapes.pulse(10, 0.05)); // AC peak 9.5, AC RMS 2.18
    for (const fullScale of [2.2, 6]) {
      const p: FrontEndProfile = { type: 'trueRms', coupling: 'ac', averagingTauS: 1, crestFactorLimit: 3, rangeFullScale: fullScale, counts: 6000 };
      const r = simulateMeter(x, FS, p);
      const flagged = meterModel(yourMeterProfileOf(p)!, meterInputOf(analyzeChannel(x, FS))).flags.some((f) => f.code === 'crestFactorExceeded');
      expect(r.clippedFraction > 0).toBe(flagged);
      if (flagged) expect(r.advice.kind).toBe('clipped');
    }
  });

  it('shows over-range as null on a fixed range, and refuses samples that are not numbers', () => {
    const r = simulateMeter(record(shapes.sine(A)), FS, { type: 'trueRms', coupling: 'dc', averagingTauS: 0.01, rangeFullScale: 2, counts: 2000 }, { repeat: true });
    expect(r.display[r.display.length - 1].value).toBeNull();
    expect(r.advice.kind).toBe('overRange');
    const bad = record(shapes.sine(A));
    bad[7] = Number.NaN;
    expect(() => simulateMeter(bad, FS, { type: 'averaging', coupling: 'dc', averagingTauS: 1 })).toThrow(/sample 7/);
  });
});
