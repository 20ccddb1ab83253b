/**
 * Worked cases of the limit checks, each just inside and just outside a limit. The signals are sums of
 * harmonics sampled over whole cycles, so the engine's harmonic RMS values equal the ones built in
 * (synchronised rectangular DFT; tolerance 1e-9 relative). The limits are those of limitTables.test.ts,
 * with their sources named there; the "disregard below 5 mA or 0.6 %" rule is from memory.
 */
import { describe, expect, it } from 'vitest';
import { analyzeChannel } from '../../../shared/analysis';
import { checkCompliance } from '../../../shared/limits/checkCompliance';
import { ComplianceRequest } from '../../../shared/schemas/compliance';

/** A record of `cycles` cycles at f Hz, 400 samples a cycle, from harmonic RMS values {order: rms}. */
function analysisOf(rmsByOrder: Record<number, number>, opts: { f?: number; cycles?: number; dc?: number } = {}) {
  const f = opts.f ?? 50;
  const cycles = opts.cycles ?? 10;
  const fs = 400 * f;
  const x = Float64Array.from({ length: 400 * cycles }, (_, k) => {
    let v = opts.dc ?? 0;
    for (const [h, rms] of Object.entries(rmsByOrder)) v += rms * Math.SQRT2 * Math.sin(2 * Math.PI * Number(h) * f * (k / fs) + 0.3 * Number(h));
    return v;
  });
  return analyzeChannel(x, fs);
}
const check = (a: ReturnType<typeof analysisOf>, unit: string, req: unknown, power: { activePower: number; powerFactor: number | null } | null = null) =>
  checkCompliance({ analysis: a, unit, power }, ComplianceRequest.parse(req));
const row = (r: ReturnType<typeof check>, order: number | null) => r.rows.find((x) => x.order === order)!;

describe('checkCompliance: IEEE 519 voltage', () => {
  const req = { standard: 'ieee519', channel: 0, nominalVoltage: 230 };
  it('a 5th harmonic of 4.99 % of 230 V passes, 5.01 % fails (limit 5.0 % up to 1 kV)', () => {
    const pass = check(analysisOf({ 1: 230, 5: 0.0499 * 230 }), 'V', req);
    expect(pass.verdict).toBe('pass');
    expect(row(pass, 5)).toMatchObject({ limitPercent: 5, pass: true });
    expect(row(pass, 5).measuredPercent).toBeCloseTo(4.99, 9);
    const fail = check(analysisOf({ 1: 230, 5: 0.0501 * 230 }), 'V', req);
    expect(fail.verdict).toBe('fail');
    expect(row(fail, 5).pass).toBe(false);
    expect(fail.notes[0]).toMatch(/^Indicative only/);
  });
  it('THD just under 8 % passes and just over fails, though every harmonic is under 5 %', () => {
    // Four harmonics of 3.99 % give THD = 2 × 3.99 = 7.98 %; of 4.01 %, 8.02 %.
    const at = (p: number) => check(analysisOf({ 1: 230, 3: p * 230, 5: p * 230, 7: p * 230, 9: p * 230 }), 'V', req);
    expect(row(at(0.0399), null)).toMatchObject({ quantity: 'thd', limitPercent: 8, pass: true });
    expect(row(at(0.0399), null).measuredPercent).toBeCloseTo(7.98, 9);
    expect(at(0.0401).verdict).toBe('fail');
    expect(row(at(0.0401), 3).pass).toBe(true);
  });
  it('a 13.8 kV bus (1–69 kV) is held to 3 %: 2.9 % passes, 3.1 % fails', () => {
    const kv = { ...req, nominalVoltage: 7967 }; // 13.8 kV line-to-line, measured line-to-neutral in kV
    expect(check(analysisOf({ 1: 7.967, 7: 0.029 * 7.967 }), 'kV', kv).verdict).toBe('pass');
    const r = check(analysisOf({ 1: 7.967, 7: 0.031 * 7.967 }), 'kV', { ...kv, nominalVoltage: 13_800 });
    expect(r.standard).toMatch(/1 kV < V ≤ 69 kV/);
    expect(r.notes.some((n) => /more than 10 % from the nominal voltage/.test(n))).toBe(true);
  });
  it('is not applicable to a current channel, a 40 Hz drive output, a 5-cycle record or a DC supply', () => {
    expect(check(analysisOf({ 1: 10 }), 'A', req)).toMatchObject({ verdict: 'not-applicable', reason: expect.stringMatching(/needs volts/) });
    expect(check(analysisOf({ 1: 230 }, { f: 40 }), 'V', req).reason).toMatch(/40\.00 Hz.*50 Hz and 60 Hz/);
    expect(check(analysisOf({ 1: 230 }, { cycles: 5 }), 'V', req).reason).toMatch(/5 whole cycles.*10 cycles at 50 Hz/);
    expect(check(analysisOf({}, { dc: 24 }), 'V', req).reason).toMatch(/no steady fundamental/);
  });
  it('needs 12 cycles at 60 Hz: 11 are too few', () => {
    expect(check(analysisOf({ 1: 120 }, { f: 60, cycles: 11 }), 'V', { ...req, nominalVoltage: 120 }).reason).toMatch(/12 cycles at 60 Hz/);
    expect(check(analysisOf({ 1: 120 }, { f: 60, cycles: 12 }), 'V', { ...req, nominalVoltage: 120 }).verdict).toBe('pass');
  });
});

