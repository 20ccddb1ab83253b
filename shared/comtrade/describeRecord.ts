import { secondsBetween } from './cfgValues';
import type { ComtradeRecord } from './ComtradeRecord';

export interface MetadataEntry {
  key: string;
  value: string;
  /** Line of the .cfg (or .cff) the entry comes from. */
  line: number;
}

/** Sample rate lines listed one by one; a longer table is summed up after these. */
const LISTED_RATES = 20;

const g = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(10))) : '—');
const orDash = (s: string) => s || '—';

/**
 * The record's configuration as the capture's file details: station, device, edition, each channel
 * with its scaling, skew, range and ratio, the line frequency, sample rates, time stamps, data file type
 * and time multiplier, each with the line it was read from.
 */
export function describeRecord(r: ComtradeRecord): MetadataEntry[] {
  const c = r.config;
  const out: MetadataEntry[] = [
    { key: 'Format', value: `COMTRADE, IEEE C37.111-${c.revYear}${r.combined ? ' combined file (.cff)' : ' (.cfg and .dat)'}`, line: c.lines.station },
    { key: 'Station', value: orDash(c.station), line: c.lines.station },
    { key: 'Recording device', value: orDash(c.device), line: c.lines.station },
    { key: 'Channels', value: `${c.analog.length} analog, ${c.digital.length} digital`, line: c.lines.counts },
  ];
  c.analog.forEach((a, i) => {
    const s = r.channels[i].scaling;
    const ratio = Number.isFinite(a.primary) && Number.isFinite(a.secondary) ? `ratio ${g(a.primary)}:${g(a.secondary)}` : 'no ratio';
    const shown = s.note ? `shown ${s.side} (${s.note})` : `shown ${s.side}`;
    const value = `phase ${orDash(a.phase)}, circuit ${orDash(a.circuit)}, unit ${orDash(a.unit)}; value = ${g(a.a)}·x + ${g(a.b)} (${a.ps === 'P' ? 'primary' : 'secondary'}); skew ${g(a.skewUs)} µs; range ${g(a.min)} to ${g(a.max)}; ${ratio}; ${shown}`;
    out.push({ key: `Analog A${a.index} ${a.id}`.trim(), value, line: a.line });
  });
  for (const d of r.digital) {
    const changes = d.changeCount === 0 ? 'no change of state' : `${d.changeCount} change${d.changeCount === 1 ? '' : 's'} of state`;
    out.push({ key: `Digital D${d.config.index} ${d.config.id}`.trim(), value: `phase ${orDash(d.config.phase)}, circuit ${orDash(d.config.circuit)}, normal state ${d.config.normalState}; starts at ${d.initialState}, ${changes}`, line: d.config.line });
  }
  out.push({ key: 'Line frequency', value: c.lineFrequencyHz === null ? 'not given' : `${g(c.lineFrequencyHz)} Hz`, line: c.lines.frequency });
  if (c.rates.length === 0) out.push({ key: 'Sample rates', value: `none (nrates 0): the time stamps give the time base; ${c.sampleCount} samples`, line: c.lines.rates });
  c.rates.slice(0, LISTED_RATES).forEach((x, i) => out.push({ key: c.rates.length === 1 ? 'Sample rate' : `Sample rate ${i + 1}`, value: `${g(x.hz)} S/s up to sample ${x.endSample}`, line: x.line }));
  if (c.rates.length > LISTED_RATES) out.push({ key: 'Sample rates', value: `${c.rates.length - LISTED_RATES} more rate lines`, line: c.rates[LISTED_RATES].line });
  const tb = r.timeBase;
  const how = tb.source === 'rate' ? 'the sample rate of the .cfg' : tb.source === 'timestamps' ? 'the time stamps of the .dat' : 'the sample rates of the .cfg';
  out.push({ key: 'Time base', value: `${g(tb.sampleRate)} S/s from ${how}`, line: c.lines.rates });
  out.push({ key: 'First sample', value: c.start?.text ?? 'not given', line: c.lines.start });
  const after = c.start && c.trigger ? `; ${g(secondsBetween(c.start, c.trigger))} s after the first sample${tb.triggerS === null ? ', outside the record' : ''}` : '';
  out.push({ key: 'Trigger', value: `${c.trigger?.text ?? 'not given'}${after}`, line: c.lines.trigger });
  out.push({ key: 'Data file type', value: c.fileType, line: c.lines.fileType });
  out.push({ key: 'Time multiplier', value: `${g(c.timeMultiplier)} (time stamps count in units of ${g(c.timeMultiplier)} µs)`, line: c.lines.timeMultiplier ?? c.lines.fileType });
  if (c.lines.timeCode !== null) {
    out.push({ key: 'Time code', value: `${orDash(c.timeCode ?? '')}, local ${orDash(c.localCode ?? '')}`, line: c.lines.timeCode });
    if (c.lines.timeQuality !== null) out.push({ key: 'Time quality', value: `${orDash(c.timeQuality ?? '')}, leap second ${orDash(c.leapSecond ?? '')}`, line: c.lines.timeQuality });
  }
  return out;
}
