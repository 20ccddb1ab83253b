import type { ChannelAnalysis } from '../schemas/analysis';
import { SINE_FORM_FACTOR } from './meters';

const SINE_CREST_FACTOR = Math.SQRT2;

/** One sentence on why the meters disagree (or agree) on this waveform: DC part, form factor, crest factor. */
export function meterExplanation(a: ChannelAnalysis): string {
  const avg = a.meters.averageResponding.errorPercent ?? 0;
  const peak = a.meters.peakResponding.errorPercent ?? 0;
  const hidden = a.meters.trueRmsAc.errorVsTotalPercent ?? 0;
  const acForm = a.acRectifiedAverage > 0 ? a.acRms / a.acRectifiedAverage : null;
  const acCrest = a.acRms > 0 ? Math.max(a.max - a.mean, a.mean - a.min) / a.acRms : null;
  if (hidden < -5) {
    return `A DC part of ${a.mean.toPrecision(3)} is invisible to AC-coupled meters, which therefore read ${Math.abs(hidden).toFixed(1)} % below the true AC+DC RMS.`;
  }
  if (Math.abs(avg) <= 2 && Math.abs(peak) <= 2) {
    return `The waveform is close to a sine (form factor ${acForm?.toFixed(3)}, crest factor ${acCrest?.toFixed(3)}), so all four meters agree within 2 %.`;
  }
  const dir = (e: number) => `${Math.abs(e).toFixed(1)} % ${e > 0 ? 'high' : 'low'}`;
  if (Math.abs(avg) > 2 && Math.abs(peak) > 2) {
    return `The AC part's form factor is ${acForm?.toFixed(3)} (a sine's is ${SINE_FORM_FACTOR.toFixed(3)}) and its crest factor ${acCrest?.toFixed(3)} (a sine's is ${SINE_CREST_FACTOR.toFixed(3)}), so meters scaled for a sine read wrong: an averaging one ${dir(avg)}, a peak-responding one ${dir(peak)}.`;
  }
  if (Math.abs(avg) >= Math.abs(peak)) {
    return `The form factor of the AC part is ${acForm?.toFixed(3)} where a sine's is ${SINE_FORM_FACTOR.toFixed(3)}, so an averaging meter scaled for a sine reads ${Math.abs(avg).toFixed(1)} % ${avg > 0 ? 'high' : 'low'}.`;
  }
  return `The crest factor of the AC part is ${acCrest?.toFixed(3)} where a sine's is ${SINE_CREST_FACTOR.toFixed(3)}, so a peak-responding meter scaled for a sine reads ${Math.abs(peak).toFixed(1)} % ${peak > 0 ? 'high' : 'low'}.`;
}
