import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { annotations } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

type Agent = Awaited<ReturnType<typeof signedIn>>;
let app: RunningServer;
let admin: Agent;
let maker: Agent;
let other: Agent;
let viewer: Agent;
let captureId: number;
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
  maker = await userAgent(app, { email: 'maker@own.example', name: 'Maker', role: 'engineer' });
  other = await userAgent(app, { email: 'other@own.example', name: 'Other', role: 'engineer' });
  viewer = await userAgent(app, { email: 'viewer@own.example', name: 'Viewer', role: 'viewer' });
  captureId = (await uploadText(maker, 'owned.csv', sineCsv(325, 50, 10000, 0.2))).body.id;
  await waitSettled(maker, captureId);
});
afterAll(() => app.stop());

describe('projects: renamed or archived by their creator or an admin', () => {
  let id: number;
  beforeAll(async () => {
    id = (await maker.post('/api/projects').send({ name: 'Feeder 3 survey' })).body.project.id;
  });

  it('when another engineer renames or archives the project, then 403 and it stays as it was', async () => {
    const rename = await other.patch(`/api/projects/${id}`).send({ name: 'Taken over' });
    expect(rename.status).toBe(403);
    expect(rename.body.error.code).toBe('forbidden');
    expect((await other.patch(`/api/projects/${id}`).send({ archived: true })).status).toBe(403);
    expect((await other.get(`/api/projects/${id}`)).body.project).toMatchObject({ name: 'Feeder 3 survey', archived: false });
  });

  it('when its creator renames and archives it, then it changes', async () => {
    expect((await maker.patch(`/api/projects/${id}`).send({ name: 'Feeder 3: LV survey' })).body.project.name).toBe('Feeder 3: LV survey');
    expect((await maker.patch(`/api/projects/${id}`).send({ archived: true })).body.project.archived).toBe(true);
  });

  it('when an admin restores it, then it changes', async () => {
    expect((await admin.patch(`/api/projects/${id}`).send({ archived: false })).body.project.archived).toBe(false);
  });

  it('when a viewer tries, then 403 as before', async () => {
    expect((await viewer.patch(`/api/projects/${id}`).send({ name: 'x' })).status).toBe(403);
  });
});

describe('marks: owned by whoever made or accepted them', () => {
  /** A suggestion of the anomaly finder, as ingest stores it: owned by nobody. */
  async function suggestion(label: string): Promise<number> {
    const [{ id }] = await app.ctx.db
      .insert(annotations)
      .values({ captureId, startS: 0.05, endS: 0.06, label, note: '', severity: 'warning', source: 'finder', state: 'suggested', reason: 'A test suggestion' })
      .$returningId();
    return id;
  }

  it('when an engineer accepts a suggestion, then it is theirs, and another engineer can neither edit, re-accept nor delete it', async () => {
    const id = await suggestion('Dip');
    const accepted = await maker.patch(`/api/annotations/${id}`).send({ state: 'active' });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ state: 'active', createdBy: { name: 'Maker' } });
    expect((await other.patch(`/api/annotations/${id}`).send({ label: 'Mine now' })).status).toBe(403);
    expect((await other.patch(`/api/annotations/${id}`).send({ state: 'active' })).status).toBe(403);
    expect((await other.patch(`/api/annotations/${id}`).send({ state: 'dismissed' })).status).toBe(403);
    expect((await other.delete(`/api/annotations/${id}`)).status).toBe(403);
    const mark = (await other.get(`/api/captures/${captureId}/annotations`)).body.items.find((a: { id: number }) => a.id === id);
    expect(mark).toMatchObject({ label: 'Dip', createdBy: { name: 'Maker' } });
  });

  it('others comment instead; the owner edits and deletes', async () => {
    const id = await suggestion('Notch');
    await maker.patch(`/api/annotations/${id}`).send({ state: 'active' });
    expect((await other.post(`/api/captures/${captureId}/comments`).send({ body: 'I read the notch as a commutation.' })).status).toBe(201);
    expect((await maker.patch(`/api/annotations/${id}`).send({ label: 'Commutation notch' })).body.label).toBe('Commutation notch');
    expect((await maker.delete(`/api/annotations/${id}`)).status).toBe(204);
  });

  it('an admin edits and deletes anyone’s mark, without becoming its owner', async () => {
    const id = await suggestion('Spike');
    await maker.patch(`/api/annotations/${id}`).send({ state: 'active' });
    const edited = await admin.patch(`/api/annotations/${id}`).send({ severity: 'fault' });
    expect(edited.body).toMatchObject({ severity: 'fault', createdBy: { name: 'Maker' } });
    expect((await admin.delete(`/api/annotations/${id}`)).status).toBe(204);
  });

  it('a suggestion nobody has accepted yet is open to any engineer: one dismisses it', async () => {
    const id = await suggestion('Maybe a flicker');
    expect((await other.patch(`/api/annotations/${id}`).send({ state: 'dismissed' })).status).toBe(200);
  });

  it('an engineer’s own mark: only they or an admin change it', async () => {
    const created = await other.post(`/api/captures/${captureId}/annotations`).send({ startS: 0.1, endS: 0.11, label: 'Other’s mark' });
    expect((await maker.patch(`/api/annotations/${created.body.id}`).send({ label: 'x' })).status).toBe(403);
    expect((await maker.patch(`/api/annotations/${created.body.id}`).send({ state: 'active' })).status).toBe(403);
    expect((await other.patch(`/api/annotations/${created.body.id}`).send({ note: 'checked twice' })).body.note).toBe('checked twice');
  });
});
