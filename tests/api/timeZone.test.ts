import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { eq, sql } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { oneTimeTokens, sessions, shares } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { hashSecretToken } from '../../server/services/secretTokens';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { lastMailTo, linkIn } from '../helpers/mailbox';
import { ADMIN, AS_CLIENT, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

/**
 * The ORM writes times as UTC; a comparison with NOW() is right only if the connection is in UTC too.
 * Here the test database server runs in another zone (set as root, restored afterwards), once ahead
 * of UTC (links would die early) and once behind (they would live on).
 */
// root.cnf: since the MariaDB root was locked down, root signs in over the socket with its generated password only.
const rootOptions = '.data/test/root.cnf';
const asRoot = (statement: string) =>
  execFileSync('mariadb', [`--defaults-file=${rootOptions}`, '--batch', '--skip-column-names', '-e', statement]).toString().trim();

let original = 'SYSTEM';
beforeAll(() => {
  if (!existsSync(rootOptions)) throw new Error(`${rootOptions} not found: start the test database with scripts/db.sh up test PORT crestline_test`);
  original = asRoot('SELECT @@global.time_zone');
});
afterAll(() => {
  asRoot(`SET GLOBAL time_zone = '${original}'`);
});

const minutes = (m: number) => new Date(Date.now() + m * 60_000);
const tokenOf = (text: string) => new URL(linkIn(text, '/set-password')).searchParams.get('token')!;

for (const zone of ['+09:30', '-05:00']) {
  const tag = zone.startsWith('+') ? 'ahead' : 'behind';
  describe(`with the database server at UTC${zone}`, () => {
    let app: RunningServer;
    let admin: Awaited<ReturnType<typeof signedIn>>;
    const anon = () => supertest(app.server);
    beforeAll(async () => {
      asRoot(`SET GLOBAL time_zone = '${zone}'`);
      app = await startTestServer({ RUN_WORKER: '1' });
      await resetDatabase(app);
      admin = await signedIn(app, ADMIN.email, ADMIN.password);
    });
    afterAll(() => app?.stop());

    it('the server’s own connections are in UTC nevertheless', async () => {
      const [rows] = (await app.ctx.db.execute(sql`SELECT @@global.time_zone AS server, @@session.time_zone AS connection`)) as unknown as [{ server: string; connection: string }[]];
      expect(rows[0]).toEqual({ server: zone, connection: '+00:00' });
    });

    it('a share link made for 1 day is live, one with a minute left is live, one expired a minute ago is gone', async () => {
      const captureId = (await uploadText(admin, `tz-${tag}.csv`, sineCsv(325, 50, 1000, 0.1))).body.id;
      await waitSettled(admin, captureId);
      const share = async () => (await admin.post(`/api/captures/${captureId}/shares`).send({ expiresInDays: 1 })).body;
      const day = await share();
      expect((await anon().get(`/api/shared/${day.token}`)).status).toBe(200);
      const minuteLeft = await share();
      await app.ctx.db.update(shares).set({ expiresAt: minutes(1) }).where(eq(shares.id, minuteLeft.id));
      expect((await anon().get(`/api/shared/${minuteLeft.token}`)).status).toBe(200);
      const expired = await share();
      await app.ctx.db.update(shares).set({ expiresAt: minutes(-1) }).where(eq(shares.id, expired.id));
      expect((await anon().get(`/api/shared/${expired.token}`)).status).toBe(404);
    });

    it('a reset link 59 minutes old works; one 61 minutes old does not', async () => {
      const resetLinkAged = async (ageMinutes: number) => {
        await anon().post('/api/auth/reset-request').send({ email: ADMIN.email });
        const token = tokenOf((await lastMailTo(app, ADMIN.email)).text);
        // Reset links live an hour from when they were made.
        await app.ctx.db.update(oneTimeTokens).set({ createdAt: minutes(-ageMinutes), expiresAt: minutes(60 - ageMinutes) }).where(eq(oneTimeTokens.tokenHash, hashSecretToken(token)));
        return token;
      };
      const old = await resetLinkAged(61);
      expect((await anon().post('/api/auth/set-password').send({ token: old, password: 'not-any-more-1' })).status).toBe(400);
      const fresh = await resetLinkAged(59);
      expect((await anon().post('/api/auth/set-password').send({ token: fresh, password: ADMIN.password })).status).toBe(204);
    });

    it('an invitation with 30 minutes left works; one that ran out a minute ago does not', async () => {
      admin = await signedIn(app, ADMIN.email, ADMIN.password); // the reset above ended every session of the admin
      const invite = async (email: string, expiresAt: Date) => {
        expect((await admin.post('/api/users/invite').send({ email, name: 'Invitee', role: 'viewer' })).status).toBe(201);
        const token = tokenOf((await lastMailTo(app, email)).text);
        await app.ctx.db.update(oneTimeTokens).set({ expiresAt }).where(eq(oneTimeTokens.tokenHash, hashSecretToken(token)));
        return token;
      };
      const late = await invite(`late-${tag}@tz.example`, minutes(-1));
      expect((await anon().post('/api/auth/set-password').send({ token: late, password: 'first-password-1' })).status).toBe(400);
      const onTime = await invite(`ontime-${tag}@tz.example`, minutes(30));
      expect((await anon().post('/api/auth/set-password').send({ token: onTime, password: 'first-password-1' })).status).toBe(204);
    });

    it('a session with a minute left is live; one that ended a minute ago is not', async () => {
      const res = await anon().post('/api/auth/login').set(AS_CLIENT).send({ email: ADMIN.email, password: ADMIN.password });
      const cookie = (res.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
      const me = () => anon().get('/api/auth/me').set('Cookie', cookie);
      const [{ id }] = await app.ctx.db.select({ id: sessions.id }).from(sessions).orderBy(sql`${sessions.id} DESC`).limit(1);
      await app.ctx.db.update(sessions).set({ expiresAt: minutes(1) }).where(eq(sessions.id, id));
      expect((await me()).status).toBe(200);
      await app.ctx.db.update(sessions).set({ expiresAt: minutes(-1) }).where(eq(sessions.id, id));
      expect((await me()).status).toBe(401);
    });
  });
}
