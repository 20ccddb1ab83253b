import type supertest from 'supertest';
import { expect } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from './captures';
import { ADMIN, signedIn, userAgent } from './testServer';
import { newToken, tokenAgent } from './tokens';

type Agent = supertest.Agent;

/**
 * A consultancy's members-only project and the people around it:
 * - owner (engineer) created "Client A: feeder study" as members-only and added member as an engineer;
 * - member uploaded capture C to it, marked it (annotation A) and compared it with T, a capture of the
 *   team project "Shared lab notes";
 * - outsider is an engineer who is in neither; admin is the bootstrap admin.
 * Each of member, outsider and admin also holds an API token.
 */
export async function restrictedScenario(app: RunningServer) {
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  const owner = await userAgent(app, { email: 'owner@client-a.example', name: 'Owner', role: 'engineer' });
  const member = await userAgent(app, { email: 'member@client-a.example', name: 'Member', role: 'engineer' });
  const outsider = await userAgent(app, { email: 'outsider@client-b.example', name: 'Outsider', role: 'engineer' });
  const idOf = async (a: Agent) => (await a.get('/api/auth/me')).body.user.id as number;
  const ids = { owner: await idOf(owner), member: await idOf(member), outsider: await idOf(outsider) };

  const project = (await owner.post('/api/projects').send({ name: 'Client A: feeder study', visibility: 'members' })).body.project.id as number;
  expect((await owner.post(`/api/projects/${project}/members`).send({ userId: ids.member, role: 'engineer' })).status).toBe(201);
  const team = (await owner.post('/api/projects').send({ name: 'Shared lab notes' })).body.project.id as number;

  const capture = (await uploadText(member, 'client-a-feeder.csv', sineCsv(325, 50, 10000, 0.2), { projectId: project })).body.id as number;
  const teamCapture = (await uploadText(owner, 'lab-reference.csv', sineCsv(230, 50, 10000, 0.2), { projectId: team })).body.id as number;
  await waitSettled(member, capture);
  await waitSettled(owner, teamCapture);
  const annotation = (await member.post(`/api/captures/${capture}/annotations`).send({ startS: 0.01, endS: 0.02, label: 'Notch' })).body.id as number;
  const comparison = (await member.post('/api/comparisons').send({ name: 'Client A vs lab', captureIds: [capture, teamCapture] })).body.id as number;
  expect(comparison).toBeGreaterThan(0);

  const tokens = {
    member: tokenAgent(app, (await newToken(member)).token),
    outsider: tokenAgent(app, (await newToken(outsider)).token),
    admin: tokenAgent(app, (await newToken(admin)).token),
  };
  return { admin, owner, member, outsider, tokens, ids, project, team, capture, teamCapture, annotation, comparison };
}
