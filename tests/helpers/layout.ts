import type { Page } from 'playwright-core';

/**
 * How far the page reaches past the right edge of the window, in CSS pixels (0 when nothing scrolls
 * sideways): the document itself and the workspace's scrolling main area. Boxes that scroll on their own
 * (wide tables) may be wider inside; they do not count.
 */
export function sidewaysOverflow(page: Page): Promise<number> {
  return page.evaluate(() => {
    const doc = document.documentElement.scrollWidth - window.innerWidth;
    const main = document.querySelector('.shell-main');
    return Math.max(0, doc, main ? main.scrollWidth - main.clientWidth : 0);
  });
}
