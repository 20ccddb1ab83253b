import type supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText } from '../helpers/captures';
import { restrictedScenario } from '../helpers/restrictedScenario';
import { resetDatabase, startTestServer } from '../helpers/testServer';

type Agent = supertest.Agent;
type Scenario = Awaited<ReturnType<typeof restrictedScenario>>;
let app: RunningServer;
let s: Scenario;
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  s = await restrictedScenario(app);
});
afterAll(() => app.stop());

let made = 0;
/** Something new to delete or change, made by its rightful owner, so every asker meets a fresh one. */
const fresh = {
  capture: async () => (await uploadText(s.member, `fresh-${++made}.csv`, sineCsv(100 + made, 50, 1000, 0.05), { projectId: s.project })).body.id as number,
  annotation: async () => (await s.member.post(`/api/captures/${s.capture}/annotations`).send({ startS: 0, endS: 0.01, label: `Mark ${++made}` })).body.id as number,
  share: async () => (await s.member.post(`/api/captures/${s.capture}/shares`).send({})).body.id as number,
  person: async () => (await s.admin.post('/api/users').send({ email: `p${++made}@client-a.example`, name: `P${made}`, role: 'engineer', password: 'long-enough-pass-1' })).body.user.id as number,
  memberOf: async () => {
    const userId = await fresh.person();
    await s.owner.post(`/api/projects/${s.project}/members`).send({ userId, role: 'viewer' });
    return userId;
  },
};

/**
 * Every route family that reaches into the members-only project, with what a member and an admin get.
 * Someone in neither gets 404, like for a project that does not exist. A 403 or 409 for the member
 * means the route was reached and said no for another reason (not the creator, not failed).
 */
