import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv } from '../helpers/captures';
import { ADMIN, AS_CLIENT, resetDatabase, startTestServer } from '../helpers/testServer';

let app: RunningServer;
beforeAll(async () => {
  app = await startTestServer();
  await resetDatabase(app);
});
afterAll(() => app.stop());

/** Same host, another port: "same-site", so SameSite=Lax alone would send the cookie along. */
const FOREIGN = 'http://127.0.0.1:9999';

async function sessionCookie(server = app) {
  const res = await supertest(server.server).post('/api/auth/login').set(AS_CLIENT).send({ email: ADMIN.email, password: ADMIN.password });
  expect(res.status).toBe(200);
  return (res.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
}
let uploads = 0;
/** A multipart upload (a new file each time) with the cookie and whatever headers the test names, nothing else. */
const upload = (cookie: string, headers: Record<string, string>) =>
  supertest(app.server).post('/api/captures').set('Cookie', cookie).set(headers).attach('file', Buffer.from(sineCsv(10 + ++uploads, 50, 1000, 0.1)), `upload-${uploads}.csv`);
const signOut = (cookie: string, headers: Record<string, string>) => supertest(app.server).post('/api/auth/logout').set('Cookie', cookie).set(headers);
const stillSignedIn = async (cookie: string) => (await supertest(app.server).get('/api/auth/me').set('Cookie', cookie)).status === 200;

describe('state-changing requests with the session cookie', () => {
  it('when a page on another port of the same host posts an upload and a sign-out, then both are 403 cross_origin and nothing happens', async () => {
    const cookie = await sessionCookie();
    const up = await upload(cookie, { Origin: FOREIGN });
    expect(up.status).toBe(403);
    expect(up.body).toEqual({ error: { code: 'cross_origin', message: expect.any(String) } });
    const out = await signOut(cookie, { Origin: FOREIGN });
    expect(out.status).toBe(403);
    expect(await stillSignedIn(cookie)).toBe(true);
    const list = await supertest(app.server).get('/api/captures').set('Cookie', cookie);
    expect(list.body.total).toBe(0);
  });

  it('when Crestline’s own page does the same (its Origin), then both are accepted', async () => {
    const cookie = await sessionCookie();
    expect((await upload(cookie, { Origin: app.url })).status).toBe(202);
    expect((await signOut(cookie, { Origin: app.url })).status).toBe(204);
    expect(await stillSignedIn(cookie)).toBe(false);
  });

  it('without Origin, by Referer: a foreign page is refused, a page of Crestline accepted', async () => {
    const cookie = await sessionCookie();
    expect((await upload(cookie, { Referer: `${FOREIGN}/attack.html` })).status).toBe(403);
    expect((await upload(cookie, { Referer: `${app.url}/projects/1` })).status).toBe(202);
  });

  it('with neither Origin nor Referer: refused without the client header, accepted with it', async () => {
    const cookie = await sessionCookie();
    expect((await upload(cookie, {})).status).toBe(403);
    expect((await signOut(cookie, {})).status).toBe(403);
    expect((await upload(cookie, AS_CLIENT)).status).toBe(202);
    expect((await signOut(cookie, AS_CLIENT)).status).toBe(204);
  });

  it('the client header does not excuse a foreign Origin, and "Origin: null" (a sandboxed page) is foreign', async () => {
    const cookie = await sessionCookie();
    expect((await signOut(cookie, { ...AS_CLIENT, Origin: FOREIGN })).status).toBe(403);
    expect((await signOut(cookie, { Origin: 'null' })).status).toBe(403);
    expect(await stillSignedIn(cookie)).toBe(true);
  });

  it('reading is not affected: a GET with the cookie from a foreign Origin is answered as before', async () => {
    const cookie = await sessionCookie();
    expect((await supertest(app.server).get('/api/projects').set('Cookie', cookie).set('Origin', FOREIGN)).status).toBe(200);
  });
});

describe('signing in', () => {
  const login = (path: string, headers: Record<string, string>) => supertest(app.server).post(path).set(headers).send({ email: ADMIN.email, password: ADMIN.password });

  it('when another site posts a sign-in (to put the visitor in an account of its choosing), then 403, however the path is spelled', async () => {
    for (const path of ['/api/auth/login', '/api/AUTH/Login', '/api/auth/login/']) {
      expect((await login(path, { Origin: FOREIGN })).status, path).toBe(403);
      expect((await login(path, {})).status, path).toBe(403);
    }
  });

  it('when Crestline’s own page signs in, by Origin or by the client header, then 200', async () => {
    expect((await login('/api/auth/login', { Origin: app.url })).status).toBe(200);
    expect((await login('/api/auth/login', AS_CLIENT)).status).toBe(200);
  });
});

describe('the app’s origin', () => {
  it('behind a proxy, PUBLIC_URL’s origin counts as Crestline’s own, though the Host header differs', async () => {
    const proxied = await startTestServer({ PUBLIC_URL: 'https://crestline.example/' });
    try {
      const cookie = await sessionCookie(proxied);
      const res = await supertest(proxied.server).post('/api/auth/logout').set('Cookie', cookie).set('Origin', 'https://crestline.example');
      expect(res.status).toBe(204);
      const other = await supertest(proxied.server).post('/api/auth/logout').set('Cookie', cookie).set('Origin', 'https://evil.example');
      expect(other.status).toBe(403);
    } finally {
      await proxied.stop();
    }
  });
});
