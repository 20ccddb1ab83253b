import { checkCompliance, needsPower } from '../../shared/limits/checkCompliance';
import type { ComplianceRequest, ComplianceResult } from '../../shared/schemas/compliance';
import type { AppContext } from '../context';
import { AppError } from '../errors';
import { powerFigures } from './powerFiguresService';
import { readyCapture, type ReadyCapture } from './readyCapture';

/**
 * Judges one channel of a ready capture against a harmonic limit table. Class C and D read the Power
 * figures of the channel paired with the capture's first voltage channel, when the request gives no
 * power or power factor.
 */
export async function evaluateCompliance(ctx: AppContext, capture: ReadyCapture, req: ComplianceRequest): Promise<ComplianceResult> {
  const channel = capture.detail.channels[req.channel];
  if (!channel) throw new AppError(400, 'invalid_request', `The capture has no channel ${req.channel} (it has ${capture.detail.channels.length})`);
  const pair = needsPower(req) ? (await powerFigures(ctx, capture.detail, req.channel))[0] : undefined;
  const q = pair?.quantities;
  return checkCompliance({ analysis: capture.analyses[req.channel], unit: channel.unit, power: q ? { activePower: q.activePower, powerFactor: q.powerFactor } : null }, req);
}

/** Runs a check without keeping it: a read, open to every role. */
export async function runCompliance(ctx: AppContext, captureId: number, req: ComplianceRequest): Promise<ComplianceResult> {
  return evaluateCompliance(ctx, await readyCapture(ctx, captureId), req);
}
