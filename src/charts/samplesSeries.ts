import type { SamplesResponse } from '../../shared/schemas/capture';

/** x/y arrays of one channel as uPlot draws them; null y values leave a gap. */
export interface XYSeries {
  x: number[];
  y: (number | null)[];
}

/**
 * A samples answer as a line: raw samples as they are; min/max buckets as a zigzag between each bucket's
 * lowest and highest sample, which draws the envelope without losing a spike inside a bucket.
 */
export function samplesSeries(r: SamplesResponse): XYSeries {
  switch (r.mode) {
    case 'raw':
      return { x: r.values.map((_, i) => r.t0S + i * r.stepS), y: r.values };
    case 'minmax': {
      const x: number[] = [];
      const y: (number | null)[] = [];
      r.min.forEach((lo, i) => {
        const t = r.t0S + i * r.stepS;
        x.push(t, t + r.stepS / 2);
        y.push(lo, r.max[i]);
      });
      return { x, y };
    }
  }
}
