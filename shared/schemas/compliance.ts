import { z } from 'zod';

const channel = z.number().int().min(0).max(255);
/** Volts at the point of coupling: up to 1000 kV. */
const nominalVoltage = z.number().positive().max(1_000_000);

export const Ieee519VoltageCheck = z.object({ standard: z.literal('ieee519'), kind: z.literal('voltage'), channel, nominalVoltage });
export const Ieee519CurrentCheck = z.object({
  standard: z.literal('ieee519'),
  kind: z.literal('current'),
  channel,
  nominalVoltage,
  /** I_SC/I_L: the short-circuit current at the PCC over the maximum demand load current. */
  iscIl: z.number().positive().max(1_000_000),
  /** I_L, the maximum demand load current (fundamental) at the PCC, in A. */
  loadCurrent: z.number().positive().max(1_000_000),
});
export const Iec61000_3_2Check = z.object({
  standard: z.literal('iec61000-3-2'),
  class: z.enum(['A', 'C', 'D']),
  channel,
  /** Active input power in W; otherwise taken from the Power figures of a paired voltage channel. */
  activePower: z.number().positive().max(100_000).optional(),
  /** Circuit power factor λ for Class C; otherwise taken from the Power figures. */
  powerFactor: z.number().positive().max(1).optional(),
});

/**
 * A harmonic limit check. An IEEE 519 check without `kind` is a voltage check, so
 * `{ standard: 'ieee519', channel, nominalVoltage }` reads as the issue writes it.
 */
export const ComplianceRequest = z.preprocess(
  (v) => (v && typeof v === 'object' && (v as { standard?: unknown }).standard === 'ieee519' && (v as { kind?: unknown }).kind === undefined ? { ...v, kind: 'voltage' } : v),
  z.discriminatedUnion('standard', [z.discriminatedUnion('kind', [Ieee519CurrentCheck.strict(), Ieee519VoltageCheck.strict()]), Iec61000_3_2Check.strict()]),
);
export type ComplianceRequest = z.infer<typeof ComplianceRequest>;

export const ComplianceRow = z.object({
  /** A single harmonic, or the total (THD for voltage, TDD for IEEE 519 current) in a row of its own. */
  quantity: z.enum(['harmonic', 'thd', 'tdd']),
  /** Harmonic order; null for a total. */
  order: z.number().int().nullable(),
  /** RMS in V or A (for a total, the RMS of the harmonic content); null where not measured. */
  measured: z.number().nullable(),
  /** The measured value in % of the check's basis (nominal voltage, load current or fundamental). */
  measuredPercent: z.number().nullable(),
  /** The limit in A, where the standard states amperes (IEC 61000-3-2 Classes A and D). */
  limit: z.number().nullable(),
  /** The limit in %, where the standard states per cent (IEEE 519, IEC 61000-3-2 Class C). */
  limitPercent: z.number().nullable(),
  /** Null where the order was not judged (not measured, or below the standard's threshold). */
  pass: z.boolean().nullable(),
});
export type ComplianceRow = z.infer<typeof ComplianceRow>;

export const ComplianceResult = z.object({
  verdict: z.enum(['pass', 'fail', 'not-applicable']),
  /** The standard, edition and table applied, in words. */
  standard: z.string(),
  /** Why the capture cannot be judged, when the verdict is not-applicable. */
  reason: z.string().nullable(),
  /** What the percentages are of, in V or A. */
  basis: z.object({ of: z.enum(['nominalVoltage', 'loadCurrent', 'fundamental']), value: z.number(), unit: z.enum(['V', 'A']) }).nullable(),
  rows: z.array(ComplianceRow),
  /** Assumptions and caveats, the first always the indicative-only label. */
  notes: z.array(z.string()),
});
export type ComplianceResult = z.infer<typeof ComplianceResult>;

/** A check kept with its capture, so that reports list it; its result is computed again from the current analysis. */
export const StoredLimitCheck = z.object({
  id: z.number().int(),
  captureId: z.number().int(),
  request: ComplianceRequest,
  result: ComplianceResult,
  createdBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  createdAt: z.string(),
});
export type StoredLimitCheck = z.infer<typeof StoredLimitCheck>;
