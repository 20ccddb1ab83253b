import type supertest from 'supertest';
import { expect } from 'vitest';

type Agent = supertest.Agent;

export async function uploadText(agent: Agent, filename: string, text: string | Buffer, fields: Record<string, string | number> = {}) {
  let req = agent.post('/api/captures').attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text), filename);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v));
  return req;
}

/** Polls a capture until it leaves queued/processing; fails the test after `timeoutMs`. */
export async function waitSettled(agent: Agent, id: number, timeoutMs = 30_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/captures/${id}`);
    expect(res.status).toBe(200);
    if (res.body.status === 'ready' || res.body.status === 'failed') return res.body;
    if (Date.now() > until) throw new Error(`capture ${id} still ${res.body.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** A whole-cycle sine record as scope CSV: peak volts, f Hz, fs samples/s. */
export function sineCsv(peak: number, f: number, fs: number, seconds: number, phase = 0): string {
  const lines = ['Time (s),CH1 (V)'];
  const n = Math.round(fs * seconds);
  for (let i = 0; i < n; i++) lines.push(`${(i / fs).toPrecision(10)},${(peak * Math.sin(2 * Math.PI * f * (i / fs) + phase)).toPrecision(12)}`);
  return lines.join('\n') + '\n';
}
