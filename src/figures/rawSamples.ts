import type { SamplesResponse } from '../../shared/schemas/capture';

/**
 * The samples of a raw answer as numbers for the engine, invalid ones as NaN and scaled by `scale`.
 * Figures need every sample: a min/max answer (the span held more samples than asked for) is refused.
 */
export function rawSamples(r: SamplesResponse, scale = 1): Float64Array {
  switch (r.mode) {
    case 'raw':
      return Float64Array.from(r.values, (v) => (v === null ? NaN : v * scale));
    case 'minmax':
      throw new RangeError(`The server sent ${r.min.length.toLocaleString('en')} min/max buckets for ${r.sampleCount.toLocaleString('en')} samples: figures need the samples themselves; select a shorter span.`);
  }
}
