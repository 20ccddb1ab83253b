/**
 * Saved meter profiles: engineers and admins save them for a project's team, anyone in their own
 * account; viewers read; only the creator or an admin deletes. Then the demo's presets, which must be
 * meters a technician would recognise: each settles steadily on clean 50 Hz mains.
 */
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FrontEndProfile } from '../../shared/schemas/meterSimulation';
import { DEMO_METER_PROFILES, seedMeterProfiles } from '../../server/db/seedMeterProfiles';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

type Agent = Awaited<ReturnType<typeof userAgent>>;
let app: RunningServer;
let eng: Agent;
let eng2: Agent;
let viewer: Agent;
let admin: Agent;
let projectId: number;
let otherProjectId: number;

const handheld: FrontEndProfile = { type: 'averaging', coupling: 'ac', averagingTauS: 0.3, displayRateHz: 3, counts: 4000 };
const names = (res: { body: { items: { name: string }[] } }) => res.body.items.map((p) => p.name);

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'eng@mp.example', name: 'Rhea Engineer', role: 'engineer' });
  eng2 = await userAgent(app, { email: 'eng2@mp.example', name: 'Otto Engineer', role: 'engineer' });
  viewer = await userAgent(app, { email: 'view@mp.example', name: 'Vera Viewer', role: 'viewer' });
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
  projectId = (await eng.post('/api/projects').send({ name: 'Substation survey' })).body.project.id;
  otherProjectId = (await eng.post('/api/projects').send({ name: 'Workshop' })).body.project.id;
});
afterAll(() => app.stop());

describe('saving meter profiles', () => {
  let teamId: number;
  let mineId: number;

  it('an engineer saves one for the project; everyone sees it, only they (or an admin) may delete it', async () => {
    const res = await eng.post('/api/meter-profiles').send({ name: 'Handheld average-responding, 3 Hz display', scope: 'project', projectId, profile: handheld });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: 'Handheld average-responding, 3 Hz display', scope: 'project', projectId, profile: handheld, createdBy: { name: 'Rhea Engineer' }, canDelete: true });
    teamId = res.body.id;
    const seen = await viewer.get(`/api/meter-profiles?projectId=${projectId}`);
    expect(seen.status).toBe(200);
    expect(seen.body.items).toEqual([expect.objectContaining({ id: teamId, canDelete: false })]);
    expect(names(await viewer.get(`/api/meter-profiles?projectId=${otherProjectId}`))).toEqual([]);
  });

  it('a viewer cannot save into a project, but keeps profiles in their own account, private to them', async () => {
    const refused = await viewer.post('/api/meter-profiles').send({ name: 'Mine', scope: 'project', projectId, profile: handheld });
    expect(refused.status).toBe(403);
    const res = await viewer.post('/api/meter-profiles').send({ name: 'My clamp meter, peak hold', scope: 'account', profile: { type: 'peak', coupling: 'ac', averagingTauS: 2 } });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ scope: 'account', projectId: null, canDelete: true });
    mineId = res.body.id;
    expect(names(await viewer.get(`/api/meter-profiles?projectId=${projectId}`))).toEqual(['Handheld average-responding, 3 Hz display', 'My clamp meter, peak hold']);
    expect(names(await eng.get(`/api/meter-profiles?projectId=${projectId}`))).toEqual(['Handheld average-responding, 3 Hz display']);
    expect((await eng2.delete(`/api/meter-profiles/${mineId}`)).status).toBe(404);
  });

  it('refuses what does not describe a meter, a project that does not exist, and a project id on an account profile', async () => {
    const bad = await eng.post('/api/meter-profiles').send({ name: 'Too fast', scope: 'account', profile: { ...handheld, averagingTauS: 0 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/profile\.averagingTauS/);
    expect((await eng.post('/api/meter-profiles').send({ name: 'x', scope: 'project', profile: handheld })).body.error.message).toMatch(/projectId: A project profile needs its projectId/);
    expect((await eng.post('/api/meter-profiles').send({ name: 'x', scope: 'project', projectId: 999_999, profile: handheld })).status).toBe(404);
    expect((await eng.post('/api/meter-profiles').send({ name: 'x', scope: 'account', projectId, profile: handheld })).status).toBe(400);
    expect((await eng.post('/api/meter-profiles').send({ name: ' ', scope: 'account', profile: handheld })).body.error.message).toMatch(/Name the profile/);
    expect((await supertest(app.server).get('/api/meter-profiles')).status).toBe(401);
  });

  it('another engineer may not delete the team profile; its creator’s own account profile goes with 204; an admin may delete any', async () => {
    expect((await eng2.delete(`/api/meter-profiles/${teamId}`)).status).toBe(403);
    expect((await viewer.delete(`/api/meter-profiles/${mineId}`)).status).toBe(204);
    expect((await admin.delete(`/api/meter-profiles/${teamId}`)).status).toBe(204);
    expect(names(await viewer.get(`/api/meter-profiles?projectId=${projectId}`))).toEqual([]);
    expect((await admin.delete(`/api/meter-profiles/${teamId}`)).status).toBe(404);
  });
});

describe('meter profiles of a members-only project', () => {
  it('are hidden from someone outside it, who can neither list, save into nor delete them', async () => {
    const secret = (await eng.post('/api/projects').send({ name: 'Client C: drive retrofit', visibility: 'members' })).body.project.id;
    const saved = await eng.post('/api/meter-profiles').send({ name: 'Client C clamp meter', scope: 'project', projectId: secret, profile: handheld });
    expect(saved.status).toBe(201);
    expect(names(await eng.get(`/api/meter-profiles?projectId=${secret}`))).toContain('Client C clamp meter');

    expect((await eng2.get(`/api/meter-profiles?projectId=${secret}`)).status).toBe(404);
    expect(names(await eng2.get('/api/meter-profiles'))).not.toContain('Client C clamp meter');
    expect((await eng2.post('/api/meter-profiles').send({ name: 'Sneaked in', scope: 'project', projectId: secret, profile: handheld })).status).toBe(404);
    expect((await eng2.delete(`/api/meter-profiles/${saved.body.id}`)).status).toBe(404);
    expect(names(await admin.get(`/api/meter-profiles?projectId=${secret}`))).toContain('Client C clamp meter');
  });
});

describe('the demo presets', () => {
  it('are valid profiles, and each reads clean 230 V mains steadily, with a wait of a few seconds at most', async () => {
    await seedMeterProfiles(app.ctx.db, projectId, (await eng.get('/api/auth/me')).body.user.id);
    const list = (await viewer.get(`/api/meter-profiles?projectId=${projectId}`)).body.items as { name: string; profile: unknown }[];
    expect(list.map((p) => p.name).sort()).toEqual(DEMO_METER_PROFILES.map((p) => p.name).sort());
    const up = await uploadText(eng, 'mains.csv', sineCsv(230 * Math.SQRT2, 50, 10_000, 0.2), { projectId });
    const id = (await waitSettled(eng, up.body.id)).id;
    for (const p of list) {
      expect(FrontEndProfile.safeParse(p.profile).success).toBe(true);
      const r = (await viewer.post(`/api/captures/${id}/meter-simulation`).send({ channel: 0, profile: p.profile, repeat: true })).body;
      expect(r.advice.kind, `${p.name}: ${r.advice.sentence}`).toBe('wait');
      expect(r.settled.settlingTimeS, p.name).toBeLessThan(10);
    }
  });
});
