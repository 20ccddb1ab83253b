import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

/** Debian's chromium, headless, with nothing that reaches outside this machine. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

const shots = path.resolve('test-results/screenshots');

/** Saves a full-page screenshot under test-results/screenshots for a person to look at. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(shots, { recursive: true });
  await page.screenshot({ path: path.join(shots, `${name}.png`), fullPage: true });
}

export async function signInThroughForm(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.locator('[data-test=email]').fill(email);
  await page.locator('[data-test=password] input').fill(password);
  await page.locator('[data-test=sign-in]').click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}
