import { runAnalysisRequest, type AnalysisRequest } from './analysisRequests';

/** The worker's side of analyzeOffMainThread: one answer (or error message) per numbered request. */
const scope = self as unknown as { onmessage: ((e: MessageEvent<{ id: number; request: AnalysisRequest }>) => void) | null; postMessage: (m: unknown) => void };

scope.onmessage = (e) => {
  const { id, request } = e.data;
  try {
    scope.postMessage({ id, ok: true, answer: runAnalysisRequest(request) });
  } catch (err) {
    scope.postMessage({ id, ok: false, message: err instanceof Error ? err.message : String(err) });
  }
};
