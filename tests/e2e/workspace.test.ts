/**
 * An engineer's path through the workspace in real chromium: upload a capture, read its true RMS,
 * zoom, measure a span, mark an anomaly and see it after a reload, compare two captures.
 * Expected values: the invented square-wave fixture of ±230 V, whose true RMS is 230 V for any span
 * (|x| is 230 V everywhere; standard calculus) and whose averaging-meter error is +11.07 %
 * (common practice, no source).
 */
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';
import { readFileSync } from 'node:fs';

let app: RunningServer;
let browser: Browser;
let page: Page;
let projectId: number;
let captureId: number;
const engineer = { email: 'eng@ws.example', password: 'engineer-pass-1' };

/** Drags across the plot area from one fraction of its width to another. */
async function dragAcross(p: Page, from: number, to: number) {
  const over = p.locator('[data-test=waveform] .u-over').first();
  await over.scrollIntoViewIfNeeded();
  const box = (await over.boundingBox())!;
  await p.mouse.move(box.x + box.width * from, box.y + box.height / 2);
  await p.mouse.down();
  await p.mouse.move(box.x + box.width * ((from + to) / 2), box.y + box.height / 2, { steps: 4 });
  await p.mouse.move(box.x + box.width * to, box.y + box.height / 2, { steps: 4 });
  await p.mouse.up();
}

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1', RUN_WORKER: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ ...engineer, name: 'Wren Engineer', role: 'engineer' });
  projectId = (await admin.post('/api/projects').send({ name: 'Inverter bench tests', description: 'Invented test campaign' })).body.project.id;
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await signInThroughForm(page, app.url, engineer.email, engineer.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('the workspace', () => {
  it('uploads a capture from the project page and shows it ready in the library', async () => {
    await page.goto(`${app.url}/projects/${projectId}`);
    await page.locator('[data-test=empty-project]').waitFor();
    await screenshot(page, 'project-empty');
    await page.locator('[data-test=file-input]').setInputFiles(path.resolve('fixtures/waveforms/inverter-square-wave.csv'));
    await page.locator('[data-test=upload-queue] [data-test=status-ready]').waitFor({ timeout: 30_000 });
    await page.locator('[data-test=captures-table]').getByText('inverter-square-wave').waitFor();
    await screenshot(page, 'project-library');
    const href = await page.locator('[data-test=capture-link]').first().getAttribute('href');
    captureId = Number(href!.split('/').pop());
  });

  it('the capture page shows the true RMS and what each meter would read', async () => {
    await page.locator('[data-test=capture-link]').first().click();
    await page.locator('[data-test=figures-table]').waitFor();
    const rms = await page.locator('[data-test=figure-rms] td').first().textContent();
    expect(rms).toMatch(/^230\.0 V$/);
    await page.getByRole('tab', { name: 'Meter readings' }).click();
    const avg = await page.locator('[data-test=meter-averageResponding]').textContent();
    expect(avg).toContain('+11.07 %');
    expect(await page.locator('[data-test=meter-explanation]').textContent()).toMatch(/form factor/);
    // "Your meter": a true RMS meter with 1 kHz bandwidth reads a 50 Hz square wave low, because its
    // harmonics above the band are attenuated (first-order low-pass; circuit theory, from memory).
    const predicted = await page.locator('[data-test=meter-model-result] .reading').textContent();
    const volts = Number(predicted!.replace(/[^\d.]/g, ''));
    expect(volts).toBeLessThan(230);
    expect(volts).toBeGreaterThan(200);
    await screenshot(page, 'capture-meters');
    await page.getByRole('tab', { name: 'Harmonics' }).click();
    await page.locator('[data-test=harmonics-table]').waitFor();
    await screenshot(page, 'capture-harmonics');
  });

  it('zooms by dragging, asking the server for the samples of the narrower span', async () => {
    await page.getByRole('tab', { name: 'Figures' }).click();
    const request = page.waitForRequest((r) => /\/samples\?.*fromS=0\.0[0-9]/.test(r.url()) && /toS=0\.0[0-9]/.test(r.url()));
    await dragAcross(page, 0.1, 0.3);
    await request;
    await screenshot(page, 'capture-zoomed');
    // The plot answers the keyboard too: focus it, pan right with an arrow key.
    const panned = page.waitForRequest((r) => /\/samples\?/.test(r.url()));
    await page.locator('[data-test=waveform]').focus();
    await page.keyboard.press('ArrowRight');
    await panned;
    await page.locator('[data-test=zoom-reset]').click();
  });

  it('measures a span: its figures are computed in the browser, with a banner when it is not whole cycles', async () => {
    await page.locator('[data-test=drag-mode]').getByText('Measure span').click();
    await dragAcross(page, 0.2, 0.47);
    await page.locator('[data-test=span-figures] [data-test=figures-table]').waitFor();
    const spanRms = await page.locator('[data-test=span-figures] [data-test=figure-rms] td').first().textContent();
    expect(spanRms).toMatch(/^230\.0 V$/);
    await page.locator('[data-test=span-banner]').waitFor();
    await screenshot(page, 'capture-span');
    // The same by typing the times: two whole cycles of 50 Hz, so no banner.
    await page.locator('#span-from').fill('0.02');
    await page.locator('#span-to').fill('0.06');
    await page.locator('[data-test=span-measure-typed]').click();
    await expect.poll(() => page.locator('[data-test=span-figures]').textContent()).toMatch(/0\.0200000 s to 0\.0600000 s/);
    expect(await page.locator('[data-test=span-banner]').count()).toBe(0);
  });

  it('marks an anomaly, and it is still there after a reload', async () => {
    await page.locator('[data-test=drag-mode]').getByText('Mark').click();
    await dragAcross(page, 0.5, 0.6);
    await page.locator('[data-test=annotation-label]').fill('Ringing after the edge');
    await page.locator('[data-test=annotation-save]').click();
    await page.reload();
    await page.getByRole('tab', { name: /Annotations/ }).click();
    await page.locator('[data-test=annotation-list]').getByText('Ringing after the edge').waitFor();
    await screenshot(page, 'capture-annotations');
  });

  it('shows power quantities for a capture with a voltage and a current channel', async () => {
    const agent = await signedIn(app, engineer.email, engineer.password);
    const id = (await uploadText(agent, 'rectifier-current.csv', readFileSync('fixtures/waveforms/rectifier-current.csv'), { projectId })).body.id;
    await waitSettled(agent, id);
    await page.goto(`${app.url}/captures/${id}`);
    await page.getByRole('tab', { name: 'Power' }).click();
    const pf = page.locator('[data-test=power-panel] tr', { hasText: 'Power factor PF' }).locator('td').first();
    await pf.waitFor();
    // Capacitor-input rectifier model with a sinusoidal voltage (domain notes §2b, numpy): PF 0.716 for
    // 60° pulses and 0.627 for 45°; the fixture's 50° pulses lie between.
    const value = Number(await pf.textContent());
    expect(value).toBeGreaterThan(0.627);
    expect(value).toBeLessThan(0.716);
    await screenshot(page, 'capture-power');
  });

  it('compares two captures side by side', async () => {
    const agent = await signedIn(app, engineer.email, engineer.password);
    const second = (await uploadText(agent, 'inverter-modified-sine.csv', readFileSync('fixtures/waveforms/inverter-modified-sine.csv'), { projectId })).body.id;
    await waitSettled(agent, second);
    await page.goto(`${app.url}/compare?ids=${captureId},${second}`);
    const table = page.locator('[data-test=compare-table]');
    await table.waitFor();
    await expect.poll(() => table.locator('thead th').count()).toBe(3);
    expect(await table.textContent()).toMatch(/inverter-modified-sine/);
    await page.locator('[data-test=compare-waveforms] canvas').first().waitFor();
    await page.locator('[data-test=comparison-name]').fill('Square vs modified sine');
    await page.locator('[data-test=comparison-save]').click();
    await page.waitForURL(/\/comparisons\/\d+$/);
    await page.reload();
    await page.getByRole('heading', { name: 'Square vs modified sine' }).waitFor();
    await page.locator('[data-test=compare-waveforms] canvas').first().waitFor();
    await screenshot(page, 'compare');
  });
});
