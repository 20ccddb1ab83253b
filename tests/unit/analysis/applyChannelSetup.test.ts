/**
 * Turning recorded values into engineering units, and suggesting a declared voltage. Probe and clamp
 * ratios (a 100 mV/A clamp reads 0.1 V per ampere; a shunt gives V = I·R) are Ohm's law and common
 * practice, no source; the nominal voltages are common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import { applyChannelSetup, declaredForChannel, scaleFromMillivoltsPerAmp, scaleFromShunt, suggestDeclaredVoltage } from '../../../shared/analysis';
import { ChannelSetupPatch } from '../../../shared/schemas/channelSetup';

describe('applyChannelSetup', () => {
  it('a 100 mV/A clamp: 0.5 V recorded is 5 A', () => {
    const out = applyChannelSetup(Float64Array.of(0.5, -0.25, 0), { scale: scaleFromMillivoltsPerAmp(100), offset: 0, invert: false });
    expect(Array.from(out)).toEqual([5, -2.5, 0]);
  });

  it('a 10 mΩ shunt: 20 mV is 2 A; inverted and offset, (−scale)·x + offset', () => {
    expect(scaleFromShunt(0.01)).toBe(100);
    const out = applyChannelSetup(Float32Array.of(0.02), { scale: 100, offset: 0.5, invert: true });
    expect(out[0]).toBeCloseTo(-2 + 0.5, 6);
  });

  it('leaves invalid samples invalid and the recorded array untouched', () => {
    const x = Float64Array.of(1, NaN, 3);
    const out = applyChannelSetup(x, { scale: 10, offset: 0, invert: false });
    expect(Number.isNaN(out[1])).toBe(true);
    expect(Array.from(x.filter((v) => !Number.isNaN(v)))).toEqual([1, 3]);
  });
});

describe('ChannelSetupPatch', () => {
  const field = (body: unknown) => {
    const r = ChannelSetupPatch.safeParse(body);
    return r.success ? null : r.error.issues[0].path.join('.') || r.error.issues[0].message;
  };
  it('names the field of a bad value: zero or non-finite scale, unknown unit, long name', () => {
    expect(field({ scale: 0 })).toBe('scale');
    expect(field({ scale: Infinity })).toBe('scale');
    expect(field({ scale: 1e12 })).toBe('scale');
    expect(field({ unit: 'Volts' })).toBe('unit');
    expect(field({ name: 'x'.repeat(121) })).toBe('name');
    expect(field({ colour: 'red' })).not.toBeNull();
    expect(field({})).toBe('Nothing to change');
    expect(field({ scale: 10, unit: 'A', name: 'Clamp L1', offset: -0.2, invert: true })).toBeNull();
  });
});

describe('suggestDeclaredVoltage', () => {
  it('the nearest nominal voltage within 15 %, else none', () => {
    expect(suggestDeclaredVoltage(228.4)).toBe(230);
    expect(suggestDeclaredVoltage(118)).toBe(120);
    expect(suggestDeclaredVoltage(281)).toBe(277);
    expect(suggestDeclaredVoltage(402)).toBe(400);
    expect(suggestDeclaredVoltage(24)).toBeNull();
  });

  it('a line-to-line channel compares with the declared voltage × √3', () => {
    expect(declaredForChannel(230, 396)).toBeCloseTo(230 * Math.sqrt(3), 9);
    expect(declaredForChannel(400, 231)).toBeCloseTo(400 / Math.sqrt(3), 9);
    expect(declaredForChannel(230, 225)).toBe(230);
  });
});
