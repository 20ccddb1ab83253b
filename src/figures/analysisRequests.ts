import { analyzeValidSpan, powerQuantities, type PowerQuantities, type ValidSpanResult } from '../../shared/analysis';

/** Work the analysis worker does, by kind; samples in their channel's unit, invalid ones NaN. */
export interface AnalysisRequests {
  /** Figures of each channel of a span, by the engine's valid-span rule. */
  span: { channels: Float64Array[]; sampleRate: number; t0S: number };
  /** IEEE 1459 power of a voltage (V) and a current (A) channel. */
  power: { volts: Float64Array; amps: Float64Array; sampleRate: number; t0S: number };
}

export interface AnalysisAnswers {
  span: ValidSpanResult[];
  /** Null when the voltage has no steady fundamental. */
  power: PowerQuantities | null;
}

export type AnalysisKind = keyof AnalysisRequests;
// Distributed over the kinds, so that a switch on `kind` narrows to one request.
export type AnalysisRequest<K extends AnalysisKind = AnalysisKind> = K extends AnalysisKind ? { kind: K } & AnalysisRequests[K] : never;

/** Runs one request: in the worker, or in the page where no worker can start. */
export function runAnalysisRequest<K extends AnalysisKind>(request: AnalysisRequest<K>): AnalysisAnswers[K] {
  const r = request as AnalysisRequest;
  switch (r.kind) {
    case 'span':
      return r.channels.map((x) => analyzeValidSpan(x, r.sampleRate, { t0: r.t0S })) as AnalysisAnswers[K];
    case 'power':
      return powerQuantities(r.volts, r.amps, r.sampleRate, r.t0S) as AnalysisAnswers[K];
  }
}
