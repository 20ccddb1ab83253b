import supertest from 'supertest';
import { expect } from 'vitest';
import type { RunningServer } from '../../server/server';

type Agent = supertest.Agent;

/** Creates an API token through the signed-in agent's own session and returns it. */
export async function newToken(agent: Agent, body: { name?: string; expiresInDays?: number; readOnly?: boolean } = {}): Promise<{ id: number; token: string }> {
  const res = await agent.post('/api/tokens').send({ name: 'Bench rig', ...body });
  expect(res.status).toBe(201);
  return res.body;
}

/** A client as a script is: no cookies, no client header, only `Authorization: Bearer <token>`. */
export function tokenAgent(running: RunningServer, token: string): Agent {
  return supertest.agent(running.server).set('Authorization', `Bearer ${token}`);
}
