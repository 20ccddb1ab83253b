/** The anomaly finder on invented captures with anomalies planted at known times (the invented demo capture and variants). */
import { describe, expect, it } from 'vitest';
import { findAnomalies } from '../../../shared/analysis';
import { demoCaptures } from '../../../server/demo/demoWaveforms';

const FS = 20000;
const sine = (t: number) => 325 * Math.sin(2 * Math.PI * 50 * t);
const record = (seconds: number, f: (t: number) => number) => Float64Array.from({ length: FS * seconds }, (_, i) => f(i / FS));
const kinds = (list: { kind: string }[]) => [...new Set(list.map((a) => a.kind))].sort();

describe('findAnomalies', () => {
  it('a clean sine raises nothing', () => {
    expect(findAnomalies(record(0.4, sine), FS, 0, 50)).toEqual([]);
  });

  it('finds the sag, the spike and the clipping planted in the demo supply capture, at their times', () => {
    const demo = demoCaptures().find((c) => c.file === 'supply-with-anomalies.csv')!;
    const x = record(demo.seconds, (t) => demo.channels[0].at(t, () => 0));
    const found = findAnomalies(x, FS, 0, 50);
    const sag = found.find((a) => a.kind === 'sag')!;
    expect(sag.startS).toBeCloseTo(0.2, 2);
    expect(sag.endS).toBeCloseTo(0.3, 2);
    expect(sag.reason).toMatch(/82\.\d %/);
    const spike = found.find((a) => a.kind === 'spike')!;
    expect(spike.startS).toBeGreaterThan(0.455);
    expect(spike.endS).toBeLessThan(0.4556);
    const clipping = found.filter((a) => a.kind === 'clipping');
    expect(clipping.length).toBeGreaterThan(0);
    expect(Math.min(...clipping.map((c) => c.startS))).toBeGreaterThanOrEqual(0.5);
  });

  it('a swell of 15 % over three cycles', () => {
    const found = findAnomalies(record(0.4, (t) => sine(t) * (t >= 0.1 && t < 0.16 ? 1.15 : 1)), FS, 0, 50);
    expect(kinds(found)).toEqual(['swell']);
    expect(found[0].startS).toBeCloseTo(0.1, 3);
    expect(found[0].endS).toBeCloseTo(0.16, 3);
  });

  it('a dropout: the signal flat for 30 ms', () => {
    const found = findAnomalies(record(0.4, (t) => (t >= 0.2 && t < 0.23 ? 0 : sine(t))), FS, 0, 50);
    const d = found.find((a) => a.kind === 'dropout')!;
    expect(d.startS).toBeCloseTo(0.2, 2);
    expect(d.endS).toBeCloseTo(0.23, 2);
  });

  it('a frequency deviation: cycles at 53 Hz in a 50 Hz record', () => {
    let phase = 0;
    const x = Float64Array.from({ length: FS * 0.5 }, (_, i) => {
      const t = i / FS;
      phase += (2 * Math.PI * (t >= 0.2 && t < 0.3 ? 53 : 50)) / FS;
      return 325 * Math.sin(phase);
    });
    const f = findAnomalies(x, FS, 0, 50).filter((a) => a.kind === 'frequency');
    expect(f.length).toBeGreaterThan(0);
    expect(f[0].startS).toBeGreaterThan(0.18);
    expect(f[f.length - 1].endS).toBeLessThan(0.33);
  });
});
