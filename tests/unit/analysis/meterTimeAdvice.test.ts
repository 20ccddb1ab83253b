/**
 * The sentence under the simulated display. The ±1 % band is the settling criterion of the brief; the
 * ripple of an RC-averaged full-wave rectified sine, peak to peak about (2/3)/(ωτ) of its mean once
 * ωτ ≫ 1, follows from the 2f term (4A/3π)/(2ωτ) over the mean 2A/π (Fourier series of |sin|,
 * Kreyszig, from memory): exactly (4/3)/√(1 + (2ωτ)²) of the mean from the 2f term alone; the 4f and
 * higher terms change the peak-to-peak value by up to about 15 %, which the bounds below allow.
 */
import { describe, expect, it } from 'vitest';
import { meterTimeAdvice, simulateMeter, type AdviceInput } from '../../../shared/analysis';
import { sampled, shapes } from '../../helpers/signals';

const base: AdviceInput = {
  steadyStateReading: 230, ripplePeakToPeak: 0.5, wanderPeakToPeak: 0.1, settlingTimeS: 1.38, displayRateHz: 5, fundamentalHz: 50, rippleOrder: 1,
  clippedFraction: 0, clipLevel: null, fullScale: null, start: 'connected', repeated: true, simulatedS: 4, unit: 'V',
};

describe('meterTimeAdvice', () => {
  it('settled and steady: wait until the first display update after settling, rounded up', () => {
    expect(meterTimeAdvice(base)).toEqual({ kind: 'wait', sentence: 'Wait 1.4 s after connecting: from then on every reading is within 1 % of the final one.' });
    expect(meterTimeAdvice({ ...base, settlingTimeS: 1.34 }).sentence).toMatch(/^Wait 1\.4 s/);
    expect(meterTimeAdvice({ ...base, displayRateHz: 3 }).sentence).toMatch(/^Wait 1\.7 s/);
    expect(meterTimeAdvice({ ...base, settlingTimeS: 0.05, displayRateHz: 3, start: 'settled' }).sentence).toMatch(/^From 0\.34 s into this span on/);
  });

  it('a swing beyond ±1 %: the frequency below which it cannot read steadily, scaled as 1/f or 1/f²', () => {
    const swing = { ...base, fundamentalHz: 16.7, ripplePeakToPeak: 0.08 * 230 };
    expect(meterTimeAdvice(swing).sentence).toMatch(/^This meter cannot give a steady reading below about 67 Hz: here its reading swings by ±4 %/);
    expect(meterTimeAdvice({ ...swing, rippleOrder: 2 }).sentence).toMatch(/below about 34 Hz/);
    expect(meterTimeAdvice({ ...swing, fundamentalHz: null }).sentence).toMatch(/wanders by ±4 %/);
    expect(meterTimeAdvice({ ...swing, wanderPeakToPeak: 0.06 * 230 }).sentence).toMatch(/wanders by ±3 % because the waveform itself changes/);
  });

  it('a motor hunting at 2 Hz (±10 % amplitude) makes a 0.8 s true RMS meter wander, however high the supply frequency', () => {
    // The mean square swings ±20 % at 2 Hz; its τ/2 = 0.4 s low-pass passes 1/√(1 + (2π·2·0.4)²) = 0.195
    // of that (first-order gain, from memory): ±3.9 % on the mean square, ±1.95 % on its root.
    const x = Float64Array.from({ length: 10_000 }, (_, i) => {
      const t = (i + 0.5) / 10_000;
      return (1 + 0.1 * Math.sin(2 * Math.PI * 2 * t)) * 325 * Math.sin(2 * Math.PI * 50 * t);
    });
    const r = simulateMeter(x, 10_000, { type: 'trueRms', coupling: 'ac', averagingTauS: 0.8 }, { repeat: true, fundamentalHz: 50 });
    const wander = r.settled.wanderPeakToPeak / r.steadyStateReading;
    expect(wander).toBeGreaterThan(0.03);
    expect(wander).toBeLessThan(0.05);
    expect(r.advice.sentence).toMatch(/wanders by ±(1\.9|2) % because the waveform itself changes/);
  });

  it('clipping comes first, then over-range, no signal, a record too short', () => {
    expect(meterTimeAdvice({ ...base, clippedFraction: 0.01, clipLevel: 1800, fullScale: 200 }).kind).toBe('clipped');
    expect(meterTimeAdvice({ ...base, fullScale: 200 }).sentence).toBe("Choose a higher range: the reading (230 V) is beyond this range's full scale of 200 V, so the display shows over-range.");
    expect(meterTimeAdvice({ ...base, fullScale: 600 }).kind).toBe('wait');
    expect(meterTimeAdvice({ ...base, steadyStateReading: 0, ripplePeakToPeak: 0 }).kind).toBe('noSignal');
    expect(meterTimeAdvice({ ...base, settlingTimeS: null, repeated: false }).sentence).toMatch(/loop it/);
    expect(meterTimeAdvice({ ...base, settlingTimeS: null }).sentence).toMatch(/has not settled within 4 s/);
  });

  it('on a 16.7 Hz supply a 0.2 s averaging meter wanders (ripple about 3.2 % of the reading); on 50 Hz it does not (1.1 %)', () => {
    const p = { type: 'averaging', coupling: 'ac', averagingTauS: 0.2 } as const;
    const twoF = (f: number) => 4 / 3 / Math.sqrt(1 + (4 * Math.PI * f * 0.2) ** 2);
    const railway = simulateMeter(sampled(shapes.sine(325), 3000, 10), 16.7 * 3000, p, { repeat: true });
    const swing = railway.settled.ripplePeakToPeak / railway.steadyStateReading;
    expect(swing).toBeGreaterThan(0.85 * twoF(16.7));
    expect(swing).toBeLessThan(1.15 * twoF(16.7));
    expect(railway.advice.kind).toBe('unsteady');
    expect(railway.advice.sentence).toMatch(/cannot give a steady reading below about \d+ Hz/);
    const mains = simulateMeter(sampled(shapes.sine(325), 1000, 10), 50_000, p, { repeat: true });
    expect(mains.settled.ripplePeakToPeak / mains.steadyStateReading).toBeLessThan(1.15 * twoF(50));
    expect(mains.advice.kind).toBe('wait');
  });
});
