import { describe, expect, it } from 'vitest';
import { DftPlan, dtftAt } from '../../../shared/analysis';
import { seededRandom } from '../../helpers/signals';

/** The textbook definition X[k] = Σ x[n]·e^(−j2πkn/N), summed directly: the independent reference. */
function directDft(x: Float64Array) {
  const n = x.length;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    for (let i = 0; i < n; i++) {
      const angle = (-2 * Math.PI * ((k * i) % n)) / n;
      re[k] += x[i] * Math.cos(angle);
      im[k] += x[i] * Math.sin(angle);
    }
  }
  return { re, im };
}

describe('DftPlan (fft.js, Bluestein for other sizes) against a direct DFT on random signals', () => {
  for (const size of [2, 3, 7, 64, 100, 200, 257, 1000, 1024, 1500]) {
    it(`size ${size}`, () => {
      const rand = seededRandom(size);
      const x = new Float64Array(size).map(() => rand() * 2 - 1);
      const ref = directDft(x);
      const re = new Float64Array(size);
      const im = new Float64Array(size);
      new DftPlan(size).transform(x, 0, re, im);
      let worst = 0;
      let scale = 0;
      for (let k = 0; k < size; k++) {
        worst = Math.max(worst, Math.hypot(re[k] - ref.re[k], im[k] - ref.im[k]));
        scale = Math.max(scale, Math.hypot(ref.re[k], ref.im[k]));
      }
      expect(worst / scale).toBeLessThan(1e-11);
    });
  }

  it('transforms a span starting inside a longer record', () => {
    const rand = seededRandom(9);
    const x = new Float64Array(500).map(() => rand());
    const re = new Float64Array(300);
    const im = new Float64Array(300);
    new DftPlan(300).transform(x, 123, re, im);
    const ref = directDft(x.slice(123, 423));
    expect(re[17]).toBeCloseTo(ref.re[17], 9);
    expect(im[250]).toBeCloseTo(ref.im[250], 9);
  });

  it('rejects sizes below 2 and spans outside the record, naming the rule', () => {
    expect(() => new DftPlan(1)).toThrow(/integer ≥ 2/);
    expect(() => new DftPlan(8).transform(new Float64Array(4), 0, new Float64Array(8), new Float64Array(8))).toThrow(/outside/);
  });
});

describe('dtftAt', () => {
  it('equals the DFT bin at integer frequencies, over more than one re-seed block', () => {
    const rand = seededRandom(3);
    const x = new Float64Array(3000).map(() => rand() - 0.5);
    const re = new Float64Array(3000);
    const im = new Float64Array(3000);
    new DftPlan(3000).transform(x, 0, re, im);
    for (const k of [1, 7, 1499]) {
      const v = dtftAt(x, 0, 3000, k / 3000);
      expect(v.re).toBeCloseTo(re[k], 9);
      expect(v.im).toBeCloseTo(im[k], 9);
    }
  });
});
