/** The one-sentence explanation names the cause: DC part, form factor, crest factor (values from the closed forms of DOMAIN table 1c). */
import { describe, expect, it } from 'vitest';
import { analyzeChannel, meterExplanation } from '../../../shared/analysis';
import { sampled, shapes } from '../../helpers/signals';

const explain = (shape: (p: number) => number) => meterExplanation(analyzeChannel(sampled(shape, 2000, 10), 100000));

describe('meterExplanation', () => {
  it('a sine: all meters agree', () => expect(explain(shapes.sine(1))).toMatch(/agree within 2 %/));
  it('a square wave: form factor 1.000, averaging +11.1 %, peak −29.3 %', () => {
    const s = explain(shapes.square(1));
    expect(s).toMatch(/form factor is 1\.000/);
    expect(s).toMatch(/averaging one 11\.1 % high/);
    expect(s).toMatch(/peak-responding one 29\.3 % low/);
  });
  it('a DC part: AC-coupled meters read low against AC+DC', () => expect(explain(shapes.dcPlusSine(2, 1))).toMatch(/DC part of 2\.00 is invisible/));
});
