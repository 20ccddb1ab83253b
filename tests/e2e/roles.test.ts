import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { launchBrowser, screenshot, signInThroughForm } from '../helpers/browser';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let browser: Browser;
const people = {
  admin: ADMIN,
  engineer: { email: 'eng@e2e.example', password: 'engineer-pass-1' },
  viewer: { email: 'view@e2e.example', password: 'viewer-pass-1' },
};

beforeAll(async () => {
  app = await startTestServer({ SERVE_CLIENT: '1' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ ...people.engineer, name: 'Eve Engineer', role: 'engineer' });
  await admin.post('/api/users').send({ ...people.viewer, name: 'Vic Viewer', role: 'viewer' });
  await admin.post('/api/projects').send({ name: 'Pump house survey', description: 'Drive and UPS outputs' });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('signing in as each role', () => {
  it('a wrong password shows a clear message and stays on the sign-in page', async () => {
    const page = await browser.newPage();
    await page.goto(`${app.url}/`);
    await page.waitForURL(/\/sign-in/);
    await page.locator('[data-test=email]').fill(people.viewer.email);
    await page.locator('[data-test=password] input').fill('wrong-password');
    await page.locator('[data-test=sign-in]').click();
    await expect.poll(() => page.locator('[data-test=sign-in-error]').textContent()).toMatch(/not right/);
    await screenshot(page, 'sign-in-error');
    await page.close();
  });

  it('admin: reaches the projects page and the people page', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signInThroughForm(page, app.url, people.admin.email, people.admin.password);
    await page.locator('[data-test=projects-table]').getByText('Pump house survey').waitFor();
    expect(await page.locator('[data-test=new-project]').isVisible()).toBe(true);
    await screenshot(page, 'projects-admin');
    await page.locator('[data-test=nav-admin]').click();
    await page.locator('[data-test=users-table]').getByText('Vic Viewer').waitFor();
    await screenshot(page, 'admin-users');
    await page.close();
  });

  it('engineer: creates a project, but has no people page', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signInThroughForm(page, app.url, people.engineer.email, people.engineer.password);
    await page.locator('[data-test=projects-table]').waitFor();
    expect(await page.locator('[data-test=nav-admin]').count()).toBe(0);
    await page.locator('[data-test=new-project]').click();
    await page.locator('[data-test=project-name]').fill('Lighting retrofit, block C');
    await page.locator('[data-test=project-save]').click();
    await page.locator('[data-test=projects-table]').getByText('Lighting retrofit, block C').waitFor();
    // Rename and archive are offered on the engineer's own project only; the admin's stays as it is.
    const row = (name: string) => page.locator('[data-test=projects-table] tr', { hasText: name });
    expect(await row('Lighting retrofit, block C').locator('[data-test=project-rename]').count()).toBe(1);
    expect(await row('Pump house survey').locator('[data-test=project-rename]').count()).toBe(0);
    await page.goto(`${app.url}/admin/users`);
    await page.waitForURL((u) => u.pathname === '/');
    await page.close();
  });

  it('viewer: sees the projects and an empty project, with no controls to change anything', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 }, colorScheme: 'dark' });
    await signInThroughForm(page, app.url, people.viewer.email, people.viewer.password);
    await page.locator('[data-test=projects-table]').getByText('Pump house survey').click();
    await page.locator('[data-test=empty-project]').waitFor();
    expect(await page.locator('[data-test=nav-admin]').count()).toBe(0);
    await screenshot(page, 'project-viewer-dark');
    await page.goto(`${app.url}/`);
    await page.locator('[data-test=projects-table]').waitFor();
    expect(await page.locator('[data-test=new-project]').count()).toBe(0);
    await page.locator('[data-test=sign-out]').click();
    await page.waitForURL(/\/sign-in/);
    await page.close();
  });
});
