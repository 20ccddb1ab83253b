/**
 * Using Crestline on a phone or a tablet, and without a pointer: the menu panel, the safety line, touch
 * pan and zoom on the waveform, span figures across an overrange burst, and the charts by keyboard.
 * Expected values: an invented 325 V peak, 50 Hz sine (true RMS 325/√2 = 229.8 V, standard calculus)
 * and the ±230 V square-wave fixture.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { seriousAxeViolations } from '../helpers/axe';
import { launchBrowser, screenshot } from '../helpers/browser';
import { DESKTOP_DARK, onScreen, PHONE, seedScreens, TABLET } from '../helpers/screens';
import { resetDatabase, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
let ids: Awaited<ReturnType<typeof seedScreens>>;

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1', RUN_WORKER: '1' });
  await resetDatabase(app);
  ids = await seedScreens(app);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe.each([PHONE, TABLET])('on a $name, $width × $height', (screen) => {
  const s = onScreen(() => browser, () => app, screen);

  it('the navigation folds into a menu button whose panel navigates, closes, and gives the focus back', async () => {
    const { page } = s;
    await page.goto(`${app.url}/`);
    await page.locator('[data-test=projects-table]').waitFor();
    expect(await page.locator('.shell-nav').isVisible()).toBe(false);
    const menu = page.locator('[data-test=menu-button]');
    expect(await menu.getAttribute('aria-expanded')).toBe('false');
    await menu.click();
    const drawer = page.locator('[data-test=nav-drawer]');
    await drawer.waitFor();
    expect(await menu.getAttribute('aria-expanded')).toBe('true');
    // Wait for the panel to finish sliding in before the picture.
    await expect.poll(async () => (await drawer.boundingBox())?.x).toBe(0);
    await screenshot(page, `${screen.name}-menu-open`);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await drawer.getByRole('link', { name: 'Compare' }).click();
    await page.waitForURL(/\/compare$/);
    await drawer.waitFor({ state: 'detached' });
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('menu-button');
    // Escape closes it as well.
    await menu.click();
    await drawer.waitFor();
    await page.keyboard.press('Escape');
    await drawer.waitFor({ state: 'detached' });
  });

  it('the safety line stays in view on pages with mains figures, and opens in place to the full cautions', async () => {
    for (const [p, path, name] of [[s.page, `/captures/${ids.square}`, 'capture'], [s.guest, `/shared/${ids.shareToken}`, 'shared']] as const) {
      await p.goto(`${app.url}${path}`);
      await p.locator('[data-test=waveform] canvas').first().waitFor();
      const banner = p.locator('[data-test=safety-banner]').last();
      for (const y of [0, 100_000]) {
        await p.evaluate((top) => window.scrollTo(0, top), y);
        const box = (await banner.boundingBox())!;
        expect(box.y, `${name} scrolled to ${y}`).toBeGreaterThanOrEqual(0);
        expect(box.y + box.height).toBeLessThanOrEqual(screen.height + 0.5);
        // One line of 0.8rem text with its padding: well under two lines.
        expect(box.height).toBeLessThan(40);
      }
      const toggle = banner.locator('[data-test=safety-toggle]');
      expect(await toggle.getAttribute('aria-expanded')).toBe('false');
      await toggle.click();
      expect(await toggle.getAttribute('aria-expanded')).toBe('true');
      const full = await banner.locator('[data-test=safety-full]').textContent();
      expect(full).toMatch(/qualified persons/);
      expect(full).toMatch(/measurement category/);
      expect(full).toMatch(/local codes/);
      await screenshot(p, `${screen.name}-safety-open-${name}`);
      expect(await seriousAxeViolations(p)).toEqual([]);
    }
  });

  it('the waveform pans with one finger and zooms with two, asking the server for the new span', async () => {
    const { page } = s;
    await page.goto(`${app.url}/captures/${ids.square}`);
    const over = page.locator('[data-test=waveform] .u-over').first();
    await over.waitFor();
    await over.scrollIntoViewIfNeeded();
    const box = (await over.boundingBox())!;
    const cdp = await s.context.newCDPSession(page);
    const y = box.y + box.height / 2;
    const mid = box.x + box.width / 2;
    const touch = (type: 'touchStart' | 'touchMove' | 'touchEnd', xs: number[]) => cdp.send('Input.dispatchTouchEvent', { type, touchPoints: xs.map((x, id) => ({ x, y, id })) });
    const span = (url: string) => {
      const q = new URL(url).searchParams;
      return [Number(q.get('fromS')), Number(q.get('toS'))];
    };

    // Two fingers moving apart to three times their distance: about a third of the 0.2 s record is left.
    let asked = page.waitForRequest((r) => r.url().includes('/samples?'));
    await touch('touchStart', [mid - 20, mid + 20]);
    for (let k = 1; k <= 5; k++) await touch('touchMove', [mid - 20 - 8 * k, mid + 20 + 8 * k]);
    await touch('touchEnd', []);
    const [from, to] = span((await asked).url());
    expect(to - from).toBeGreaterThan(0.05);
    expect(to - from).toBeLessThan(0.09);

    // One finger dragged from right to left moves the view later in time, by the same width.
    asked = page.waitForRequest((r) => r.url().includes('/samples?'));
    await touch('touchStart', [mid + 60]);
    for (let k = 1; k <= 5; k++) await touch('touchMove', [mid + 60 - 24 * k]);
    await touch('touchEnd', []);
    const [from2, to2] = span((await asked).url());
    expect(from2).toBeGreaterThan(from);
    expect(to2 - from2).toBeCloseTo(to - from, 6);
    await cdp.detach();
  });
});

describe('on a phone, a span across an overrange burst', () => {
  const s = onScreen(() => browser, () => app, PHONE);

  it("shows the figures of its longest valid stretch, or the engine's reason for none, worked out in a Web Worker", async () => {
    const { page } = s;
    const workers: string[] = [];
    page.on('worker', (w) => workers.push(w.url()));
    await page.goto(`${app.url}/captures/${ids.overrange}`);
    await page.locator('[data-test=waveform] canvas').first().waitFor();
    const measure = async (from: string, to: string) => {
      await page.locator('#span-from').fill(from);
      await page.locator('#span-to').fill(to);
      await page.locator('[data-test=span-measure-typed]').click();
    };

    // 0 to 0.2 s: the stretch before the burst, samples 0 to 1199, is 6 whole cycles; joined to the
    // samples after it, the span would hold 8 cycles and a 180° phase jump (1500 is 7.5 periods in).
    await measure('0', '0.2');
    const box = page.locator('[data-test=span-figures]');
    await box.locator('[data-test=warning-invalidSamples]').waitFor();
    expect(await box.locator('[data-test=figure-window] td').first().textContent()).toMatch(/^6 whole cycles/);
    expect(await box.locator('[data-test=figure-rms] td').first().textContent()).toBe('229.8 V');

    // 0.1 to 0.16 s: half of it overrange, and no valid stretch of half its length.
    await measure('0.1', '0.16');
    const reason = page.locator('[data-test=span-reason]');
    await reason.waitFor();
    expect(await reason.textContent()).toMatch(/Mains: \d+ of \d+ samples are empty or overrange, and the longest valid stretch \(\d+ samples\) is less than half the record/);
    expect(await box.locator('[data-test=figures-table]').count()).toBe(0);
    expect(workers.some((u) => /analysis\.worker/.test(u))).toBe(true);
    await screenshot(page, 'phone-span-refused');
  });
});

describe('by keyboard, on a desktop', () => {
  const s = onScreen(() => browser, () => app, DESKTOP_DARK);

  it('the charts read out the values under the cursor, and the span in view can be measured', async () => {
    const { page } = s;
    await page.goto(`${app.url}/captures/${ids.square}`);
    await page.locator('[data-test=waveform] canvas').first().waitFor();
    await page.locator('[data-test=waveform]').focus();
    await page.keyboard.press('Shift+ArrowRight');
    await expect.poll(() => page.locator('[data-test=waveform-readout]').textContent()).toMatch(/^t \(s\) [\d.e-]+\. Out \(V\): -?\d/);
    expect(await page.locator('[data-test=waveform-readout]').getAttribute('aria-live')).toBe('polite');
    // Zoom in on the middle half with +, then measure what is in view without a pointer.
    await page.keyboard.press('+');
    await page.locator('[data-test=measure-view]').focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => page.locator('[data-test=span-figures]').textContent()).toMatch(/0\.0500000 s to 0\.150000 s/);
    await page.getByRole('tab', { name: 'Harmonics' }).click();
    await page.locator('[data-test=spectrum] canvas').first().waitFor();
    await page.locator('[data-test=spectrum]').focus();
    await page.keyboard.press('ArrowRight');
    // The first order of any periodic record is its fundamental: 100 % of itself.
    await expect.poll(() => page.locator('[data-test=spectrum-readout]').textContent()).toBe('Order 1. Out: 100.00 %');
  });
});
