import type { Response } from 'superagent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { decodeSamplesBinary } from '../../shared/samples/samplesBinary';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let agent: Awaited<ReturnType<typeof signedIn>>;
let id: number;

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  agent = await signedIn(app, ADMIN.email, ADMIN.password);
  id = (await uploadText(agent, 'binary.csv', sineCsv(325, 50, 20_000, 0.5))).body.id;
  expect((await waitSettled(agent, id)).status).toBe('ready');
});
afterAll(() => app.stop());

/** Collects a binary body as an ArrayBuffer (superagent hands node's response stream to a parser). */
const collect = (res: NodeJS.ReadableStream, done: (err: Error | null, body: ArrayBuffer) => void) => {
  const parts: Buffer[] = [];
  res.on('data', (c: Buffer) => parts.push(c));
  res.on('end', () => {
    const all = Buffer.concat(parts);
    done(null, all.buffer.slice(all.byteOffset, all.byteOffset + all.byteLength));
  });
};
const binary = collect as unknown as (res: Response, done: (err: Error | null, body: unknown) => void) => void;

async function both(url: string) {
  const json = await agent.get(url);
  const bin = await agent.get(url).set('Accept', 'application/octet-stream').buffer(true).parse(binary);
  return { json, bin };
}

describe('GET /api/captures/:id/samples as binary', () => {
  it('answers Accept: application/octet-stream with Float32 samples that decode to the JSON answer', async () => {
    const { json, bin } = await both(`/api/captures/${id}/samples?channel=0&fromS=0.1&toS=0.11&points=2000`);
    expect(json.body.mode).toBe('raw');
    expect(bin.headers['content-type']).toMatch(/application\/octet-stream/);
    expect(decodeSamplesBinary(bin.body)).toEqual(json.body);
    // 4 bytes a sample after a 48-byte header
    expect(bin.body.byteLength).toBe(48 + 4 * json.body.values.length);
  });

  it('sends min/max pairs when the span holds more samples than points, and stays JSON for other clients', async () => {
    const { json, bin } = await both(`/api/captures/${id}/samples?channel=0&points=500`);
    expect(json.headers['content-type']).toMatch(/application\/json/);
    expect(json.body.mode).toBe('minmax');
    expect(decodeSamplesBinary(bin.body)).toEqual(json.body);
    expect(bin.body.byteLength).toBeLessThan(Buffer.byteLength(JSON.stringify(json.body)) / 4);
  });

  it('is offered through a share link too', async () => {
    const share = await agent.post(`/api/captures/${id}/shares`).send({});
    expect(share.status).toBe(201);
    const token = share.body.url.split('/').pop();
    const url = `/api/shared/${token}/captures/${id}/samples?channel=0&points=300`;
    const json = await agent.get(url);
    const bin = await agent.get(url).set('Accept', 'application/octet-stream').buffer(true).parse(binary);
    expect(decodeSamplesBinary(bin.body)).toEqual(json.body);
  });
});
