import type { ComtradeSummary } from '../schemas/comtrade';
import type { ComtradeRecord } from './ComtradeRecord';

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null);

/** The record's description as kept with the capture (JSON: NaN becomes null). */
export function comtradeSummary(r: ComtradeRecord): ComtradeSummary {
  const c = r.config;
  return {
    edition: c.revYear,
    combined: r.combined,
    station: c.station,
    device: c.device,
    fileType: c.fileType,
    timeMultiplier: c.timeMultiplier,
    lineFrequencyHz: c.lineFrequencyHz,
    sampleRates: c.rates.map((x) => ({ hz: x.hz, endSample: x.endSample })),
    timeSource: r.timeBase.source,
    startTime: c.start?.text ?? null,
    triggerTime: c.trigger?.text ?? null,
    triggerS: r.timeBase.triggerS,
    values: r.values,
    timeCode: c.timeCode,
    localCode: c.localCode,
    timeQuality: c.timeQuality,
    leapSecond: c.leapSecond,
    analog: c.analog.map((a, i) => ({
      index: a.index,
      id: a.id,
      phase: a.phase,
      circuit: a.circuit,
      unit: a.unit,
      a: a.a,
      b: a.b,
      skewUs: a.skewUs,
      min: finiteOrNull(a.min),
      max: finiteOrNull(a.max),
      primary: finiteOrNull(a.primary),
      secondary: finiteOrNull(a.secondary),
      ps: a.ps,
      side: r.channels[i].scaling.side,
      note: r.channels[i].scaling.note,
    })),
    digital: r.digital.map((d) => ({
      index: d.config.index,
      id: d.config.id,
      phase: d.config.phase,
      circuit: d.config.circuit,
      normalState: d.config.normalState,
      initialState: d.initialState,
      changeCount: d.changeCount,
      changes: d.changes.map((x) => ({ timeS: x.timeS, state: x.state })),
    })),
  };
}
