/**
 * Every page of Crestline on a phone (390 × 844), a tablet (768 × 1024) and a desktop in dark mode: it
 * fits the width (nothing scrolls sideways but boxes meant to) and axe-core finds nothing serious or
 * critical. Screenshots land in test-results/screenshots/<screen>-<page>.png for a person to look at.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { seriousAxeViolations } from '../helpers/axe';
import { launchBrowser, screenshot } from '../helpers/browser';
import { sidewaysOverflow } from '../helpers/layout';
import { DESKTOP_DARK, onScreen, PHONE, seedScreens, TABLET, type Screen } from '../helpers/screens';
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

interface PageCheck {
  name: string;
  path: string;
  /** What shows that the page has loaded. */
  ready: string;
  /** A tab to open first, and what shows that it has. */
  tab?: { name: string; ready: string };
}

const workspacePages = (): PageCheck[] => [
  { name: 'projects', path: '/', ready: '[data-test=projects-table] tbody tr' },
  { name: 'project', path: `/projects/${ids.project}`, ready: '[data-test=capture-link]' },
  { name: 'capture', path: `/captures/${ids.square}`, ready: '[data-test=waveform] canvas' },
  { name: 'project-members', path: `/projects/${ids.membersProject}`, ready: '[data-test=members-table]' },
  { name: 'capture-meters', path: `/captures/${ids.square}`, ready: '[data-test=waveform] canvas', tab: { name: 'Meter readings', ready: '[data-test=meter-time]' } },
  { name: 'capture-harmonics', path: `/captures/${ids.square}`, ready: '[data-test=waveform] canvas', tab: { name: 'Harmonics', ready: '[data-test=limit-check]' } },
  { name: 'capture-three-phase', path: `/captures/${ids.threePhase}`, ready: '[data-test=waveform] canvas', tab: { name: 'Three-phase', ready: '[data-test=system-view]' } },
  { name: 'capture-power', path: `/captures/${ids.rectifier}`, ready: '[data-test=waveform] canvas', tab: { name: 'Power', ready: '[data-test=power-panel] table' } },
  { name: 'capture-marks', path: `/captures/${ids.overrange}`, ready: '[data-test=waveform] canvas', tab: { name: 'Annotations', ready: '[data-test=annotation-list]' } },
  { name: 'capture-file', path: `/captures/${ids.square}`, ready: '[data-test=waveform] canvas', tab: { name: 'File', ready: '[data-test=capture-metadata]' } },
  { name: 'compare', path: `/compare?ids=${ids.square},${ids.modified}`, ready: '[data-test=compare-waveforms] canvas' },
  { name: 'comparison', path: `/comparisons/${ids.comparison}`, ready: '[data-test=compare-waveforms] canvas' },
  { name: 'admin-users', path: '/admin/users', ready: '[data-test=all-tokens-table]' },
  { name: 'admin-mail', path: '/admin/mail', ready: '[data-test=mail-table]' },
  { name: 'account', path: '/account', ready: '[data-test=sessions-table] tbody tr' },
  { name: 'help', path: '/help', ready: 'h1' },
  { name: 'automate-uploads', path: '/help/automate-uploads', ready: '[data-test=automation-script]' },
  { name: 'not-found', path: '/no-such-page', ready: 'h1' },
];
const publicPages = (): PageCheck[] => [
  { name: 'sign-in', path: '/sign-in', ready: '[data-test=sign-in-form]' },
  { name: 'reset-password', path: '/reset-password', ready: 'form' },
  { name: 'set-password', path: '/set-password?token=not-a-real-token-but-long-enough', ready: 'form' },
  { name: 'shared', path: `/shared/${ids.shareToken}`, ready: '[data-test=waveform] canvas' },
];

/** Opens a page, waits for it, and lists what it does wrong on this screen (nothing, we hope). */
async function problems(p: Page, screen: Screen, pg: PageCheck): Promise<string[]> {
  await p.goto(`${app.url}${pg.path}`);
  await p.locator(pg.ready).first().waitFor();
  if (pg.tab) {
    await p.getByRole('tab', { name: pg.tab.name }).click();
    await p.locator(pg.tab.ready).first().waitFor();
  }
  await screenshot(p, `${screen.name}-${pg.name}`);
  const overflow = await sidewaysOverflow(p);
  return [...(overflow ? [`${pg.name} scrolls sideways by ${overflow} px`] : []), ...(await seriousAxeViolations(p)).map((v) => `${pg.name}: ${v}`)];
}

describe.each([PHONE, TABLET, DESKTOP_DARK])('every page on a $name screen, $width × $height', (screen) => {
  const s = onScreen(() => browser, () => app, screen);

  it('the workspace fits the width and passes axe', async () => {
    const found: string[] = [];
    for (const pg of workspacePages()) found.push(...(await problems(s.page, screen, pg)));
    expect(found).toEqual([]);
  }, 240_000);

  it('the public pages fit the width and pass axe', async () => {
    const found: string[] = [];
    for (const pg of publicPages()) found.push(...(await problems(s.guest, screen, pg)));
    expect(found).toEqual([]);
  }, 60_000);
});

describe('dialogs on a phone', () => {
  const s = onScreen(() => browser, () => app, PHONE);

  it('share, mark, report and new project fit the screen and pass axe', async () => {
    const { page } = s;
    const found: string[] = [];
    const dialogProblems = async (name: string) => {
      const dialog = page.getByRole('dialog');
      await dialog.waitFor();
      const box = (await dialog.boundingBox())!;
      if (box.x < 0 || box.x + box.width > PHONE.width) found.push(`${name} dialog is ${box.width} px wide at x = ${box.x}`);
      found.push(...(await seriousAxeViolations(page)).map((v) => `${name}: ${v}`));
      await screenshot(page, `phone-dialog-${name}`);
      await page.keyboard.press('Escape');
      await dialog.waitFor({ state: 'detached' });
    };
    await page.goto(`${app.url}/captures/${ids.square}`);
    await page.locator('[data-test=waveform] canvas').first().waitFor();
    await page.locator('[data-test=share-open]').click();
    await dialogProblems('share');
    await page.locator('[data-test=mark-view]').click();
    await dialogProblems('mark');
    await page.locator('[data-test=report-open]').click();
    await dialogProblems('report');
    await page.goto(`${app.url}/`);
    await page.locator('[data-test=new-project]').click();
    await dialogProblems('project');
    expect(found).toEqual([]);
  });
});
