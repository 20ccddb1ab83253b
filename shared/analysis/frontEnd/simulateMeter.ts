import type { FrontEndProfile, MeterSimulationResponse } from '../../schemas/meterSimulation';
import { estimateFrequency } from '../frequency';
import type { Samples } from '../samples';
import { timeDomainFigures } from '../timeDomainFigures';
import { wholeCycleWindow } from '../wholeCycleWindow';
import { buildFrontEnd } from './buildFrontEnd';
import { displayed, displayResolution } from './displayResolution';
import { meterTimeAdvice } from './meterTimeAdvice';
import { planRun } from './planRun';
import { clipLevelOf, resolveFrontEnd } from './resolveFrontEnd';
import { runFrontEnd } from './runFrontEnd';
import { steadyStateOf } from './steadyState';

export interface SimulationOptions {
  /** Loop the span until the reading has settled (bounded by MAX_RUN_S and RUN_BUDGET_SAMPLES). */
  repeat?: boolean;
  start?: 'connected' | 'settled';
  /** The span's fundamental in Hz (null: aperiodic); estimated from the samples when not given. */
  fundamentalHz?: number | null;
  /** Capture time of the first sample, in seconds. */
  t0S?: number;
  /** The channel's unit, for the advice. */
  unit?: string;
}

/** Cycles at the end of a span played once whose steady state the reading heads for. */
const TAIL_CYCLES = 3;

/**
 * Simulates a meter's analog front end on a span of samples in the channel's unit at `sampleRateHz`
 * (samples per second): from the moment of connection (or from a settled state), the converter output
 * over time, what the display shows at each update, when the reading settles to within 1 %, its
 * ripple, and the steady reading once every filter has settled on the span repeated forever.
 *
 * The steady states are solved directly (each stage's periodic state over a loop of whole cycles, at
 * the capture's own rate), so they do not depend on how long the run is. Played once, the reading is
 * judged against the steady state of the span's last cycles, where a changing waveform (a dimmer
 * switching) leaves it; looped, against the whole loop's. A looped run longer than RUN_BUDGET_SAMPLES
 * is simulated on the loop resampled to a lower rate, and says how far that moved its final reading.
 */
export function simulateMeter(x: Samples, sampleRateHz: number, profile: FrontEndProfile, options: SimulationOptions = {}): MeterSimulationResponse {
  if (!(sampleRateHz > 0)) throw new RangeError(`simulateMeter: the sample rate must be positive, got ${sampleRateHz}`);
  if (x.length < 2) throw new RangeError(`simulateMeter: need at least 2 samples, got ${x.length}`);
  // Float32 samples, as stored, are widened block by block as they enter the front end, not copied whole.
  const span = x;
  for (let i = 0; i < span.length; i++) {
    if (!Number.isFinite(span[i])) throw new RangeError(`simulateMeter: sample ${i} is not a finite number; simulate a span without gaps`);
  }
  const p = resolveFrontEnd(profile);
  const fs = sampleRateHz;
  const start = options.start ?? 'connected';
  const repeat = options.repeat ?? false;
  const f0 = options.fundamentalHz !== undefined ? options.fundamentalHz : estimateFrequency(span, fs, timeDomainFigures(span)).hz;
  const win = wholeCycleWindow(span.length, fs, f0);
  const loop = span.subarray(win.startIndex, win.startIndex + win.sampleCount);
  const notes: string[] = [];

  const period = f0 !== null ? fs / f0 : null;
  const steady = steadyStateOf(p, fs, loop, period);
  const tailCycles = Math.min(TAIL_CYCLES, win.cycles ?? 0);
  const target = !repeat && f0 !== null && tailCycles >= 1 ? steadyStateOf(p, fs, span.subarray(span.length - Math.min(span.length, Math.round((tailCycles * fs) / f0))), period) : steady;

  const plan = planRun(p, span, loop, fs, repeat);
  const fe = buildFrontEnd(p, plan.sampleRateHz);
  const runTarget = plan.decimation > 1 ? steadyStateOf(p, plan.sampleRateHz, plan.source).mean : target.mean;
  if (start === 'settled') {
    const cycle = f0 !== null ? Math.round(plan.sampleRateHz / f0) : 1;
    fe.settleOn(plan.source.subarray(0, cycle >= 1 && cycle <= plan.source.length ? cycle : 1));
  } else {
    fe.reset();
  }
  const run = runFrontEnd(fe, plan, runTarget, f0 !== null ? plan.sampleRateHz / f0 : null, { rateHz: p.displayRateHz, alreadyShowing: start === 'settled' }, repeat);
  const simulatedS = run.simulatedSamples / plan.sampleRateHz;

  if (repeat && win.cycles !== null && win.sampleCount < span.length) notes.push(`The loop repeats the span's ${win.cycles} whole cycles; its last partial cycle is left out so the loop has no seam.`);
  if (repeat && win.cycles === null) notes.push('The span has no steady fundamental, so the loop repeats it whole, seam included.');
  if (plan.decimation > 1) notes.push(`Simulated at ${Number((plan.sampleRateHz / 1000).toPrecision(3))} kS/s (1/${Number(plan.decimation.toPrecision(3))} of the capture's rate) to keep a ${Math.round(simulatedS)} s run affordable.`);
  if (p.crestFactorLimit !== null && p.rangeFullScale === null) notes.push("Give the range's full scale to model clipping at the crest-factor limit.");
  if (run.displaySamples.length === 0) notes.push(`The display first updates ${Number((1 / p.displayRateHz).toPrecision(3))} s after connecting, after this span ends: loop it to see the display.`);

  const resolution = displayResolution(p, target.mean);
  return {
    trace: run.trace,
    display: run.displaySamples.map((s) => ({ tS: s.tS, value: displayed(s.value, resolution, p.rangeFullScale) })),
    settled: { value: displayed(target.mean, resolution, null) ?? target.mean, settlingTimeS: run.settlingTimeS, ripplePeakToPeak: target.peakToPeak, wanderPeakToPeak: target.wanderPeakToPeak },
    steadyStateReading: steady.mean,
    advice: meterTimeAdvice({
      steadyStateReading: target.mean, ripplePeakToPeak: target.peakToPeak, wanderPeakToPeak: target.wanderPeakToPeak, settlingTimeS: run.settlingTimeS, displayRateHz: p.displayRateHz, fundamentalHz: f0,
      rippleOrder: fe.rippleOrder, clippedFraction: target.clippedFraction, clipLevel: clipLevelOf(p), fullScale: p.rangeFullScale, start, repeated: repeat, simulatedS, unit: options.unit ?? '',
    }),
    run: {
      fromS: options.t0S ?? 0,
      toS: (options.t0S ?? 0) + span.length / fs,
      start,
      simulatedS,
      loops: run.simulatedSamples / plan.source.length,
      fundamentalHz: f0,
      sampleRateHz: plan.sampleRateHz,
      decimation: plan.decimation,
      decimationErrorPercent: plan.decimation > 1 && steady.mean !== 0 ? 100 * (runTarget / steady.mean - 1) : null,
    },
    resolution,
    clippedFraction: target.clippedFraction,
    notes,
  };
}
