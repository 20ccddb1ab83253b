import { powerQuantities, type PowerQuantities } from '../../shared/analysis';
import { channelScalingOf, toEngineeringUnits } from '../../shared/channelScaling';
import type { CaptureChannel, CaptureDetail } from '../../shared/schemas/capture';
import { siQuantityOf } from '../../shared/siUnits';
import type { AppContext } from '../context';
import { readSamples } from './sampleWindowService';

/** Samples read per channel for power figures: the first million, as the capture page's Power panel reads. */
export const POWER_MAX_SAMPLES = 1_000_000;
/** Current channels paired at most, each with the first voltage channel. */
const MAX_PAIRS = 4;

export interface PowerPair {
  voltage: CaptureChannel;
  current: CaptureChannel;
  /** IEEE 1459 quantities in V, A, W, var, VA; null when they are not defined, with the reason in `note`. */
  quantities: PowerQuantities | null;
  note: string | null;
}

/** Each current channel with the capture's first voltage channel, as the Power panel pairs them by default. */
export function powerPairsOf(channels: CaptureChannel[]): { voltage: CaptureChannel; current: CaptureChannel }[] {
  const voltage = channels.find((c) => siQuantityOf(c.unit)?.quantity === 'voltage');
  if (!voltage) return [];
  return channels.filter((c) => siQuantityOf(c.unit)?.quantity === 'current').slice(0, MAX_PAIRS).map((current) => ({ voltage, current }));
}

async function siSamples(ctx: AppContext, captureId: number, channel: CaptureChannel, count: number): Promise<Float64Array> {
  const values = toEngineeringUnits(await readSamples(ctx, captureId, channel.index, 0, count), channelScalingOf(channel));
  const factor = siQuantityOf(channelScalingOf(channel).unit)?.factor ?? 1;
  if (factor !== 1) for (let i = 0; i < values.length; i++) values[i] *= factor;
  return values;
}

/**
 * Power figures of a ready capture's voltage/current pairs, computed on the server from the stored
 * samples (the first POWER_MAX_SAMPLES), so reports and limit checks need no browser. Only the pair of
 * `currentIndex` when it is given.
 */
export async function powerFigures(ctx: AppContext, capture: CaptureDetail, currentIndex?: number): Promise<PowerPair[]> {
  const pairs = powerPairsOf(capture.channels).filter((p) => currentIndex === undefined || p.current.index === currentIndex);
  const count = Math.min(capture.sampleCount ?? 0, POWER_MAX_SAMPLES);
  const out: PowerPair[] = [];
  for (const { voltage, current } of pairs) {
    const v = await siSamples(ctx, capture.id, voltage, count);
    const i = await siSamples(ctx, capture.id, current, count);
    if (v.some(Number.isNaN) || i.some(Number.isNaN)) {
      out.push({ voltage, current, quantities: null, note: 'One of the channels has empty or overrange samples; power needs both complete.' });
      continue;
    }
    const quantities = powerQuantities(v, i, capture.sampleRate ?? 1, capture.t0 ?? 0);
    out.push({ voltage, current, quantities, note: quantities ? null : 'The voltage has no steady fundamental, so power quantities are not defined here.' });
  }
  return out;
}
