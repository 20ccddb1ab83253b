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

/**
 * A long two-channel mains record (325 V peak, 10 A peak, 50 Hz at 100 kS/s), about 27 bytes a row:
 * big enough that reading it takes a noticeable time, for tests of budgets, stops and faults.
 */
export function longTwoChannelCsv(rows: number): Buffer {
  const lines = new Array<string>(rows + 1);
  lines[0] = 'Time (s),CH1 (V),CH2 (A)';
  const w = 2 * Math.PI * 50;
  for (let i = 0; i < rows; i++) {
    const t = i / 100_000;
    lines[i + 1] = `${t.toFixed(5)},${(325 * Math.sin(w * t)).toFixed(3)},${(10 * Math.sin(w * t - 0.5)).toFixed(4)}`;
  }
  return Buffer.from(lines.join('\n') + '\n');
}

/** Polls until the capture has the given status (or fails the test after `timeoutMs`). */
export async function waitStatus(agent: Agent, id: number, status: string, timeoutMs = 30_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/captures/${id}`);
    if (res.body.status === status) return res.body;
    if (Date.now() > until) throw new Error(`capture ${id} is ${res.body.status}, not ${status}, after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 20));
  }
}