const routes: { route: string; call: (a: Agent) => Promise<supertest.Response>; member: number; admin?: number; outsider?: number }[] = [
  { route: 'GET /projects/:id', call: (a) => a.get(`/api/projects/${s.project}`), member: 200 },
  { route: 'PATCH /projects/:id', call: (a) => a.patch(`/api/projects/${s.project}`).send({ description: 'Feeder 4' }), member: 403, admin: 200 },
  { route: 'POST /projects/:id/demo-captures', call: (a) => a.post(`/api/projects/${s.project}/demo-captures`), member: 202 },
  { route: 'GET /projects/:id/members', call: (a) => a.get(`/api/projects/${s.project}/members`), member: 200 },
  { route: 'GET /projects/:id/member-candidates', call: (a) => a.get(`/api/projects/${s.project}/member-candidates`), member: 403, admin: 200 },
  { route: 'POST /projects/:id/members', call: async (a) => a.post(`/api/projects/${s.project}/members`).send({ userId: await fresh.person(), role: 'viewer' }), member: 403, admin: 201 },
  { route: 'DELETE /projects/:id/members/:userId', call: async (a) => a.delete(`/api/projects/${s.project}/members/${await fresh.memberOf()}`), member: 403, admin: 204 },
  { route: 'POST /captures (projectId)', call: (a) => a.post('/api/captures').field('projectId', String(s.project)).attach('file', Buffer.from(sineCsv(1 + ++made, 50, 1000, 0.05)), 'rig.csv'), member: 202 },
  { route: 'GET /captures/:id', call: (a) => a.get(`/api/captures/${s.capture}`), member: 200 },
  { route: 'PATCH /captures/:id', call: (a) => a.patch(`/api/captures/${s.capture}`).send({ tags: ['feeder'] }), member: 200 },
  { route: 'DELETE /captures/:id', call: async (a) => a.delete(`/api/captures/${await fresh.capture()}`), member: 204 },
  { route: 'POST /captures/:id/sample-rate', call: (a) => a.post(`/api/captures/${s.capture}/sample-rate`).send({ sampleRate: 1000 }), member: 409 },
  { route: 'GET /captures/:id/analysis', call: (a) => a.get(`/api/captures/${s.capture}/analysis`), member: 200 },
  { route: 'GET /captures/:id/samples', call: (a) => a.get(`/api/captures/${s.capture}/samples?channel=0&points=100`), member: 200 },
  { route: 'GET /captures/:id/original', call: (a) => a.get(`/api/captures/${s.capture}/original`), member: 200 },
  { route: 'GET /captures/:id/annotations', call: (a) => a.get(`/api/captures/${s.capture}/annotations`), member: 200 },
  { route: 'POST /captures/:id/annotations', call: (a) => a.post(`/api/captures/${s.capture}/annotations`).send({ startS: 0, endS: 0.01, label: 'Dip' }), member: 201 },
  { route: 'PATCH /annotations/:id', call: (a) => a.patch(`/api/annotations/${s.annotation}`).send({ note: 'checked' }), member: 200 },
  { route: 'DELETE /annotations/:id', call: async (a) => a.delete(`/api/annotations/${await fresh.annotation()}`), member: 204 },
  { route: 'GET /captures/:id/comments', call: (a) => a.get(`/api/captures/${s.capture}/comments`), member: 200 },
  { route: 'POST /captures/:id/comments', call: (a) => a.post(`/api/captures/${s.capture}/comments`).send({ body: 'Seen on site too.' }), member: 201 },
  { route: 'POST /captures/:id/shares', call: (a) => a.post(`/api/captures/${s.capture}/shares`).send({}), member: 201 },
  { route: 'GET /captures/:id/shares', call: (a) => a.get(`/api/captures/${s.capture}/shares`), member: 200 },
  { route: 'DELETE /shares/:id', call: async (a) => a.delete(`/api/shares/${await fresh.share()}`), member: 204 },
  { route: 'GET /comparisons/:id', call: (a) => a.get(`/api/comparisons/${s.comparison}`), member: 200 },
  { route: 'POST /comparisons/:id/shares', call: (a) => a.post(`/api/comparisons/${s.comparison}/shares`).send({}), member: 201 },
  { route: 'GET /comparisons/:id/shares', call: (a) => a.get(`/api/comparisons/${s.comparison}/shares`), member: 200 },
  { route: 'POST /comparisons (its captures)', call: (a) => a.post('/api/comparisons').send({ name: 'Again', captureIds: [s.capture, s.teamCapture] }), member: 201, outsider: 400 },
];

describe('a members-only project, route by route, by cookie and by token', () => {
  const askers = () =>
    [
      ['member', 'cookie', s.member],
      ['member', 'token', s.tokens.member],
      ['outsider', 'cookie', s.outsider],
      ['outsider', 'token', s.tokens.outsider],
      ['admin', 'cookie', s.admin],
      ['admin', 'token', s.tokens.admin],
    ] as const;

  it.each(routes)('$route: member as a member, admin as an admin, anyone else 404', async (r) => {
    for (const [who, how, agent] of askers()) {
      const expected = who === 'member' ? r.member : who === 'admin' ? (r.admin ?? r.member) : (r.outsider ?? 404);
      const res = await r.call(agent);
      expect({ who, how, status: res.status, body: res.status === expected ? null : res.body }).toEqual({ who, how, status: expected, body: null });
      if (who === 'outsider' && expected === 404) expect(res.body.error.code).toBe('not_found');
    }
  });

  it('a hidden capture answers exactly as one that does not exist, however its id is spelled', async () => {
    const missing = await s.outsider.get('/api/captures/999999/original');
    for (const path of [`/api/captures/${s.capture}/original`, `/api/captures/${s.capture}.0/original`, `/api/CAPTURES/${s.capture}/original`, `/api/captures/0x${s.capture.toString(16)}/original`]) {
      const res = await s.outsider.get(path);
      expect({ path, status: res.status, body: res.body }).toEqual({ path, status: 404, body: missing.body });
    }
  });
});
