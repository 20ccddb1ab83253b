import { longestValidStretch, simulateMeter, validStretchProblem } from '../../shared/analysis';
import { MAX_SIMULATION_SPAN_SAMPLES, type MeterSimulationRequest, type MeterSimulationResponse } from '../../shared/schemas/meterSimulation';
import type { AppContext } from '../context';
import { findChannelTimeBase } from '../db/captureRepository';
import { AppError, notFound } from '../errors';
import { readSamples } from './sampleWindowService';

/**
 * A meter's front end run over a span of one channel: only the span's samples are read, at most
 * MAX_SIMULATION_SPAN_SAMPLES of them. Gaps (empty or overrange cells) would splice the waveform, so
 * the span's longest unbroken stretch is simulated, by the engine's own rule for valid stretches.
 */
export async function simulateCaptureMeter(ctx: AppContext, captureId: number, req: MeterSimulationRequest): Promise<MeterSimulationResponse> {
  const c = await findChannelTimeBase(ctx.db, captureId, req.channel);
  if (!c) throw notFound('Capture');
  if (c.status !== 'ready') {
    throw new AppError(409, 'not_ready', c.status === 'failed' ? `The capture failed: ${c.errorMessage}` : `The capture is ${c.status}; its samples are not ready yet`);
  }
  if (c.channel === null) throw notFound(`Channel ${req.channel}`);
  const n = c.sampleCount ?? 0;
  const fs = c.sampleRate ?? 1;
  const dt = 1 / fs;
  const t0 = c.t0 ?? 0;
  // The same arithmetic as the samples endpoint, so a span picked on the chart is the span simulated.
  const i0 = Math.min(n, Math.max(0, req.fromS === undefined ? 0 : Math.floor((req.fromS - t0) / dt)));
  const i1 = Math.min(n, Math.max(i0, req.toS === undefined ? n : Math.ceil((req.toS - t0) / dt) + 1));
  const count = i1 - i0;
  if (count > MAX_SIMULATION_SPAN_SAMPLES) {
    throw new AppError(400, 'span_too_long', `The span holds ${count.toLocaleString('en')} samples; a meter simulation reads at most ${MAX_SIMULATION_SPAN_SAMPLES.toLocaleString('en')} (MAX_SIMULATION_SPAN_SAMPLES). Choose a shorter span with fromS and toS.`);
  }
  if (count < 2) throw new AppError(400, 'span_too_short', 'The span holds fewer than 2 samples; widen fromS and toS');

  const samples = await readSamples(ctx, captureId, req.channel, i0, count);
  const stretch = longestValidStretch(samples);
  const problem = stretch.invalid > 0 ? validStretchProblem(stretch, count) : null;
  if (problem) throw new AppError(422, 'invalid_samples', problem);
  const result = simulateMeter(samples.subarray(stretch.start, stretch.start + stretch.length), fs, req.profile, {
    repeat: req.repeat ?? false,
    start: req.start,
    fundamentalHz: c.frequency,
    t0S: t0 + (i0 + stretch.start) * dt,
    unit: c.unit ?? '',
  });
  if (stretch.invalid > 0) {
    result.notes.unshift(`${stretch.invalid} samples of the span are empty or overrange; the meter was run over its longest valid stretch (${stretch.length} of ${count} samples).`);
  }
  return result;
}
