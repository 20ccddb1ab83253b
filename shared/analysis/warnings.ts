import type { AnalysisWarning, MeterReadings } from '../schemas/analysis';
import type { ClippingFinding } from './clipping';
import type { TimeDomainFigures } from './timeDomainFigures';

export interface WarningInput {
  figures: TimeDomainFigures;
  meters: MeterReadings;
  cycles: number | null;
  periodic: boolean;
  requestedOrder: number;
  nyquistOrder: number | null;
  clipping: ClippingFinding[];
}

const pct = (v: number) => `${Math.abs(v).toFixed(1)} %`;

/** Plain-language findings an engineer needs before trusting a reading of this waveform. */
export function analysisWarnings(w: WarningInput): AnalysisWarning[] {
  const out: AnalysisWarning[] = [];
  const { figures: f, meters } = w;
  const hidden = meters.trueRmsAc.errorVsTotalPercent;
  if (hidden !== null && hidden < -5) {
    out.push({
      code: 'dcHiddenFromAcMeter',
      severity: 'danger',
      message: `A DC part of ${f.mean.toPrecision(4)} makes an AC-coupled meter read ${pct(hidden)} below the true RMS (${f.rms.toPrecision(4)}). The circuit can be more dangerous than an AC reading suggests.`,
    });
  }
  if (f.crestFactor !== null && f.crestFactor > 3) {
    out.push({
      code: 'highCrestFactor',
      severity: 'warning',
      message: `Crest factor ${f.crestFactor.toFixed(2)} is above 3: many handheld true RMS meters are only specified up to about 3 at full scale.`,
    });
  }
  const avgError = meters.averageResponding.errorPercent;
  if (avgError !== null && Math.abs(avgError) > 2) {
    out.push({
      code: 'averagingMeterError',
      severity: 'warning',
      message: `A sine-calibrated average-responding meter would read ${pct(avgError)} ${avgError > 0 ? 'high' : 'low'} on this waveform; use a true RMS meter.`,
    });
  }
  if (!w.periodic) {
    out.push({ code: 'aperiodic', severity: 'info', message: 'No steady fundamental was found; figures cover the whole record and no harmonics are given.' });
  } else if (w.cycles !== null && w.cycles < 2) {
    out.push({ code: 'shortWindow', severity: 'warning', message: `The record holds only ${w.cycles} whole cycle; capture at least 10 cycles (12 at 60 Hz) for reliable figures.` });
  }
  if (w.nyquistOrder !== null && w.nyquistOrder < w.requestedOrder) {
    out.push({
      code: 'sampleRateTooLow',
      severity: 'warning',
      message: `The sample rate resolves harmonics only up to order ${w.nyquistOrder} of the ${w.requestedOrder} asked; anything above half the sample rate folds onto lower orders.`,
    });
  }
  for (const c of w.clipping) {
    out.push({
      code: 'clipping',
      severity: 'danger',
      message: `${c.samples} samples sit flat at the record's ${c.rail === 'max' ? 'maximum' : 'minimum'} (${c.value.toPrecision(4)}), in ${c.runs} runs: the instrument probably clipped, so RMS, crest factor and THD are not trustworthy.`,
    });
  }
  return out;
}
