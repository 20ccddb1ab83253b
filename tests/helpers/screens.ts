import { readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import type { RunningServer } from '../../server/server';
import { signInThroughForm } from './browser';
import { uploadText, waitSettled } from './captures';
import { ADMIN, signedIn } from './testServer';

/** A screen to test on; touch screens get a phone's emulation (meta viewport, touch events). */
export interface Screen {
  name: string;
  width: number;
  height: number;
  touch: boolean;
  dark: boolean;
}
export const PHONE: Screen = { name: 'phone', width: 390, height: 844, touch: true, dark: false };
export const TABLET: Screen = { name: 'tablet', width: 768, height: 1024, touch: true, dark: false };
/** The desktop in dark mode: the other colour scheme and the side navigation. */
export const DESKTOP_DARK: Screen = { name: 'desktop-dark', width: 1280, height: 800, touch: false, dark: true };

/**
 * An invented 230 V (325 V peak), 50 Hz record of 0.4 s at 10 kS/s, 200 samples a cycle, whose samples
 * 1200 to 1499 are overrange ("OL"): the record as a whole is analysable (its longest valid stretch is
 * more than half of it), but a span around the burst is not.
 */
export function overrangeCsv(): string {
  const rows = Array.from({ length: 4000 }, (_, i) => `${(i / 10_000).toFixed(5)},${i >= 1200 && i < 1500 ? 'OL' : (325 * Math.sin(2 * Math.PI * 50 * (i / 10_000))).toFixed(3)}`);
  return ['Time (s),Mains (V)', ...rows].join('\n') + '\n';
}

/** A project with the square-wave, modified-sine, rectifier and overrange captures, a saved comparison and a share link of the rectifier. */
export async function seedScreens(app: RunningServer) {
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  const project: number = (await admin.post('/api/projects').send({ name: 'Switchboard survey, plant room 2', description: 'Invented captures for screen checks' })).body.project.id;
  const upload = async (name: string, text: string | Buffer) => {
    const id: number = (await uploadText(admin, name, text, { projectId: project })).body.id;
    await waitSettled(admin, id);
    return id;
  };
  const fixture = (file: string) => upload(file, readFileSync(`fixtures/waveforms/${file}`));
  const square = await fixture('inverter-square-wave.csv');
  const modified = await fixture('inverter-modified-sine.csv');
  const rectifier = await fixture('rectifier-current.csv');
  const overrange = await upload('overrange-burst.csv', overrangeCsv());
  const threePhase = await fixture('switchboard-three-phase-motor-start.csv');
  const membersProject: number = (await admin.post('/api/projects').send({ name: 'Substation 4, members only', visibility: 'members' })).body.project.id;
  const comparison: number = (await admin.post('/api/comparisons').send({ name: 'Square vs modified sine', captureIds: [square, modified] })).body.id;
  const shareToken: string = (await admin.post(`/api/captures/${rectifier}/shares`).send({ expiresInDays: 7 })).body.token;
  return { project, square, modified, rectifier, overrange, threePhase, membersProject, comparison, shareToken };
}

/**
 * For the describe block it is called in: a page signed in as the admin and a guest page without an
 * account, each in a browser context of the given screen.
 */
export function onScreen(browser: () => Browser, app: () => RunningServer, screen: Screen) {
  const s = {} as { page: Page; guest: Page; context: BrowserContext };
  let guestContext: BrowserContext;
  beforeAll(async () => {
    const options = { viewport: { width: screen.width, height: screen.height }, isMobile: screen.touch, hasTouch: screen.touch, colorScheme: screen.dark ? ('dark' as const) : ('light' as const) };
    s.context = await browser().newContext(options);
    guestContext = await browser().newContext(options);
    s.page = await s.context.newPage();
    s.guest = await guestContext.newPage();
    await signInThroughForm(s.page, app().url, ADMIN.email, ADMIN.password);
  });
  afterAll(async () => {
    await s.context?.close();
    await guestContext?.close();
  });
  return s;
}
