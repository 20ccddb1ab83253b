import express from 'express';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorHandler } from '../../server/errors';
import { allow } from '../../server/middleware/auth';
import { projectScopes } from '../../server/middleware/projectScopes';
import type { RunningServer } from '../../server/server';
import type { User } from '../../shared/schemas/user';
import { sineCsv, uploadText } from '../helpers/captures';
import { restrictedScenario } from '../helpers/restrictedScenario';
import { resetDatabase, startTestServer, userAgent } from '../helpers/testServer';
import { newToken, tokenAgent } from '../helpers/tokens';

type Scenario = Awaited<ReturnType<typeof restrictedScenario>>;
let app: RunningServer;
let s: Scenario;
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  s = await restrictedScenario(app);
});
afterAll(() => app.stop());

const ids = (items: { id: number }[]) => items.map((i) => i.id);

describe('lists leave out what is hidden, without a word', () => {
  it('projects: the outsider sees only the team project; member and admin see both', async () => {
    for (const agent of [s.outsider, s.tokens.outsider]) expect(ids((await agent.get('/api/projects')).body.items)).toEqual([s.team]);
    for (const agent of [s.member, s.tokens.member, s.admin]) expect(ids((await agent.get('/api/projects')).body.items).sort()).toEqual([s.project, s.team].sort());
  });

  it('captures: the outsider’s list and total leave the hidden capture out, also when asking for its project', async () => {
    for (const agent of [s.outsider, s.tokens.outsider]) {
      const all = (await agent.get('/api/captures')).body;
      expect(ids(all.items)).not.toContain(s.capture);
      expect(all.total).toBe(all.items.length);
      expect((await agent.get(`/api/captures?projectId=${s.project}`)).body).toMatchObject({ items: [], total: 0 });
    }
    expect(ids((await s.tokens.member.get(`/api/captures?projectId=${s.project}`)).body.items)).toContain(s.capture);
  });

  it('comparisons: one that includes a hidden capture is left out; one of team captures stays', async () => {
    const teamOnly = (await s.owner.post('/api/comparisons').send({ name: 'Lab only', captureIds: [s.teamCapture, s.teamCapture] })).body.id;
    for (const agent of [s.outsider, s.tokens.outsider]) expect(ids((await agent.get('/api/comparisons')).body.items)).toEqual([teamOnly]);
    expect(ids((await s.member.get('/api/comparisons')).body.items).sort()).toEqual([s.comparison, teamOnly].sort());
  });
});

describe('member roles', () => {
  it('an engineer added as a viewer reads and comments, but cannot upload, mark or share there', async () => {
    const reader = await userAgent(app, { email: 'reader@client-a.example', name: 'Reader', role: 'engineer' });
    const userId = (await reader.get('/api/auth/me')).body.user.id;
    expect((await s.owner.post(`/api/projects/${s.project}/members`).send({ userId, role: 'viewer' })).status).toBe(201);
    const token = tokenAgent(app, (await newToken(reader)).token);
    for (const agent of [reader, token]) {
      expect((await agent.get(`/api/projects/${s.project}`)).body.project).toMatchObject({ visibility: 'members', yourRole: 'viewer' });
      expect((await agent.get(`/api/captures/${s.capture}/analysis`)).status).toBe(200);
      expect((await agent.post(`/api/captures/${s.capture}/comments`).send({ body: 'Read it.' })).status).toBe(201);
      expect((await agent.post(`/api/captures/${s.capture}/annotations`).send({ startS: 0, endS: 0.01, label: 'x' })).status).toBe(403);
      expect((await agent.post(`/api/captures/${s.capture}/shares`).send({})).status).toBe(403);
      expect((await uploadText(agent, 'reader.csv', sineCsv(7, 50, 1000, 0.05), { projectId: s.project })).status).toBe(403);
    }
    // Elsewhere they are still the engineer they are.
    expect((await reader.get(`/api/projects/${s.team}`)).body.project.yourRole).toBe('engineer');
  });

  it('a Crestline viewer cannot be made an engineer of a project; admins and the creator are never added', async () => {
    const viewer = await userAgent(app, { email: 'viewer@client-a.example', name: 'Vera', role: 'viewer' });
    const viewerId = (await viewer.get('/api/auth/me')).body.user.id;
    const add = (userId: number, role: string) => s.owner.post(`/api/projects/${s.project}/members`).send({ userId, role });
    expect((await add(viewerId, 'engineer')).body.error.code).toBe('role_above_user');
    expect((await add(viewerId, 'viewer')).status).toBe(201);
    expect((await add(s.ids.owner, 'viewer')).body.error.code).toBe('always_sees');
    expect((await add(999999, 'viewer')).body.error.code).toBe('unknown_user');
    expect((await add(viewerId, 'admin')).status).toBe(400);
  });

  it('the owner changes a member’s role (200) and removes them, which hides the project from them at once', async () => {
    const temp = await userAgent(app, { email: 'temp@client-a.example', name: 'Temp', role: 'engineer' });
    const userId = (await temp.get('/api/auth/me')).body.user.id;
    const token = tokenAgent(app, (await newToken(temp)).token);
    expect((await s.owner.post(`/api/projects/${s.project}/members`).send({ userId, role: 'engineer' })).status).toBe(201);
    expect((await s.owner.post(`/api/projects/${s.project}/members`).send({ userId, role: 'viewer' })).status).toBe(200);
    const members = (await s.member.get(`/api/projects/${s.project}/members`)).body.items;
    expect(members.find((m: { userId: number }) => m.userId === userId)).toMatchObject({ name: 'Temp', role: 'viewer' });
    expect((await token.get(`/api/captures/${s.capture}`)).status).toBe(200);
    expect((await s.owner.delete(`/api/projects/${s.project}/members/${userId}`)).status).toBe(204);
    expect((await s.owner.delete(`/api/projects/${s.project}/members/${userId}`)).status).toBe(404);
    for (const agent of [temp, token]) expect((await agent.get(`/api/captures/${s.capture}`)).status).toBe(404);
  });
});

