/**
 * The engine against closed-form values for ideal periodic waveforms of peak A.
 *
 * Source of every expected value below: integration over one period (standard calculus); the Fourier
 * and RMS facts are those of any engineering-mathematics text, e.g. E. Kreyszig, "Advanced Engineering
 * Mathematics", chapter on Fourier series (cited from memory). Meter models: AC-coupled average-
 * responding meter = (π/(2√2))·mean|x − mean|, peak-responding = max|x − mean|/√2 (common practice,
 * no source).
 */
import { describe, expect, it } from 'vitest';
import { analyzeChannel } from '../../../shared/analysis';
import { sampled, shapes } from '../../helpers/signals';

const A = 2.5;
const F = 50;
const PER_CYCLE = 12000; // divisible by 4, 12, 20: every kink and edge falls between samples
const CYCLES = 10;
const FS = F * PER_CYCLE;
const k = Math.PI / (2 * Math.SQRT2);
const TOL = 1e-6;

interface Expected {
  mean: number;
  rectifiedAverage: number;
  rms: number;
  acRms: number;
  acRectifiedAverage: number;
  peak: number;
  acPeak: number;
}

function expectClose(actual: number | null, expected: number, what: string) {
  expect(actual, what).not.toBeNull();
  const scale = Math.max(Math.abs(expected), 1e-12);
  expect(Math.abs((actual as number) - expected) / scale, `${what}: ${actual} vs ${expected}`).toBeLessThan(TOL);
}

function checkAll(shape: (p: number) => number, e: Expected, cycles = CYCLES) {
  const a = analyzeChannel(sampled(shape, PER_CYCLE, CYCLES), FS);
  expect(a.window.cycles).toBe(cycles);
  expect(a.window.sampleCount).toBe(PER_CYCLE * CYCLES);
  expectClose(a.mean + 1, e.mean + 1, 'mean (offset by 1 so zero means compare absolutely)');
  expectClose(a.rectifiedAverage, e.rectifiedAverage, 'rectifiedAverage');
  expectClose(a.rms, e.rms, 'rms');
  expectClose(a.acRms, e.acRms, 'acRms');
  expectClose(a.acRectifiedAverage, e.acRectifiedAverage, 'acRectifiedAverage');
  expectClose(a.peak, e.peak, 'peak');
  expectClose(a.crestFactor, e.peak / e.rms, 'crestFactor');
  expectClose(a.formFactor, e.rms / e.rectifiedAverage, 'formFactor');
  expectClose(a.meters.averageResponding.reading, k * e.acRectifiedAverage, 'average-responding reading');
  expectClose(a.meters.trueRmsAc.reading, e.acRms, 'AC true RMS reading');
  expectClose(a.meters.trueRmsAcDc.reading, e.rms, 'AC+DC true RMS reading');
  expectClose(a.meters.peakResponding.reading, e.acPeak / Math.SQRT2, 'peak-responding reading');
  return a;
}

