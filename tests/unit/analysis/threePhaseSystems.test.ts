/**
 * A capture's three-phase systems from its channels: found by names, stated by a user, and brought to
 * V and A from prefixed units. Expected values: balanced 230 V / 10 A lagging 30° gives Se = 3·V·I =
 * 6900 VA and P = 6900·cos 30° (IEEE 1459-2010 check of the domain notes §8b; circuit theory).
 */
import { describe, expect, it } from 'vitest';
import { threePhaseSystems, type NamedChannel } from '../../../shared/analysis';
import { FS, three } from '../../helpers/threePhase';

const [va, vb, vc] = three({ rms: 230, angleDeg: 0 }, { rms: 230, angleDeg: -120 }, { rms: 230, angleDeg: 120 });
const [ia, ib, ic] = three({ rms: 10, angleDeg: -30 }, { rms: 10, angleDeg: -150 }, { rms: 10, angleDeg: 90 });
const ch = (name: string, unit: string, samples: Float64Array): NamedChannel => ({ name, unit, samples });

describe('threePhaseSystems', () => {
  it('finds the named set with its currents and analyses it', () => {
    const [s] = threePhaseSystems([ch('Ia', 'A', ia), ch('Va', 'V', va), ch('Ib', 'A', ib), ch('Vb', 'V', vb), ch('Ic', 'A', ic), ch('Vc', 'V', vc)], FS, 0, null);
    expect(s).toMatchObject({ voltageChannels: [1, 3, 5], currentChannels: [0, 2, 4], detectedBy: 'names', connection: 'wye' });
    expect(s.power!.Se).toBeCloseTo(6900, 3);
    expect(s.power!.P).toBeCloseTo(6900 * Math.cos(Math.PI / 6), 3);
  });

  it('brings kV and mA channels to V and A before the figures', () => {
    const k = (x: Float64Array, f: number) => x.map((v) => v * f);
    const chans = [ch('L1', 'kV', k(va, 1e-3)), ch('L2', 'kV', k(vb, 1e-3)), ch('L3', 'kV', k(vc, 1e-3)), ch('I1', 'mA', k(ia, 1e3)), ch('I2', 'mA', k(ib, 1e3)), ch('I3', 'mA', k(ic, 1e3))];
    const [s] = threePhaseSystems(chans, FS, 0, null);
    expect(s.sequence.positive).toBeCloseTo(230, 6);
    expect(s.power!.Se).toBeCloseTo(6900, 3);
  });

  it('uses the sets a user stated, leaves out one naming a channel the capture lacks, and finds none when told there are none', () => {
    const chans = [ch('CH1', 'V', va), ch('CH2', 'V', vb), ch('CH3', 'V', vc)];
    const r = threePhaseSystems(chans, FS, 0, [{ voltageChannels: [0, 1, 2], connection: 'wye' }, { voltageChannels: [0, 1, 7], connection: 'wye' }]);
    expect(r).toHaveLength(1);
    expect(r[0]).toMatchObject({ detectedBy: 'user', currentChannels: null });
    expect(threePhaseSystems(chans, FS, 0, [])).toEqual([]);
    // Left to itself, the unnamed set is found by its angles.
    expect(threePhaseSystems(chans, FS, 0, null)[0].detectedBy).toBe('angles');
  });
});
