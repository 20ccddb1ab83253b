/** A rig's token made on the account page, and a members-only project set up from the browser. */
import supertest from 'supertest';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
let page: Page;
const lead = { email: 'lead@e2e.example', password: 'engineer-pass-1', name: 'Lena Lead' };
const colleague = { email: 'colleague@e2e.example', password: 'engineer-pass-2', name: 'Cal Colleague' };
const other = { email: 'other@e2e.example', password: 'engineer-pass-3', name: 'Otto Other' };

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  for (const u of [lead, colleague, other]) await admin.post('/api/users').send({ ...u, role: 'engineer' });
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signInThroughForm(page, app.url, lead.email, lead.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

const asToken = (token: string) => supertest(app.server).get('/api/auth/me').set('Authorization', `Bearer ${token}`);

describe('API tokens on the account page', () => {
  it('an engineer makes a token for a rig, sees it once, and revokes it', async () => {
    await page.goto(`${app.url}/account`);
    await page.locator('[data-test=token-name]').fill('Bench 2 rig');
    await page.locator('[data-test=create-token]').click();
    const shown = page.locator('[data-test=new-token-value]');
    await shown.waitFor();
    const token = await shown.inputValue();
    expect(token).toMatch(/^crl_/);
    expect((await asToken(token)).body.user.email).toBe(lead.email);
    const row = page.locator('[data-test=tokens-table] tr', { hasText: 'Bench 2 rig' });
    await row.waitFor();
    expect(await row.textContent()).not.toContain(token);
    await screenshot(page, 'account-api-tokens');
    await row.getByRole('button', { name: 'Revoke' }).click();
    await expect.poll(() => row.count()).toBe(0);
    expect((await asToken(token)).status).toBe(401);
  });

  it('the help page leads to "Automate uploads", with a curl script for a bench rig', async () => {
    await page.goto(`${app.url}/help`);
    await page.locator('[data-test=help-automation]').click();
    const script = await page.locator('[data-test=automation-script]').textContent();
    expect(script).toContain('Authorization: Bearer $TOKEN');
    expect(script).toContain(`-F file=@capture.csv -F projectId=$PROJECT "$CRESTLINE/api/captures"`);
    expect(script).toContain(`CRESTLINE=${app.url}`);
  });
});

describe('a members-only project', () => {
  it('is created with the lock, gets a member from the panel, and stays out of everyone else’s list', async () => {
    await page.goto(`${app.url}/`);
    await page.locator('[data-test=new-project]').click();
    await page.locator('[data-test=project-name]').fill('Client A: feeder study');
    await page.locator('[data-test=project-visibility]').getByText('Members only').click();
    await page.locator('[data-test=project-save]').click();
    const row = page.locator('[data-test=projects-table] tr', { hasText: 'Client A: feeder study' });
    await row.locator('[data-test=members-only]').waitFor();
    await row.getByRole('link', { name: 'Client A: feeder study' }).click();
    await page.locator('[data-test=members-panel]').waitFor();
    await page.locator('[data-test=member-pick]').click();
    await page.getByRole('option', { name: new RegExp(colleague.name) }).click();
    await page.locator('[data-test=member-add]').click();
    await page.locator('[data-test=members-table] tr', { hasText: colleague.name }).waitFor();
    await screenshot(page, 'project-members-only');

    const names = async (who: typeof other) => ((await (await signedIn(app, who.email, who.password)).get('/api/projects')).body.items as { name: string }[]).map((p) => p.name);
    expect(await names(colleague)).toContain('Client A: feeder study');
    expect(await names(other)).not.toContain('Client A: feeder study');
  });
});