describe('analyzeChannel on closed-form waveforms', () => {
  it('sine ±A: mean 0, rect. avg 2A/π, RMS A/√2, FF π/(2√2), CF √2', () => {
    checkAll(shapes.sine(A), { mean: 0, rectifiedAverage: (2 * A) / Math.PI, rms: A / Math.SQRT2, acRms: A / Math.SQRT2, acRectifiedAverage: (2 * A) / Math.PI, peak: A, acPeak: A });
  });

  it('full-wave rectified sine: mean 2A/π, RMS A/√2, AC RMS A·√(1/2 − 4/π²)', () => {
    const mean = (2 * A) / Math.PI;
    // mean|x − mean| for |sin|: (4A/π)·[√(1 − 4/π²) − 1 + (2/π)·asin(2/π)] / 2, i.e. the meter column ÷ k
    const acRect = ((4 * A) / Math.PI) * (Math.sqrt(1 - 4 / Math.PI ** 2) - 1 + (2 / Math.PI) * Math.asin(2 / Math.PI));
    // max|x − mean| is mean − min here; the cusp at zero lies between samples, half a step up.
    const sampledTrough = A * Math.sin(Math.PI / PER_CYCLE);
    const a = checkAll(shapes.fullWave(A), { mean, rectifiedAverage: mean, rms: A / Math.SQRT2, acRms: A * Math.sqrt(0.5 - 4 / Math.PI ** 2), acRectifiedAverage: acRect, peak: A, acPeak: mean - sampledTrough }, 2 * CYCLES);
    // Its fundamental is twice the line frequency.
    expect(Math.abs(a.frequency! / (2 * F) - 1)).toBeLessThan(1e-5);
  });

  it('half-wave rectified sine: mean A/π, RMS A/2, FF π/2, CF 2', () => {
    const mean = A / Math.PI;
    const acRect = (A / Math.PI) * (2 * Math.sqrt(1 - 1 / Math.PI ** 2) - 1 + (2 / Math.PI) * Math.asin(1 / Math.PI));
    checkAll(shapes.halfWave(A), { mean, rectifiedAverage: mean, rms: A / 2, acRms: A * Math.sqrt(0.25 - 1 / Math.PI ** 2), acRectifiedAverage: acRect, peak: A, acPeak: A - mean });
  });

  it('square ±A, 50 % duty: every figure A, FF 1, CF 1', () => {
    checkAll(shapes.square(A), { mean: 0, rectifiedAverage: A, rms: A, acRms: A, acRectifiedAverage: A, peak: A, acPeak: A });
  });

  for (const D of [0.5, 0.25, 0.1, 0.05]) {
    it(`unipolar pulse train 0…A, duty ${D}: mean A·D, RMS A·√D, AC RMS A·√(D(1−D))`, () => {
      checkAll(shapes.pulse(A, D), {
        mean: A * D,
        rectifiedAverage: A * D,
        rms: A * Math.sqrt(D),
        acRms: A * Math.sqrt(D * (1 - D)),
        acRectifiedAverage: 2 * A * D * (1 - D),
        peak: A,
        acPeak: A * (1 - D),
      });
    });
  }

  it('triangle ±A: rect. avg A/2, RMS A/√3, CF √3, FF 2/√3', () => {
    // The apex falls between two midpoint samples, half a step (slope 4A per period) below A.
    const sampledPeak = A * (1 - 2 / PER_CYCLE);
    const a = checkAll(shapes.triangle(A), { mean: 0, rectifiedAverage: A / 2, rms: A / Math.sqrt(3), acRms: A / Math.sqrt(3), acRectifiedAverage: A / 2, peak: sampledPeak, acPeak: sampledPeak });
    expect(a.crestFactor! / Math.sqrt(3) - 1).toBeCloseTo(0, 3);
  });

  it('sawtooth ±A: same amplitude figures as the triangle (uniform amplitude distribution)', () => {
    // The ramp's peak lies on its edge, which midpoint samples never reach: the largest sample is
    // A·(1 − 1/perCycle); every other figure is an integral and keeps its closed form.
    const sampledPeak = A * (1 - 1 / PER_CYCLE);
    checkAll(shapes.sawtooth(A), { mean: 0, rectifiedAverage: A / 2, rms: A / Math.sqrt(3), acRms: A / Math.sqrt(3), acRectifiedAverage: A / 2, peak: sampledPeak, acPeak: sampledPeak });
  });

  for (const deg of [30, 60, 90, 120, 150]) {
    it(`phase-cut sine, firing angle ${deg}°: RMS (A/√2)·√(1 − α/π + sin 2α/(2π)), rect. avg A(1 + cos α)/π`, () => {
      const alpha = (deg * Math.PI) / 180;
      const rms = (A / Math.SQRT2) * Math.sqrt(1 - alpha / Math.PI + Math.sin(2 * alpha) / (2 * Math.PI));
      const rect = (A * (1 + Math.cos(alpha))) / Math.PI;
      // Past 90° the peak is at the firing instant; the first sample after it is half a step later.
      const peak = deg <= 90 ? A : A * Math.sin(alpha + Math.PI / PER_CYCLE);
      checkAll(shapes.phaseCut(A, alpha), { mean: 0, rectifiedAverage: rect, rms, acRms: rms, acRectifiedAverage: rect, peak, acPeak: peak });
    });
  }

  for (const c of [0.5, 1, 2]) {
    it(`DC ${c}·A plus sine A: RMS √(c² + A²/2), AC RMS A/√2, an AC-coupled meter sees no DC`, () => {
      const dc = c * A;
      const rect = dc >= A ? dc : (2 / Math.PI) * (Math.sqrt(A * A - dc * dc) + dc * Math.asin(dc / A));
      const a = checkAll(shapes.dcPlusSine(dc, A), { mean: dc, rectifiedAverage: rect, rms: Math.sqrt(dc * dc + (A * A) / 2), acRms: A / Math.SQRT2, acRectifiedAverage: (2 * A) / Math.PI, peak: dc + A, acPeak: A });
      expect(a.warnings.map((w) => w.code)).toContain('dcHiddenFromAcMeter');
    });
  }
});

describe('meter errors that are facts of the trade', () => {
  it('an averaging meter reads 11.07 % high on a 50 % square wave (common practice, no source; k − 1 = 0.110721)', () => {
    const a = analyzeChannel(sampled(shapes.square(1), PER_CYCLE, CYCLES), FS);
    expect(a.meters.averageResponding.errorPercent).toBeCloseTo(11.0721, 3);
    expect(a.warnings.map((w) => w.code)).toContain('averagingMeterError');
  });

  it('an averaging meter reads about 3.8 % low on a triangle (common practice, no source; k·√3/2 − 1 = −0.0380876)', () => {
    const a = analyzeChannel(sampled(shapes.triangle(1), PER_CYCLE, CYCLES), FS);
    expect(a.meters.averageResponding.errorPercent).toBeCloseTo(-3.80876, 3);
  });

  it('230 V RMS mains peaks at about 325 V (common practice, no source: 230·√2 = 325.27)', () => {
    const a = analyzeChannel(sampled(shapes.sine(230 * Math.SQRT2), 400, 10), 20000);
    expect(a.rms).toBeCloseTo(230, 6);
    expect(a.peak).toBeCloseTo(325.27, 1);
  });

  it('narrow 10 % pulses: the averaging meter reads about 33 % low (DOMAIN closed form 2k·√(D(1−D)) − 1 = −33.3568 %)', () => {
    const a = analyzeChannel(sampled(shapes.pulse(1, 0.1), PER_CYCLE, CYCLES), FS);
    expect(a.meters.averageResponding.errorPercent).toBeCloseTo(100 * (2 * k * Math.sqrt(0.09) - 1), 4);
    expect(a.meters.averageResponding.errorPercent).toBeCloseTo(-33.3568, 3);
  });

  it('for any sine, the averaging meter equals the true RMS (sine calibration; common practice, no source)', () => {
    const a = analyzeChannel(sampled(shapes.sine(7), 1000, 12, 0.123), 60000);
    // Zero crossings between samples leave the rectified average a midpoint-rule error of order
    // (π/perCycle)²: about 1e-6 relative at 1000 samples per cycle.
    expect(Math.abs(a.meters.averageResponding.errorPercent!)).toBeLessThan(1e-3);
    // The largest of 1000 samples per cycle misses the crest by at most 1 − cos(π/1000) ≈ 5e-6.
    expect(Math.abs(a.meters.peakResponding.errorPercent!)).toBeLessThan(1e-3);
  });
});
