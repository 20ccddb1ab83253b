import type { ChannelVoltageEvents } from '../schemas/powerQuality';
import { cycleTrend } from './cycleTrend';
import { declaredForChannel, suggestDeclaredVoltage } from './declaredVoltage';
import type { AnomalySuggestion } from './findAnomalies';
import type { Samples } from './samples';
import { EVENT_THRESHOLDS_SOURCE, voltageEvents, type VoltageEvent } from './voltageEvents';

const TO_VOLTS: Record<string, number> = { V: 1, mV: 1e-3, kV: 1e3 };
const LABEL: Record<VoltageEvent['kind'], string> = { dip: 'Voltage dip', swell: 'Voltage swell', interruption: 'Interruption' };

const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];

/** A mark suggestion for an event, with the figures that raised it. */
function suggestion(e: VoltageEvent, declared: number): AnomalySuggestion {
  const what = e.kind === 'swell' ? 'rises to' : 'falls to';
  return {
    kind: e.kind,
    startS: e.startS,
    endS: e.endS,
    severity: e.kind === 'interruption' ? 'fault' : 'warning',
    label: LABEL[e.kind],
    reason: `Urms(1/2) ${what} ${e.extremeV.toFixed(1)} V (${e.extremePercent.toFixed(1)} % of the declared ${declared.toFixed(1)} V) for ${(e.durationS * 1000).toFixed(0)} ms${e.unfinished ? ', until the end of the record' : ''}. Thresholds: ${EVENT_THRESHOLDS_SOURCE}.`,
  };
}

/**
 * Dips, swells and interruptions of one voltage channel, against the declared voltage (the capture's
 * or project's, as a line-to-neutral or line-to-line value, whichever the channel is nearer), or else
 * against the nominal voltage nearest its median Urms(1/2). Null for a channel that is not a voltage,
 * has no fundamental, or is near no nominal voltage when none is declared.
 *
 * @param x samples in `unit` (V, mV or kV)
 * @param sampleRate samples per second
 * @param t0 time of x[0], in s
 * @param frequency the channel's fundamental in Hz, or null
 * @param declared the declared voltage in V and where it was set, or null
 */
export function channelVoltageEvents(
  x: Samples,
  sampleRate: number,
  t0: number,
  unit: string,
  frequency: number | null,
  declared: { value: number; from: 'capture' | 'project' } | null,
): { found: Omit<ChannelVoltageEvents, 'channel'>; suggestions: AnomalySuggestion[] } | null {
  const k = TO_VOLTS[unit];
  if (!k || frequency === null) return null;
  const trend = cycleTrend(x, sampleRate, frequency, 'rmsHalfCycle', t0).map((p) => ({ tS: p.tS, value: p.value * k }));
  if (trend.length < 2) return null;
  const typical = median(trend.map((p) => p.value));
  const value = declared ? declaredForChannel(declared.value, typical) : suggestDeclaredVoltage(typical);
  if (value === null) return null;
  const events = voltageEvents(trend, value);
  return {
    found: { declaredVoltage: value, declaredFrom: declared?.from ?? 'suggested', thresholdsSource: EVENT_THRESHOLDS_SOURCE, events },
    suggestions: events.map((e) => suggestion(e, value)),
  };
}
