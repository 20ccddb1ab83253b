import path from 'node:path';
import type { Page } from 'playwright-core';

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: string[];
}

const AXE_PATH = path.resolve('node_modules/axe-core/axe.min.js');
// Served as if from the app's own origin, so the page's Content-Security-Policy (script-src 'self') stays on.
const AXE_URL = '/__test__/axe.min.js';
const routed = new WeakSet<Page>();

/**
 * axe-core's serious and critical violations on the page as it is now, one line each with the first
 * elements at fault; an empty list when there are none.
 */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  if (!routed.has(page)) {
    await page.route(`**${AXE_URL}`, (r) => r.fulfill({ path: AXE_PATH, contentType: 'text/javascript' }));
    routed.add(page);
  }
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ url: AXE_URL });
  // Colours are judged as they settle: mid-way through a dialog's fade-in they are still mixed with the page.
  await page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running' || a.effect?.getTiming().iterations === Infinity));
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: string[]; failureSummary?: string }[] }[] }> } }).axe;
    const r = await axe.run(document, { resultTypes: ['violations'] });
    // The first line of axe's summary names the measured values (colours, ratio) that failed.
    const why = (n: { failureSummary?: string }) => (n.failureSummary?.split('\n')[1]?.trim() ?? '').slice(0, 160);
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => `${n.target.join(' ')} ${why(n)}`.trim()) }));
  });
  return (violations as AxeViolation[])
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.slice(0, 4).join(' | ')}${v.nodes.length > 4 ? ` and ${v.nodes.length - 4} more` : ''}`);
}
