/** Sharing from the browser: an engineer e-mails a read-only link; a person without an account opens it; revoking stops it. */
import { readFileSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { uploadText, waitSettled } from '../helpers/captures';
import { lastMailTo, linkIn } from '../helpers/mailbox';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
let captureId: number;
const engineer = { email: 'sharer@ws.example', password: 'engineer-pass-1' };

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1', RUN_WORKER: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ ...engineer, name: 'Sol Sharer', role: 'engineer' });
  const agent = await signedIn(app, engineer.email, engineer.password);
  captureId = (await uploadText(agent, 'inverter-square-wave.csv', readFileSync('fixtures/waveforms/inverter-square-wave.csv'))).body.id;
  await waitSettled(agent, captureId);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('sharing a capture', () => {
  it('e-mailed link opens read-only in a fresh browser, and stops working after revoke', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signInThroughForm(page, app.url, engineer.email, engineer.password);
    await page.goto(`${app.url}/captures/${captureId}`);
    await page.locator('[data-test=share-open]').click();
    await page.locator('[data-test=share-email]').fill('facilities@client.example');
    await page.locator('[data-test=share-create]').click();
    await page.locator('[data-test=share-url]').waitFor();
    await screenshot(page, 'share-dialog');

    const mail = await lastMailTo(app, 'facilities@client.example');
    const link = linkIn(mail.text, '/shared/');

    const guest = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const guestPage = await guest.newPage();
    await guestPage.goto(link);
    await guestPage.locator('[data-test=figures-table]').first().waitFor();
    // the ±230 V square-wave fixture: true RMS = A for a 50 % square wave (standard calculus)
    expect(await guestPage.locator('[data-test=figure-rms] td').first().textContent()).toMatch(/^230\.0 V$/);
    expect(await guestPage.locator('[data-test=shared-by]').textContent()).toMatch(/Shared by Sol Sharer/);
    await guestPage.locator('[data-test=waveform] canvas').first().waitFor();
    for (const control of ['share-open', 'comment-input', 'annotation-save', 'upload-button', 'sign-out']) {
      expect(await guestPage.locator(`[data-test=${control}]`).count(), control).toBe(0);
    }
    expect(await guestPage.locator('[data-test=drag-mode]').getByText('Mark').count()).toBe(0);
    expect(await guestPage.getByText('qualified').count()).toBeGreaterThan(0);
    await screenshot(guestPage, 'shared-view');

    await page.locator('[data-test=share-revoke]').first().click();
    await expect.poll(() => page.locator('[data-test=share-revoke]').count()).toBe(0);
    await guestPage.reload();
    await guestPage.locator('[data-test=shared-error]').waitFor();
    expect(await guestPage.locator('[data-test=shared-error]').textContent()).toMatch(/does not work/);
    await guest.close();
    await page.close();
  });
});
