/**
 * Frequency targets (0.01 % on clean sines, 0.1 % with noise, harmonics or DC) are the engine's own
 * requirements; the method, zero crossings with hysteresis refined on the spectrum, is common practice
 * (no source) and the Hann-window spectrum is after F. J. Harris, Proc. IEEE 66(1), 1978.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeChannel, estimateFrequency, timeDomainFigures } from '../../../shared/analysis';
import { gaussian, seededRandom } from '../../helpers/signals';

function signal(fs: number, seconds: number, fn: (t: number) => number): Float64Array {
  const n = Math.round(fs * seconds);
  return Float64Array.from({ length: n }, (_, i) => fn(i / fs));
}

const estimate = (x: Float64Array, fs: number) => estimateFrequency(x, fs, timeDomainFigures(x));

describe('estimateFrequency', () => {
  it('clean mains sines of any phase and frequency: within 0.01 %', () => {
    fc.assert(
      fc.property(fc.double({ min: 45, max: 65, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (f, phase) => {
        const x = signal(10000, 0.2137, (t) => 325 * Math.sin(2 * Math.PI * f * t + phase));
        const e = estimate(x, 10000);
        expect(Math.abs(e.hz! / f - 1)).toBeLessThan(1e-4);
        expect(e.detail!.confidence).toBe('high');
      }),
      { numRuns: 40 },
    );
  });

  it('with 1 % noise: within 0.1 %', () => {
    const rand = seededRandom(42);
    const x = signal(20000, 0.25, (t) => Math.sin(2 * Math.PI * 50.3 * t + 1) + gaussian(rand, 0.01));
    expect(Math.abs(estimate(x, 20000).hz! / 50.3 - 1)).toBeLessThan(1e-3);
  });

  it('with a 10 % 3rd harmonic: within 0.1 %', () => {
    const x = signal(10000, 0.2, (t) => Math.sin(2 * Math.PI * 59.9 * t) + 0.1 * Math.sin(3 * 2 * Math.PI * 59.9 * t + 0.7));
    expect(Math.abs(estimate(x, 10000).hz! / 59.9 - 1)).toBeLessThan(1e-3);
  });

  it('with a DC offset ten times the amplitude: within 0.1 %', () => {
    const x = signal(10000, 0.2, (t) => 10 + Math.sin(2 * Math.PI * 49.7 * t));
    expect(Math.abs(estimate(x, 10000).hz! / 49.7 - 1)).toBeLessThan(1e-3);
  });

  it('a sine-PWM drive output (4 kHz carrier, 50 Hz fundamental): finds the fundamental, not the carrier', () => {
    const fs = 200000;
    const x = signal(fs, 0.2, (t) => {
      const reference = 0.8 * Math.sin(2 * Math.PI * 50 * t);
      const carrier = 2 * Math.abs(2 * ((t * 4000) % 1) - 1) - 1; // triangle ±1
      return reference > carrier ? 300 : -300;
    });
    const e = estimate(x, fs);
    expect(Math.abs(e.hz! / 50 - 1)).toBeLessThan(1e-3);
    expect(e.detail!.method).toBe('zeroCrossingSmoothed');
  });

  it('a long record (2 M samples, 1 % noise, 5 % 3rd): within 0.01 %', () => {
    const rand = seededRandom(11);
    const x = signal(1_000_000, 2, (t) => 325 * Math.sin(2 * Math.PI * 49.93 * t) + 16 * Math.sin(3 * 2 * Math.PI * 49.93 * t) + gaussian(rand, 3.25));
    expect(Math.abs(estimate(x, 1_000_000).hz! / 49.93 - 1)).toBeLessThan(1e-4);
  });

  it('null on DC', () => {
    expect(estimate(new Float64Array(1000).fill(12), 1000).hz).toBeNull();
  });

  it('null on noise', () => {
    const rand = seededRandom(7);
    for (let s = 0; s < 5; s++) {
      const x = Float64Array.from({ length: 20000 }, () => 3 + gaussian(rand, 1));
      expect(estimate(x, 10000).hz).toBeNull();
    }
  });
});

describe('analyzeChannel window', () => {
  it('takes the largest whole number of cycles when the record ends mid-cycle', () => {
    const x = signal(10000, 0.2175, (t) => Math.sin(2 * Math.PI * 50 * t));
    const a = analyzeChannel(x, 10000, { t0: -0.1 });
    expect(a.window.cycles).toBe(10);
    expect(a.window.sampleCount).toBe(2000);
    expect(a.window.startS).toBeCloseTo(-0.1, 12);
    expect(a.window.endS).toBeCloseTo(0.1, 12);
    // RMS over whole cycles is exact; over the full 10.875-cycle record it would be off by ~0.4 %.
    expect(a.rms).toBeCloseTo(Math.SQRT1_2, 6);
  });

  it('uses the whole record with cycles null when aperiodic', () => {
    const rand = seededRandom(1);
    const x = Float64Array.from({ length: 5000 }, () => gaussian(rand, 1));
    const a = analyzeChannel(x, 1000);
    expect(a.window.cycles).toBeNull();
    expect(a.window.sampleCount).toBe(5000);
    expect(a.harmonics).toEqual([]);
    expect(a.thdPercent).toBeNull();
    expect(a.warnings.map((w) => w.code)).toContain('aperiodic');
  });
});
