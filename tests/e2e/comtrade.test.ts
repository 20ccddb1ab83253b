/**
 * A protection engineer drags a COMTRADE record (its .cfg and .dat together) onto a project page in real
 * chromium, and reads it: figures, the trigger mark, the trip contact's changes, the record's details.
 * Expected figure: a 50 Hz sine of 325 V peak has a true RMS of 229.8 V (325/√2; standard calculus).
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { cfgText, datBytes, type TestRecord } from '../helpers/comtradeWriter';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
let page: Page;
let projectId: number;
const engineer = { email: 'prot@e2e.example', password: 'engineer-pass-1' };

/** 0.2 s at 4000 S/s: 325 V peak on one channel (values on the secondary, P/S flag S, ratio 1:1), a trip contact closing at 0.1 s. */
const record: TestRecord = {
  station: 'South Mill 400V',
  device: 'Bench recorder',
  analog: [{ id: 'VA', unit: 'V', a: 0.0325, b: 0, ps: 'S' }],
  digital: [{ id: 'TRIP' }],
  rates: [[4000, 800]],
  start: '14/07/2025,10:00:00.000000',
  trigger: '14/07/2025,10:00:00.100000',
  ft: 'BINARY',
  raw: Array.from({ length: 800 }, (_, i) => [Math.round(1e4 * Math.sin((2 * Math.PI * 50 * i) / 4000))]),
  states: Array.from({ length: 800 }, (_, i) => [i >= 400 ? 1 : 0]),
};

/** Drops files on the page as a person dragging them from a file manager would. */
async function dropFiles(p: Page, files: { name: string; bytes: number[] }[]) {
  const dataTransfer = await p.evaluateHandle((list) => {
    const dt = new DataTransfer();
    for (const f of list) dt.items.add(new File([new Uint8Array(f.bytes)], f.name));
    return dt;
  }, files);
  for (const type of ['dragenter', 'dragover', 'drop']) await p.dispatchEvent('body', type, { dataTransfer });
}

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1', RUN_WORKER: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ ...engineer, name: 'Robin Relay', role: 'engineer' });
  projectId = (await admin.post('/api/projects').send({ name: 'Relay tests', description: 'Invented records' })).body.project.id;
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await signInThroughForm(page, app.url, engineer.email, engineer.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('a COMTRADE record in the browser', () => {
  it('a .cfg dropped alone is held back with a message', async () => {
    await page.goto(`${app.url}/projects/${projectId}`);
    await page.locator('[data-test=empty-project]').waitFor();
    await dropFiles(page, [{ name: 'south-mill.cfg', bytes: [...new TextEncoder().encode(cfgText(record))] }]);
    await page.locator('[data-test=upload-queue]').getByText('drop it together with its .dat').waitFor();
  });

  it('the .cfg and .dat dropped together become one capture', async () => {
    await dropFiles(page, [
      { name: 'south-mill.dat', bytes: [...datBytes(record)] },
      { name: 'south-mill.cfg', bytes: [...new TextEncoder().encode(cfgText(record))] },
    ]);
    await page.locator('[data-test=upload-queue]').getByText('south-mill.cfg + south-mill.dat').waitFor();
    await page.locator('[data-test=upload-queue] [data-test=status-ready]').waitFor({ timeout: 30_000 });
    await screenshot(page, 'comtrade-dropped');
    await page.locator('[data-test=capture-link]').getByText('south-mill').click();
    await page.locator('[data-test=figures-table]').waitFor();
    expect(await page.locator('[data-test=figure-rms] td').first().textContent()).toMatch(/^229\.8 V$/);
  });

  it('shows the trigger as a mark, the trip contact as state changes, and the record in the file details', async () => {
    await page.getByRole('tab', { name: /Annotations/ }).click();
    await page.locator('[data-test=annotation-suggested]').getByRole('button', { name: 'Trigger' }).waitFor();
    await page.getByRole('tab', { name: 'Digital (1)' }).click();
    const trip = await page.locator('[data-test=digital-1]').textContent();
    expect(trip).toContain('D1 TRIP');
    expect(trip).toContain('0 s → 1'); // closes at 0.1 s after the first sample, the trigger time
    await screenshot(page, 'comtrade-digital');
    await page.getByRole('tab', { name: 'File' }).click();
    const details = await page.locator('[data-test=capture-metadata]').textContent();
    expect(details).toContain('South Mill 400V');
    expect(details).toContain('COMTRADE, IEEE C37.111-1999');
    expect(await page.locator('[data-test=download-data]').textContent()).toContain('south-mill.dat');
    await screenshot(page, 'comtrade-file');
  });
});
