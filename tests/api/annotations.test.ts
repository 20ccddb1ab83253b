import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let other: Awaited<ReturnType<typeof signedIn>>;
let viewer: Awaited<ReturnType<typeof signedIn>>;
let captureId: number;
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'a@ann.example', name: 'Author', role: 'engineer' });
  other = await userAgent(app, { email: 'b@ann.example', name: 'Other', role: 'engineer' });
  viewer = await userAgent(app, { email: 'v@ann.example', name: 'Viewer', role: 'viewer' });
  captureId = (await uploadText(eng, 'a.csv', sineCsv(325, 50, 10000, 0.2))).body.id;
  await waitSettled(eng, captureId);
});
afterAll(() => app.stop());

describe('annotations', () => {
  let id: number;
  it('an engineer marks a span; everyone lists it', async () => {
    const res = await eng.post(`/api/captures/${captureId}/annotations`).send({ startS: 0.05, endS: 0.07, label: 'Notch after switching', note: 'see commutation', severity: 'fault' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ startS: 0.05, endS: 0.07, label: 'Notch after switching', severity: 'fault', source: 'user', state: 'active', createdBy: { name: 'Author' } });
    id = res.body.id;
    const list = await viewer.get(`/api/captures/${captureId}/annotations`);
    expect(list.body.items.map((a: { id: number }) => a.id)).toContain(id);
  });

  it('an instant is a span of zero length; a reversed span is refused', async () => {
    expect((await eng.post(`/api/captures/${captureId}/annotations`).send({ startS: 0.1, endS: 0.1, label: 'Trigger' })).body.severity).toBe('info');
    expect((await eng.post(`/api/captures/${captureId}/annotations`).send({ startS: 0.1, endS: 0.05, label: 'Backwards' })).status).toBe(400);
  });

  it('only the author or an admin edits or deletes; a viewer cannot annotate but can comment', async () => {
    expect((await other.patch(`/api/annotations/${id}`).send({ label: 'Mine now' })).status).toBe(403);
    expect((await eng.patch(`/api/annotations/${id}`).send({ label: 'Notch (confirmed)' })).body.label).toBe('Notch (confirmed)');
    expect((await viewer.post(`/api/captures/${captureId}/annotations`).send({ startS: 0, endS: 0.01, label: 'x' })).status).toBe(403);
    const c = await viewer.post(`/api/captures/${captureId}/comments`).send({ body: 'Is this the contactor closing?' });
    expect(c.status).toBe(201);
    expect((await eng.get(`/api/captures/${captureId}/comments`)).body.items[0]).toMatchObject({ body: 'Is this the contactor closing?', createdBy: { name: 'Viewer' } });
    expect((await other.delete(`/api/annotations/${id}`)).status).toBe(403);
    expect((await eng.delete(`/api/annotations/${id}`)).status).toBe(204);
    expect((await eng.get(`/api/captures/${captureId}/annotations`)).body.items.map((a: { id: number }) => a.id)).not.toContain(id);
  });

  it('a saved comparison reopens at a stable address', async () => {
    const second = (await uploadText(eng, 'b.csv', sineCsv(300, 50, 10000, 0.2))).body.id;
    await waitSettled(eng, second);
    const saved = await eng.post('/api/comparisons').send({ name: 'Before and after the filter', captureIds: [captureId, second], settings: { align: 'trigger' } });
    expect(saved.status).toBe(201);
    const again = await viewer.get(`/api/comparisons/${saved.body.id}`);
    expect(again.body).toMatchObject({ name: 'Before and after the filter', captureIds: [captureId, second], settings: { align: 'trigger', layout: 'overlay' } });
    expect((await viewer.post('/api/comparisons').send({ name: 'x', captureIds: [captureId, second] })).status).toBe(403);
    expect((await eng.post('/api/comparisons').send({ name: 'x', captureIds: [captureId] })).status).toBe(400);
  });
});
