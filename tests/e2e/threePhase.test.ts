/**
 * An engineer's path through channel setup and three-phase analysis in real chromium.
 * Expected values: a 100 mV/A clamp reading 1 V RMS carries 10 A RMS (common practice, no source;
 * sine RMS = peak/√2, standard calculus); the invented switchboard demo capture's designed unbalance
 * u2 = 1.592 % (Fortescue's definitions, worked out in Python, see tests/api/threePhase.test.ts) and its
 * dip to 72 % of 231 V = 166.3 V from 0.2 s to 0.3 s.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
let page: Page;
let projectId: number;
const engineer = { email: 'eng@3p-e2e.example', password: 'engineer-pass-3' };

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1', RUN_WORKER: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ ...engineer, name: 'Hale Engineer', role: 'engineer' });
  projectId = (await admin.post('/api/projects').send({ name: 'Switchroom survey', description: 'Invented commissioning visit' })).body.project.id;
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signInThroughForm(page, app.url, engineer.email, engineer.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('channel setup and three-phase systems', () => {
  it('sets a clamp scale on a channel recorded in volts, and then sees amperes', async () => {
    const agent = await signedIn(app, engineer.email, engineer.password);
    const id = (await uploadText(agent, 'clamp-output.csv', sineCsv(Math.SQRT2, 50, 10000, 0.2), { projectId })).body.id;
    await waitSettled(agent, id);
    await page.goto(`${app.url}/captures/${id}`);
    await page.locator('[data-test=figures-table]').waitFor();
    expect(await page.locator('[data-test=figure-rms] td').first().textContent()).toMatch(/^1\.000 V$/);
    await page.getByRole('tab', { name: 'File' }).click();
    await page.locator('#setup-unit-0').click();
    await page.getByRole('option', { name: 'A', exact: true }).click();
    await page.locator('#setup-scale-0').fill('10');
    await page.locator('#setup-scale-0').press('Tab');
    await page.locator('[data-test=setup-save-0]').click();
    await page.getByRole('tab', { name: 'Figures' }).click();
    await expect.poll(() => page.locator('[data-test=figure-rms] td').first().textContent(), { timeout: 20_000 }).toMatch(/^10\.000? A$/);
    await page.getByRole('tab', { name: 'File' }).click();
    expect(await page.locator('[data-test=channel-meta-0]').textContent()).toMatch(/\(A\).*× 10/);
    await screenshot(page, 'channel-setup');
  });

  it('opens the system view of the demo switchboard capture and reads its unbalance', async () => {
    const empty = (await (await signedIn(app, engineer.email, engineer.password)).post('/api/projects').send({ name: 'Demo switchroom' })).body.project.id;
    await page.goto(`${app.url}/projects/${empty}`);
    await page.locator('[data-test=add-demo]').click();
    const link = page.locator('[data-test=capture-link]', { hasText: 'Switchboard MSB-2' });
    await link.waitFor({ timeout: 30_000 });
    await link.click();
    await page.getByRole('tab', { name: 'Three-phase' }).waitFor({ timeout: 30_000 });
    await page.getByRole('tab', { name: 'Three-phase' }).click();
    await page.locator('[data-test=phasor-diagram]').waitFor();
    expect(await page.locator('[data-test=unbalance-negative] td').textContent()).toBe('1.59 %');
    expect(await page.locator('[data-test=sequence-table]').textContent()).toMatch(/NEMA MG 1/);
    expect(await page.locator('[data-test=unbalance-meaning]').textContent()).toMatch(/motor/);
    await page.locator('[data-test=three-phase-power]').waitFor();
    await screenshot(page, 'three-phase-system');
  });

  it('sees the dip in the cycle-by-cycle trend, and zooms the waveform by dragging across it', async () => {
    await expect.poll(() => page.locator('[data-test=trend-summary]').textContent(), { timeout: 15_000 }).toMatch(/Lowest 166\.\d V, highest 23\d\.\d V/);
    expect(await page.locator('[data-test=trend-declared]').textContent()).toMatch(/230\.0 V.*1 event/);
    const over = page.locator('[data-test=trend] .u-over');
    await over.scrollIntoViewIfNeeded();
    const box = (await over.boundingBox())!;
    const zoomed = page.waitForRequest((r) => /\/samples\?.*fromS=0\.(09|1)/.test(r.url()), { timeout: 10_000 });
    // The record is 0.6 s long: from 1/6 to 1/2 of the width is about 0.1 s to 0.3 s.
    await page.mouse.move(box.x + box.width / 6, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 3, box.y + box.height / 2, { steps: 4 });
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2, { steps: 4 });
    await page.mouse.up();
    await zoomed;
    await screenshot(page, 'three-phase-trend');
  });
});
