/**
 * The load step of `npm run bench`: 20 distinct captures uploaded at once while 50 readers browse
 * (list, detail, analysis, sample windows) against one server on 127.0.0.1. It ends by itself when
 * every upload has settled, or after LIMIT_MS, or after READS_PER_READER requests per reader,
 * whichever comes first. Prints errors (expected 0), p50/p99 per kind, the time until all 20 were
 * ready, and checks in the database that each became ready exactly once.
 */
import { openAsBlob } from 'node:fs';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { CLIENT_HEADER, CLIENT_HEADER_VALUE } from '../shared/clientHeader';

const UPLOADS = 20;
const READERS = 50;
const LIMIT_MS = 180_000;
const READS_PER_READER = 2000;
const POLL_MS = 100;

type Kind = 'upload' | 'list' | 'detail' | 'analysis' | 'samples';
const READ_KINDS: Kind[] = ['list', 'detail', 'analysis', 'samples'];

interface LoadInput {
  base: string;
  cookie: string;
  databaseUrl: string;
  work: string;
  /** Ready captures to read from the start, with their durations in seconds. */
  ready: Map<number, number>;
  writeCsv(file: string, rows: number): Promise<number>;
  line(label: string, value: string, reference?: string): void;
}

const percentile = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(p * (sorted.length - 1)))] : NaN);

export async function runLoad({ base, cookie, databaseUrl, work, ready, writeCsv, line }: LoadInput): Promise<boolean> {
  // 50 k to 200 k rows in even steps: no two files alike, so none is taken for a duplicate.
  const files: { file: string; rows: number }[] = [];
  let bytes = 0;
  for (let i = 0; i < UPLOADS; i++) {
    const rows = 50_000 + Math.round((i * 150_000) / (UPLOADS - 1));
    const file = path.join(work, `load-${i}.csv`);
    bytes += await writeCsv(file, rows);
    files.push({ file, rows });
  }

  const latencies = new Map<Kind, number[]>(['upload', ...READ_KINDS].map((k) => [k as Kind, []]));
  const errors: string[] = [];
  const start = performance.now();
  const deadline = start + LIMIT_MS;
  let settled = false;
  const readable = [...ready.entries()];

  async function timed(kind: Kind, url: string, init?: RequestInit): Promise<unknown> {
    const t = performance.now();
    try {
      const res = await fetch(url, { ...init, headers: { cookie, [CLIENT_HEADER]: CLIENT_HEADER_VALUE } });
      const body = (await res.json()) as unknown;
      (latencies.get(kind) as number[]).push(performance.now() - t);
      if (!res.ok) errors.push(`${kind} ${url}: ${res.status} ${JSON.stringify(body).slice(0, 200)}`);
      return res.ok ? body : null;
    } catch (err) {
      errors.push(`${kind} ${url}: ${(err as Error).message}`);
      return null;
    }
  }

  async function upload(i: number): Promise<{ id: number; readyMs: number } | null> {
    const form = new FormData();
    form.append('file', await openAsBlob(files[i].file), `load-${i}.csv`);
    const created = (await timed('upload', `${base}/api/captures`, { method: 'POST', body: form })) as { id: number; duplicate: boolean } | null;
    if (!created) return null;
    if (created.duplicate) errors.push(`upload ${i}: taken for a duplicate of capture ${created.id}`);
    while (performance.now() < deadline) {
      const c = (await timed('detail', `${base}/api/captures/${created.id}`)) as { status: string; durationS: number | null } | null;
      if (c?.status === 'ready') {
        readable.push([created.id, c.durationS ?? 0]);
        return { id: created.id, readyMs: performance.now() - start };
      }
      if (c?.status === 'failed') {
        errors.push(`capture ${created.id} failed`);
        return null;
      }
      await new Promise((r) => setTimeout(r, POLL_MS));
    }
    errors.push(`capture ${created.id} not ready within ${LIMIT_MS / 1000} s`);
    return null;
  }

  async function reader(n: number): Promise<void> {
    for (let i = 0; i < READS_PER_READER && !settled && performance.now() < deadline; i++) {
      const kind = READ_KINDS[(n + i) % READ_KINDS.length];
      const [id, duration] = readable[(n * 7919 + i * 104729) % readable.length];
      if (kind === 'list') await timed(kind, `${base}/api/captures?pageSize=50`);
      else if (kind === 'detail') await timed(kind, `${base}/api/captures/${id}`);
      else if (kind === 'analysis') await timed(kind, `${base}/api/captures/${id}/analysis`);
      else {
        const span = duration / 2 ** (i % 8);
        const from = ((i * 0.618) % 1) * (duration - span);
        await timed(kind, `${base}/api/captures/${id}/samples?channel=${i % 2}&fromS=${from}&toS=${from + span}&points=2000`);
      }
    }
  }

  const uploads = Promise.all(files.map((_, i) => upload(i))).finally(() => (settled = true));
  await Promise.all([uploads, ...Array.from({ length: READERS }, (_, n) => reader(n))]);
  const done = (await uploads).filter((u) => u !== null);
  const wallS = (performance.now() - start) / 1000;

  line(`load: ${UPLOADS} uploads (${(bytes / 1e6).toFixed(0)} MB, 50 k–200 k rows) + ${READERS} readers`, `${wallS.toFixed(1)} s`, `all ${UPLOADS} ready after ${done.length === UPLOADS ? `${(Math.max(...done.map((u) => u.readyMs)) / 1000).toFixed(1)} s` : `— only ${done.length} were`}`);
  for (const [kind, times] of latencies) {
    times.sort((x, y) => x - y);
    const failed = errors.filter((e) => e.startsWith(`${kind} `)).length;
    line(`  ${kind}: ${times.length} requests, ${failed} errors`, `p50 ${percentile(times, 0.5).toFixed(1)} ms`, `p99 ${percentile(times, 0.99).toFixed(1)} ms`);
  }

  // Nothing lost and nothing done twice: each capture ready, with one job that took one attempt and
  // one set of channels.
  const ids = done.map((u) => u.id);
  const connection = await mysql.createConnection(databaseUrl);
  try {
    const [rows] = (await connection.query(
      `SELECT c.id, c.status,
              (SELECT COUNT(*) FROM jobs j WHERE j.capture_id = c.id) AS jobs,
              (SELECT COALESCE(SUM(j.attempts), 0) FROM jobs j WHERE j.capture_id = c.id AND j.status = 'done') AS attempts,
              (SELECT COUNT(*) FROM channels ch WHERE ch.capture_id = c.id) AS channels
       FROM captures c WHERE c.id IN (?)`,
      [ids.length ? ids : [0]],
    )) as unknown as [{ id: number; status: string; jobs: number; attempts: number; channels: number }[]];
    const once = rows.filter((r) => r.status === 'ready' && Number(r.jobs) === 1 && Number(r.attempts) === 1 && Number(r.channels) === 2);
    for (const r of rows) if (!once.includes(r)) errors.push(`capture ${r.id}: ${r.status}, ${r.jobs} job(s), ${r.attempts} attempt(s), ${r.channels} channel(s)`);
    line('  ready exactly once (1 job, 1 attempt, 2 channels)', `${once.length} of ${UPLOADS}`, errors.length ? `${errors.length} errors` : 'errors: 0');
  } finally {
    await connection.end();
  }
  for (const e of errors.slice(0, 10)) console.log(`    ${e}`);
  return errors.length === 0 && done.length === UPLOADS;
}
