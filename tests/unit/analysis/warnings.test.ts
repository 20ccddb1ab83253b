/** Warnings. Thresholds (DC hiding > 5 %, crest factor > 3, averaging error > 2 %) are the engine's spec; clipping signs are common practice, no source. */
import { describe, expect, it } from 'vitest';
import { analyzeChannel, findClipping } from '../../../shared/analysis';
import { sampled, shapes } from '../../helpers/signals';

const codes = (x: Float64Array, fs: number) => analyzeChannel(x, fs).warnings.map((w) => w.code);

describe('findClipping', () => {
  it('flags a sine clipped at 80 % of its peak', () => {
    const x = sampled((p) => Math.max(-0.8, Math.min(0.8, Math.sin(2 * Math.PI * p))), 500, 10);
    const found = findClipping(x, 0, x.length, -0.8, 0.8);
    expect(found.map((f) => f.rail).sort()).toEqual(['max', 'min']);
  });

  it('does not flag the flat tops of a square wave', () => {
    const x = sampled(shapes.square(1), 500, 10);
    expect(findClipping(x, 0, x.length, -1, 1)).toEqual([]);
  });

  it('does not flag a clean sine quantised by an 8-bit converter', () => {
    const lsb = 2 / 256;
    const x = sampled((p) => Math.round(Math.sin(2 * Math.PI * p) / lsb) * lsb, 2000, 10);
    let min = Infinity;
    let max = -Infinity;
    for (const v of x) { min = Math.min(min, v); max = Math.max(max, v); }
    expect(findClipping(x, 0, x.length, min, max)).toEqual([]);
  });
});

describe('analysis warnings', () => {
  it('a sine is clean: no warning', () => {
    expect(codes(sampled(shapes.sine(1), 400, 10), 20000)).toEqual([]);
  });

  it('narrow pulses: crest factor above 3 and an averaging-meter error', () => {
    const c = codes(sampled(shapes.pulse(1, 0.05), 400, 10), 20000);
    expect(c).toContain('highCrestFactor');
    expect(c).toContain('averagingMeterError');
  });

  it('a clipped sine is flagged', () => {
    expect(codes(sampled((p) => Math.min(0.7, Math.sin(2 * Math.PI * p)), 400, 10), 20000)).toContain('clipping');
  });

  it('too few samples per cycle for 50 harmonics: Nyquist warning', () => {
    expect(codes(sampled(shapes.sine(1), 20, 10), 1000)).toContain('sampleRateTooLow');
  });

  it('a record of one and a half cycles: short-window warning', () => {
    const x = Float64Array.from({ length: 300 }, (_, i) => Math.sin(2 * Math.PI * ((i + 0.5) / 200 + 0.75)));
    const a = analyzeChannel(x, 10000);
    expect(a.window.cycles).toBe(1);
    expect(a.warnings.map((w) => w.code)).toContain('shortWindow');
  });
});
