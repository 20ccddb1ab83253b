import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { CaptureDetail } from '../../shared/schemas/capture';
import type { AppContext } from '../context';
import { captureAnalysis, captureDetail } from './captureService';

export interface ReadyCapture {
  detail: CaptureDetail;
  analyses: ChannelAnalysis[];
}

/** A capture with its analysis: 404 for an unknown id, 409 while it is not ready (or failed). */
export async function readyCapture(ctx: AppContext, id: number): Promise<ReadyCapture> {
  const detail = await captureDetail(ctx, id);
  const { channels } = await captureAnalysis(ctx, id);
  return { detail, analyses: channels };
}
