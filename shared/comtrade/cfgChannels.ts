import type { CfgCursor } from './CfgCursor';
import type { AnalogChannelConfig, DigitalChannelConfig } from './ComtradeConfig';

/**
 * The analog channel lines, `An,ch_id,ph,ccbm,uu,a,b,skew,min,max,primary,secondary,PS` (1999 clause
 * 6.4.3, from memory). Only the index, a, b and the P/S flag are needed to compute values; the others
 * may be empty.
 */
export function readAnalogChannels(cfg: CfgCursor, count: number, countsLine: number): AnalogChannelConfig[] {
  const out: AnalogChannelConfig[] = [];
  for (let n = 1; n <= count; n++) {
    const hint = `Line ${countsLine} declares ${count} analog channel${count === 1 ? '' : 's'}: does that match the channel lines?`;
    const l = cfg.expect(`analog channel ${n} of ${count}`, 13, 13, hint);
    const ps = cfg.text(l, 12).toUpperCase();
    if (ps !== 'P' && ps !== 'S') throw cfg.error(l.line, `the P/S flag (field 13) must be P or S; it is "${ps.slice(0, 20)}".`);
    out.push({
      index: cfg.integer(l, 0, 'the channel index An', 0, 999_999),
      id: cfg.text(l, 1),
      phase: cfg.text(l, 2),
      circuit: cfg.text(l, 3),
      unit: cfg.text(l, 4),
      a: cfg.number(l, 5, 'the multiplier a'),
      b: cfg.number(l, 6, 'the offset b'),
      skewUs: cfg.number(l, 7, 'the skew', 0),
      min: cfg.number(l, 8, 'the minimum', NaN),
      max: cfg.number(l, 9, 'the maximum', NaN),
      primary: cfg.number(l, 10, 'the primary ratio factor', NaN),
      secondary: cfg.number(l, 11, 'the secondary ratio factor', NaN),
      ps,
      line: l.line,
    });
  }
  return out;
}

/** The digital (status) channel lines, `Dn,ch_id,ph,ccbm,y` (1999 clause 6.4.4, from memory). */
export function readDigitalChannels(cfg: CfgCursor, count: number, countsLine: number): DigitalChannelConfig[] {
  const out: DigitalChannelConfig[] = [];
  for (let n = 1; n <= count; n++) {
    const hint = `Line ${countsLine} declares ${count} digital channel${count === 1 ? '' : 's'}: does that match the channel lines?`;
    const l = cfg.expect(`digital channel ${n} of ${count}`, 5, 5, hint);
    const y = cfg.text(l, 4);
    if (y !== '0' && y !== '1') throw cfg.error(l.line, `the normal state y (field 5) must be 0 or 1; it is "${y.slice(0, 20)}".`);
    out.push({ index: cfg.integer(l, 0, 'the channel index Dn', 0, 999_999), id: cfg.text(l, 1), phase: cfg.text(l, 2), circuit: cfg.text(l, 3), normalState: y === '1' ? 1 : 0, line: l.line });
  }
  return out;
}
