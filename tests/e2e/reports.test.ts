/**
 * Reports and exports from the browser: an engineer checks a rectifier's current against IEC 61000-3-2,
 * keeps the check, downloads the PDF with their own title and every CSV and JSON file; a saved comparison
 * and a share link download their reports too. Every file is read back: the PDF with pdftotext, the CSV
 * with csv-parse. The expected verdicts follow from the fixture (see tests/api/compliance.test.ts):
 * its 3rd harmonic is about 86 % of the fundamental, over Class D's 3.4 mA/W.
 */
import { parse } from 'csv-parse/sync';
import { readFileSync } from 'node:fs';
import type { Browser, Download, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { uploadText, waitSettled } from '../helpers/captures';
import { pdfText } from '../helpers/pdf';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
let page: Page;
let rectifierId: number;
let squareId: number;
const engineer = { email: 'reports@ws.example', password: 'engineer-pass-1' };

/** Clicks something that downloads a file, and returns the file's bytes and suggested name. */
async function download(p: Page, target: Locator): Promise<{ name: string; bytes: Buffer }> {
  const [d] = await Promise.all([p.waitForEvent('download'), target.click()]) as [Download, void];
  return { name: d.suggestedFilename(), bytes: readFileSync((await d.path())!) };
}

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1', RUN_WORKER: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ ...engineer, name: 'Rhea Reporter', role: 'engineer' });
  const agent = await signedIn(app, engineer.email, engineer.password);
  rectifierId = (await uploadText(agent, 'rectifier-current.csv', readFileSync('fixtures/waveforms/rectifier-current.csv'))).body.id;
  squareId = (await uploadText(agent, 'inverter-square-wave.csv', readFileSync('fixtures/waveforms/inverter-square-wave.csv'))).body.id;
  await waitSettled(agent, rectifierId);
  await waitSettled(agent, squareId);
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  await signInThroughForm(page, app.url, engineer.email, engineer.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('reports and exports in the browser', () => {
  it('checks the current against IEC 61000-3-2 Class D, sees the limit line and verdicts, and keeps the check', async () => {
    await page.goto(`${app.url}/captures/${rectifierId}`);
    await page.getByRole('tab', { name: 'Harmonics' }).click();
    const panel = page.getByRole('tabpanel', { name: 'Harmonics' });
    await panel.getByRole('combobox').first().click();
    await page.getByRole('option', { name: /L1 \(A\)/ }).click();
    await page.locator('[data-test=limit-standard]').click();
    await page.getByRole('option', { name: 'IEC 61000-3-2 Class D' }).click();
    await page.locator('[data-test=limit-run]').click();
    await expect.poll(() => page.locator('[data-test=limit-verdict]').textContent()).toBe('Fail (indicative)');
    expect(await page.locator('[data-test=verdict-3]').textContent()).toBe('fail');
    await page.locator('[data-test=spectrum-limit-legend]').waitFor();
    await page.locator('[data-test=limit-keep]').click();
    await page.locator('[data-test=limit-check] [data-test^=kept-check-]').getByText('L1 · IEC 61000-3-2 Class D').waitFor();
    await page.locator('[data-test=spectrum]').scrollIntoViewIfNeeded();
    await screenshot(page, 'capture-limit-check');
  });

  it('downloads the PDF report with a title, summary and company of their own', async () => {
    await page.locator('[data-test=report-open]').click();
    await page.locator('[data-test=report-title]').fill('Control cabinet supply: harmonic survey');
    await page.locator('[data-test=report-summary]').fill('The cabinet supply draws narrow current pulses; its 3rd harmonic exceeds the Class D figure.');
    await page.locator('[data-test=report-company]').fill('Tidewater Commissioning Ltd (invented)');
    await screenshot(page, 'report-dialog');
    const pdf = await download(page, page.locator('[data-test=report-download]'));
    expect(pdf.name).toBe('rectifier-current-report.pdf');
    const text = pdfText(pdf.bytes);
    expect(text).toContain('Control cabinet supply: harmonic survey');
    expect(text).toContain('Tidewater Commissioning Ltd (invented)');
    expect(text).toContain('Rhea Reporter');
    expect(text).toMatch(/IEC 61000-3-2 Class D/);
    expect(text).toContain('Fail (indicative)');
    expect(text).toMatch(/qualified\s+persons/);
  });

  it('downloads figures, harmonics and samples as CSV (point and comma) and JSON', async () => {
    const links = page.locator('[data-test=export-links]');
    const figures = await download(page, links.locator('[data-test=export-figures-csv]'));
    expect((parse(figures.bytes) as string[][])[0]).toEqual(['Quantity', 'L1-N (V)', 'L1 (A)']);
    const harmonics = await download(page, links.locator('[data-test=export-harmonics-csv]'));
    expect((parse(harmonics.bytes) as string[][]).length).toBe(51);
    const samples = await download(page, links.locator('[data-test=export-samples-csv]'));
    expect((parse(samples.bytes) as string[][]).length).toBe(1 + 4000); // 10 whole cycles at 20 kS/s
    for (const kind of ['figures', 'harmonics', 'samples']) {
      const json = await download(page, links.locator(`[data-test=export-${kind}-json]`));
      expect(JSON.parse(json.bytes.toString('utf8')).name).toBe('rectifier-current');
    }
    await links.locator('[data-test=export-decimal]').getByText('Decimal comma (;)').click();
    const comma = await download(page, links.locator('[data-test=export-figures-csv]'));
    expect(comma.bytes.subarray(0, 3)).toEqual(Buffer.from([0xef, 0xbb, 0xbf]));
    const rows = parse(comma.bytes, { delimiter: ';', bom: true }) as string[][];
    expect(rows[1][1]).toMatch(/^\d+,\d+$/);
  });

  it('downloads a saved comparison’s report', async () => {
    const agent = await signedIn(app, engineer.email, engineer.password);
    const cmp = (await agent.post('/api/comparisons').send({ name: 'Supply against the square-wave inverter', captureIds: [rectifierId, squareId] })).body;
    await page.goto(`${app.url}/comparisons/${cmp.id}`);
    await page.locator('[data-test=compare-table]').waitFor();
    await page.locator('[data-test=report-open]').click();
    const pdf = await download(page, page.locator('[data-test=report-download]'));
    const text = pdfText(pdf.bytes);
    expect(text).toContain('Comparison report');
    expect(text).toContain('Supply against the square-wave inverter');
  });

  it('a share link’s visitor downloads the report without an account', async () => {
    const agent = await signedIn(app, engineer.email, engineer.password);
    const { token } = (await agent.post(`/api/captures/${squareId}/shares`).send({})).body;
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
    const visitor = await context.newPage();
    await visitor.goto(`${app.url}/shared/${token}`);
    const pdf = await download(visitor, visitor.locator(`[data-test=shared-capture-report-${squareId}]`));
    const text = pdfText(pdf.bytes);
    expect(text).toContain('Capture report: inverter-square-wave');
    expect(text).toMatch(/read-only link shared by\s+Rhea Reporter/);
    await context.close();
  });
});