describe('visibility', () => {
  it('the creator opens the project to the team and closes it again; an outsider cannot change it', async () => {
    expect((await s.outsider.patch(`/api/projects/${s.project}`).send({ visibility: 'team' })).status).toBe(404);
    expect((await s.owner.patch(`/api/projects/${s.project}`).send({ visibility: 'team' })).body.project.visibility).toBe('team');
    expect((await s.tokens.outsider.get(`/api/captures/${s.capture}/samples?channel=0&points=50`)).status).toBe(200);
    expect((await s.owner.patch(`/api/projects/${s.project}`).send({ visibility: 'members' })).body.project.visibility).toBe('members');
    expect((await s.tokens.outsider.get(`/api/captures/${s.capture}/samples?channel=0&points=50`)).status).toBe(404);
  });

  it('a new project is for the team unless asked otherwise', async () => {
    expect((await s.owner.post('/api/projects').send({ name: 'Open bench' })).body.project).toMatchObject({ visibility: 'team', yourRole: 'engineer' });
    expect((await s.owner.post('/api/projects').send({ name: 'x', visibility: 'secret' })).status).toBe(400);
  });
});

describe('share links', () => {
  it('a link made for a capture of a members-only project keeps working without a session, until revoked', async () => {
    const share = (await s.member.post(`/api/captures/${s.capture}/shares`).send({})).body;
    const open = () => supertest(app.server).get(`/api/shared/${share.token}`);
    expect((await open()).status).toBe(200);
    expect((await supertest(app.server).get(`/api/shared/${share.token}/captures/${s.capture}/samples?channel=0&points=50`)).status).toBe(200);
    expect((await s.outsider.delete(`/api/shares/${share.id}`)).status).toBe(404);
    expect((await s.member.delete(`/api/shares/${share.id}`)).status).toBe(204);
    expect((await open()).status).toBe(404);
  });
});

describe('routes added later', () => {
  /** The app's own order (session, projectScopes, routes) with a route of the kind other work adds under /captures/:id. */
  function appWithLaterRoute(user: User) {
    const later = express();
    later.use((req, _res, next) => {
      req.user = user; // stands in for requireSession
      next();
    });
    later.use(projectScopes(app.ctx));
    later.get('/captures/:id/report.pdf', (_req, res) => res.type('pdf').send('%PDF'));
    later.patch('/captures/:id/channels/:index', allow('admin', 'engineer'), (_req, res) => res.json({ ok: true }));
    later.use(errorHandler);
    return later;
  }
  const userOf = async (agent: typeof s.member): Promise<User> => (await agent.get('/api/auth/me')).body.user;

  it('inherit the rule without knowing it: 404 for the outsider, the member’s project role for writes', async () => {
    const outsider = appWithLaterRoute(await userOf(s.outsider));
    expect((await supertest(outsider).get(`/captures/${s.capture}/report.pdf`)).status).toBe(404);
    expect((await supertest(outsider).patch(`/captures/${s.capture}/channels/0`)).status).toBe(404);
    const member = appWithLaterRoute(await userOf(s.member));
    expect((await supertest(member).get(`/captures/${s.capture}/report.pdf`)).status).toBe(200);
    expect((await supertest(member).patch(`/captures/${s.capture}/channels/0`)).status).toBe(200);
    const reader = await userAgent(app, { email: 'later@client-a.example', name: 'Later', role: 'engineer' });
    const readerUser = await userOf(reader);
    await s.owner.post(`/api/projects/${s.project}/members`).send({ userId: readerUser.id, role: 'viewer' });
    expect((await supertest(appWithLaterRoute(readerUser)).patch(`/captures/${s.capture}/channels/0`)).status).toBe(403);
  });
});
