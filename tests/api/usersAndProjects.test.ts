import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let admin: Awaited<ReturnType<typeof signedIn>>;
beforeAll(async () => {
  app = await startTestServer();
  await resetDatabase(app);
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ email: 'eng@test.example', name: 'Eng', role: 'engineer', password: 'engineer-pass-1' });
  await admin.post('/api/users').send({ email: 'view@test.example', name: 'View', role: 'viewer', password: 'viewer-pass-1' });
});
afterAll(() => app.stop());

describe('users (admin only)', () => {
  it('an admin lists and creates users with exactly the roles admin, engineer, viewer', async () => {
    const list = await admin.get('/api/users');
    expect(list.status).toBe(200);
    expect(list.body.items.map((u: { role: string }) => u.role).sort()).toEqual(['admin', 'engineer', 'viewer']);
    const bad = await admin.post('/api/users').send({ email: 'x@test.example', name: 'X', role: 'superuser', password: 'long-enough-1' });
    expect(bad.status).toBe(400);
    const dup = await admin.post('/api/users').send({ email: 'ENG@test.example', name: 'Again', role: 'viewer', password: 'long-enough-1' });
    expect(dup.status).toBe(409);
  });

  it('a viewer or engineer gets 403 on the admin routes', async () => {
    for (const [email, password] of [['view@test.example', 'viewer-pass-1'], ['eng@test.example', 'engineer-pass-1']]) {
      const agent = await signedIn(app, email, password);
      expect((await agent.get('/api/users')).status).toBe(403);
      const res = await agent.post('/api/users').send({ email: 'y@test.example', name: 'Y', role: 'admin', password: 'long-enough-1' });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
  });

  it('an admin changes a role, and cannot lock themself out', async () => {
    const list = (await admin.get('/api/users')).body.items as { id: number; email: string }[];
    const viewer = list.find((u) => u.email === 'view@test.example')!;
    const me = list.find((u) => u.email === ADMIN.email)!;
    expect((await admin.patch(`/api/users/${viewer.id}`).send({ role: 'engineer' })).body.user.role).toBe('engineer');
    await admin.patch(`/api/users/${viewer.id}`).send({ role: 'viewer' });
    expect((await admin.patch(`/api/users/${me.id}`).send({ active: false })).status).toBe(400);
  });
});

describe('projects', () => {
  it('an engineer creates, renames and archives a project; everyone lists it', async () => {
    const eng = await signedIn(app, 'eng@test.example', 'engineer-pass-1');
    const created = await eng.post('/api/projects').send({ name: 'Substation B survey', description: 'Harmonics at the LV board' });
    expect(created.status).toBe(201);
    const id = created.body.project.id;
    expect(created.body.project).toMatchObject({ name: 'Substation B survey', archived: false, captureCount: 0 });
    expect((await eng.patch(`/api/projects/${id}`).send({ name: 'Substation B: LV survey' })).body.project.name).toBe('Substation B: LV survey');
    expect((await eng.patch(`/api/projects/${id}`).send({ archived: true })).body.project.archived).toBe(true);
    const viewer = await signedIn(app, 'view@test.example', 'viewer-pass-1');
    expect((await viewer.get('/api/projects?archived=true')).body.items.map((p: { id: number }) => p.id)).toContain(id);
    expect((await viewer.get('/api/projects')).body.items.map((p: { id: number }) => p.id)).not.toContain(id);
  });

  it('a viewer may not create or change projects', async () => {
    const viewer = await signedIn(app, 'view@test.example', 'viewer-pass-1');
    expect((await viewer.post('/api/projects').send({ name: 'Nope' })).status).toBe(403);
    expect((await viewer.patch('/api/projects/1').send({ name: 'Nope' })).status).toBe(403);
  });

  it('validates bodies, params and queries', async () => {
    expect((await admin.post('/api/projects').send({ name: '' })).status).toBe(400);
    expect((await admin.patch('/api/projects/abc').send({ name: 'x' })).status).toBe(400);
    expect((await admin.get('/api/projects?archived=maybe')).status).toBe(400);
    expect((await admin.get('/api/projects/999999')).status).toBe(404);
  });
});
