import { runAnalysisRequest, type AnalysisAnswers, type AnalysisKind, type AnalysisRequest } from './analysisRequests';

type Reply = { id: number; ok: true; answer: unknown } | { id: number; ok: false; message: string };

let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, { resolve: (a: unknown) => void; reject: (e: Error) => void }>();

function failAll(message: string) {
  pending.forEach((p) => p.reject(new Error(message)));
  pending.clear();
  worker?.terminate();
  worker = null;
}

function started(): Worker {
  if (worker) return worker;
  worker = new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' });
  worker.onmessage = (e: MessageEvent<Reply>) => {
    const p = pending.get(e.data.id);
    pending.delete(e.data.id);
    if (!p) return;
    if (e.data.ok) p.resolve(e.data.answer);
    else p.reject(new Error(e.data.message));
  };
  // A worker that fails to load or crashes takes its requests with it; the next request starts a new one.
  worker.onerror = (e) => failAll(`The analysis worker stopped: ${e.message || 'it could not start'}`);
  return worker;
}

/**
 * Runs an analysis in a Web Worker, so that a million-sample span keeps the page responsive. The sample
 * buffers are transferred, not copied: the caller must not use them afterwards. Where no worker can start
 * (a test DOM), it runs in the page.
 */
export function analyzeOffMainThread<K extends AnalysisKind>(request: AnalysisRequest<K>): Promise<AnalysisAnswers[K]> {
  if (typeof Worker === 'undefined') return Promise.resolve().then(() => runAnalysisRequest(request));
  const id = nextId++;
  const r = request as AnalysisRequest;
  const buffers = r.kind === 'span' ? r.channels.map((c) => c.buffer) : [r.volts.buffer, r.amps.buffer];
  return new Promise((resolve, reject) => {
    pending.set(id, { resolve: resolve as (a: unknown) => void, reject });
    started().postMessage({ id, request }, buffers);
  });
}