describe('checkCompliance: IEEE 519 current', () => {
  // I_SC/I_L = 25 takes the 20–50 row: 7.0 % for 3 ≤ h < 11, even 1.75 %, TDD 8.0 %.
  const req = { standard: 'ieee519', kind: 'current', channel: 0, nominalVoltage: 480, iscIl: 25, loadCurrent: 100 };
  it('a 5th of 6.99 A in 100 A passes; 7.01 A fails', () => {
    expect(check(analysisOf({ 1: 90, 5: 6.99 }), 'A', req).verdict).toBe('pass');
    const r = check(analysisOf({ 1: 90, 5: 7.01 }), 'A', req);
    expect(r.verdict).toBe('fail');
    expect(row(r, 5)).toMatchObject({ limitPercent: 7, pass: false });
    expect(r.basis).toEqual({ of: 'loadCurrent', value: 100, unit: 'A' });
  });
  it('an even 4th is held to 25 %: 1.74 A passes, 1.76 A fails', () => {
    expect(row(check(analysisOf({ 1: 90, 4: 1.74 }), 'A', req), 4)).toMatchObject({ limitPercent: 1.75, pass: true });
    expect(row(check(analysisOf({ 1: 90, 4: 1.76 }), 'A', req), 4).pass).toBe(false);
  });
  it('TDD over 8 % of I_L fails although each harmonic passes', () => {
    // 5th, 7th: 5.7 A each → √(2·5.7²) = 8.06 A = 8.06 % of 100 A.
    const r = check(analysisOf({ 1: 90, 5: 5.7, 7: 5.7 }), 'A', req);
    expect(row(r, null)).toMatchObject({ quantity: 'tdd', limitPercent: 8, pass: false });
    expect(row(r, null).measuredPercent).toBeCloseTo(Math.SQRT2 * 5.7, 9);
  });
  it('reads a channel in mA as amperes', () => {
    expect(row(check(analysisOf({ 1: 90_000, 5: 7010 }), 'mA', req), 5).measured).toBeCloseTo(7.01, 9);
  });
  it('is not applicable above 69 kV (Tables 3 and 4 are not included)', () => {
    expect(check(analysisOf({ 1: 90 }), 'A', { ...req, nominalVoltage: 115_000 }).reason).toMatch(/120 V to 69 kV/);
  });
});

