import type { ComplianceRequest, ComplianceResult } from '../schemas/compliance';
import { checkIec61000_3_2 } from './checkIec61000_3_2';
import { checkIeee519Current, checkIeee519Voltage } from './checkIeee519';
import type { ComplianceInput } from './complianceInput';

export type { ComplianceInput } from './complianceInput';

/**
 * An indicative harmonic limit check of one channel: IEEE 519 voltage or current distortion, or
 * IEC 61000-3-2 equipment input current (Class A, C or D). Pure: the analysis and power figures in,
 * a verdict with rows and notes out.
 */
export function checkCompliance(input: ComplianceInput, req: ComplianceRequest): ComplianceResult {
  if (req.standard === 'iec61000-3-2') return checkIec61000_3_2(input, req);
  return req.kind === 'current' ? checkIeee519Current(input, req) : checkIeee519Voltage(input, req);
}

/** Whether a check reads the Power figures (active power or power factor) when the request does not give them. */
export function needsPower(req: ComplianceRequest): boolean {
  return req.standard === 'iec61000-3-2' && ((req.class === 'D' && req.activePower === undefined) || (req.class === 'C' && (req.powerFactor === undefined || req.activePower === undefined)));
}
