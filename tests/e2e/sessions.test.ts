/** Ending sessions from the browser: a person signs out their other sessions; an admin signs someone out everywhere. */
import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
const engineer = { email: 'roaming@e2e.example', password: 'engineer-pass-1' };

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ ...engineer, name: 'Rae Roaming', role: 'engineer' });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

/** A browser of its own (its own cookies), signed in as the engineer, on the projects page. */
async function device(): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  await signInThroughForm(page, app.url, engineer.email, engineer.password);
  return context;
}
/** Whether the device is still signed in: reopening the account page shows either its sessions or the sign-in form. */
async function stillSignedIn(context: BrowserContext): Promise<boolean> {
  const page = context.pages()[0];
  await page.goto(`${app.url}/account`);
  await page.locator('[data-test=sessions-table], [data-test=sign-in]').first().waitFor();
  return (await page.locator('[data-test=sessions-table]').count()) > 0;
}

describe('ending sessions', () => {
  it('on the account page, “Sign out other sessions” ends the session on the other device and keeps this one', async () => {
    const laptop = await device();
    const phone = await device();
    const page = laptop.pages()[0];
    await page.goto(`${app.url}/account`);
    await expect.poll(() => page.locator('[data-test=sessions-table] tbody tr').count()).toBe(2);
    await screenshot(page, 'account-sessions');
    await page.locator('[data-test=sign-out-others]').click();
    await expect.poll(() => page.locator('[data-test=sessions-table] tbody tr').count()).toBe(1);
    expect(await stillSignedIn(phone)).toBe(false);
    expect(await stillSignedIn(laptop)).toBe(true);
    await laptop.close();
    await phone.close();
  });

  it('on the people page, an admin’s “Sign out everywhere” ends every session of that person', async () => {
    const laptop = await device();
    const adminPage = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signInThroughForm(adminPage, app.url, ADMIN.email, ADMIN.password);
    await adminPage.goto(`${app.url}/admin/users`);
    const row = adminPage.locator('[data-test=users-table] tr', { hasText: 'Rae Roaming' });
    await row.getByRole('button', { name: 'Sign out everywhere' }).click();
    await adminPage.getByText('Rae Roaming is signed out on every device').waitFor();
    expect(await stillSignedIn(laptop)).toBe(false);
    await adminPage.close();
    await laptop.close();
  });
});