describe('checkCompliance: IEC 61000-3-2', () => {
  it('Class A: a 3rd of 2.29 A passes, 2.31 A fails (limit 2.30 A)', () => {
    const req = { standard: 'iec61000-3-2', class: 'A', channel: 0 };
    const pass = check(analysisOf({ 1: 8, 3: 2.29 }), 'A', req);
    expect(row(pass, 3)).toMatchObject({ limit: 2.3, limitPercent: null, pass: true });
    expect(pass.rows.map((r) => r.order)).toEqual(Array.from({ length: 39 }, (_, i) => i + 2));
    expect(check(analysisOf({ 1: 8, 3: 2.31 }), 'A', req).verdict).toBe('fail');
  });
  it('Class C disregards an 11th of 4.5 mA (below 5 mA) instead of failing it against 3 % of 0.1 A', () => {
    const req = { standard: 'iec61000-3-2', class: 'C', channel: 0, powerFactor: 0.95 };
    const r = check(analysisOf({ 1: 0.1, 11: 0.0045 }), 'A', req);
    expect(row(r, 11).pass).toBeNull();
    expect(r.verdict).toBe('pass');
    expect(r.notes.join(' ')).toMatch(/Order 11 would exceed the limit but is below 5\.00 mA/);
    // 6 mA is above the threshold and over 3 mA: judged, and failing.
    expect(row(check(analysisOf({ 1: 0.1, 11: 0.006 }), 'A', req), 11).pass).toBe(false);
  });
  it('Class D at 200 W from the Power figures: a 3rd of 0.67 A passes, 0.69 A fails (3.4 mA/W)', () => {
    const req = { standard: 'iec61000-3-2', class: 'D', channel: 0 };
    const power = { activePower: 200, powerFactor: 0.6 };
    expect(check(analysisOf({ 1: 0.9, 3: 0.67 }), 'A', req, power).verdict).toBe('pass');
    const r = check(analysisOf({ 1: 0.9, 3: 0.69 }), 'A', req, power);
    expect(row(r, 3).limit).toBeCloseTo(0.68, 12);
    expect(r.verdict).toBe('fail');
    expect(r.rows.every((x) => x.order! % 2 === 1)).toBe(true);
  });
  it('Class D is not applicable without a power, at 75 W or above 600 W', () => {
    const a = analysisOf({ 1: 0.5 });
    expect(check(a, 'A', { standard: 'iec61000-3-2', class: 'D', channel: 0 }).reason).toMatch(/per watt/);
    expect(check(a, 'A', { standard: 'iec61000-3-2', class: 'D', channel: 0, activePower: 75 }).reason).toMatch(/no limits at 75 W or less/);
    expect(check(a, 'A', { standard: 'iec61000-3-2', class: 'D', channel: 0, activePower: 600.5 }).reason).toMatch(/up to 600 W/);
    expect(check(a, 'A', { standard: 'iec61000-3-2', class: 'D', channel: 0, activePower: 75.5 }).verdict).toBe('pass');
  });
  it('Class C with λ = 0.9: a 3rd of 26.9 % of the fundamental passes, 27.1 % fails', () => {
    const req = { standard: 'iec61000-3-2', class: 'C', channel: 0, powerFactor: 0.9 };
    expect(check(analysisOf({ 1: 0.5, 3: 0.269 * 0.5 }), 'A', req).verdict).toBe('pass');
    const r = check(analysisOf({ 1: 0.5, 3: 0.271 * 0.5 }), 'A', req);
    expect(row(r, 3)).toMatchObject({ limit: null, pass: false });
    expect(row(r, 3).limitPercent).toBeCloseTo(27, 12);
    expect(r.basis?.of).toBe('fundamental');
  });
  it('is not applicable above 16 A input current, or to a voltage channel', () => {
    expect(check(analysisOf({ 1: 16.5 }), 'A', { standard: 'iec61000-3-2', class: 'A', channel: 0 }).reason).toMatch(/up to 16 A/);
    expect(check(analysisOf({ 1: 230 }), 'V', { standard: 'iec61000-3-2', class: 'A', channel: 0 }).reason).toMatch(/needs amperes/);
  });
});
