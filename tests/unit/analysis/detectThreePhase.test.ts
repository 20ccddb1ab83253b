/**
 * Finding three-phase sets by channel names and by fundamentals 120° apart. The label families
 * (L1/L2/L3, A/B/C, R/S/T, U/V/W, -N for line-to-neutral) are common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import { detectThreePhase, parsePhaseName, type ChannelForDetection } from '../../../shared/analysis';

const ch = (name: string, unit: string, rms: number | null, angleDeg = 0): ChannelForDetection => ({ name, unit, fundamental: rms === null ? null : { rms, angleDeg } });

describe('parsePhaseName', () => {
  const cases: [string, string | null, number | null, number | null][] = [
    ['L1-N', 'L', 0, null],
    ['L2', 'L', 1, null],
    ['l3n', 'L', 2, null],
    ['Van', 'ABC', 0, null],
    ['Vb', 'ABC', 1, null],
    ['I c', 'ABC', 2, null],
    ['IL2', 'L', 1, null],
    ['Phase T voltage', 'RST', 2, null],
    ['U-V', 'UVW', 0, 1],
    ['Vbc', 'ABC', 1, 2],
    ['L3-L1', 'L', 2, 0],
    ['U1', 'digits', 0, null],
    ['W (V)', 'UVW', 2, null],
    ['CH1', null, null, null],
    ['Lamp voltage', null, null, null],
    ['DC out', null, null, null],
    ['N', null, null, null],
  ];
  for (const [name, family, phase, to] of cases) {
    it(`"${name}" → ${family ? `${family} ${phase}${to !== null ? `-${to}` : ''}` : 'no phase'}`, () => {
      const p = parsePhaseName(name);
      if (family === null) expect(p).toBeNull();
      else expect(p).toEqual({ family, phase, to });
    });
  }
});

describe('detectThreePhase', () => {
  it('named L1-N, L2-N, L3-N and currents IL1..IL3, in any column order: one wye set with currents, by names', () => {
    const chans = [ch('IL2', 'A', 10, -150), ch('L3-N', 'V', 230, 120), ch('L1-N', 'V', 230, 0), ch('IL1', 'A', 10, -30), ch('L2-N', 'V', 230, -120), ch('IL3', 'A', 10, 90)];
    expect(detectThreePhase(chans)).toEqual([{ voltageChannels: [2, 4, 1], currentChannels: [3, 0, 5], connection: 'wye', detectedBy: 'names' }]);
  });

  it('line-to-line names L1-L2, L2-L3, L3-L1: a delta set', () => {
    const chans = [ch('L1-L2', 'V', 400, 30), ch('L2-L3', 'V', 400, -90), ch('L3-L1', 'V', 400, 150)];
    expect(detectThreePhase(chans)).toEqual([{ voltageChannels: [0, 1, 2], currentChannels: null, connection: 'delta', detectedBy: 'names' }]);
  });

  it('unnamed channels whose fundamentals are 120° apart: a set by angles, ordered as a positive sequence', () => {
    const chans = [ch('CH1', 'V', 231, 5), ch('CH2', 'V', 229, 125), ch('CH3', 'V', 230, -115), ch('CH4', 'A', 12, -20), ch('CH5', 'A', 11, 100), ch('CH6', 'A', 12, -140)];
    const [s] = detectThreePhase(chans);
    expect(s).toEqual({ voltageChannels: [0, 2, 1], currentChannels: [3, 5, 4], connection: 'wye', detectedBy: 'angles' });
  });

  it('named channels whose fundamentals are not 120° apart are not taken for a set', () => {
    const chans = [ch('L1', 'V', 230, 0), ch('L2', 'V', 230, 0), ch('L3', 'V', 230, 0)];
    expect(detectThreePhase(chans)).toEqual([]);
  });

  it('a single-phase capture (voltage and current) has no set', () => {
    expect(detectThreePhase([ch('L1-N', 'V', 230, 0), ch('L1', 'A', 4, -20)])).toEqual([]);
  });

  it('channels without a fundamental are not searched', () => {
    expect(detectThreePhase([ch('a', 'V', null), ch('b', 'V', null), ch('c', 'V', null)])).toEqual([]);
  });
});
