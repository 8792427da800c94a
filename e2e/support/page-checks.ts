import AxeBuilder from '@axe-core/playwright';
import { expect, type Page, type TestInfo } from '@playwright/test';

export const phone = { width: 390, height: 844 } as const;
export const tablet = { width: 768, height: 1024 } as const;
export const desktop = { width: 1440, height: 900 } as const;
type Size = { width: number; height: number };

/** WCAG 2.0 and 2.1, levels A and AA. */
const wcagTags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

/** axe over the whole page; a serious or critical violation fails with its rule, help and the nodes it found. */
export async function expectNoSeriousAxeViolations(page: Page, where: string): Promise<string[]> {
  // Only violations come back: passes and incomplete results cost more to gather than the whole check on a busy machine.
  const result = await new AxeBuilder({ page }).withTags(wcagTags).options({ resultTypes: ['violations'] }).analyze();
  const bad = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  const report = bad
    .map((v) => {
      const nodes = v.nodes.slice(0, 8).map((n) => `    ${n.target.join(' ')}\n      ${(n.failureSummary ?? '').replace(/\n/g, '\n      ')}`);
      const more = v.nodes.length > 8 ? `\n    … and ${v.nodes.length - 8} more` : '';
      return `  ${v.id} (${v.impact}, ${v.nodes.length} nodes): ${v.help}\n${nodes.join('\n')}${more}`;
    })
    .join('\n');
  expect.soft(bad.length, `axe on ${where}:\n${report}`).toBe(0);
  return bad.map((v) => v.id);
}

/** Waits until the browser has laid the page out at its new size (two frames), without a fixed sleep. */
export async function settle(page: Page): Promise<void> {
  await page.evaluate(() => new Promise<void>((done) => requestAnimationFrame(() => requestAnimationFrame(() => done()))));
}

export async function resize(page: Page, size: Size): Promise<void> {
  await page.setViewportSize(size);
  await settle(page);
}

/** The page never scrolls sideways: nothing is wider than the window. */
export async function expectNoSidewaysScroll(page: Page, where: string): Promise<void> {
  const { scrollWidth, innerWidth, widest } = await page.evaluate(() => {
    const w = window.innerWidth;
    // Name the outermost element that reaches past the window, so a failure points at the culprit.
    const over = [...document.querySelectorAll<HTMLElement>('body *')].filter((e) => e.getBoundingClientRect().right > w + 0.5);
    const outer = over.filter((e) => !over.some((o) => o !== e && o.contains(e)));
    const describe = (e: HTMLElement) => `${e.tagName.toLowerCase()}${e.id ? `#${e.id}` : ''}${e.className && typeof e.className === 'string' ? `.${e.className.trim().split(/\s+/).join('.')}` : ''} (right ${Math.round(e.getBoundingClientRect().right)})`;
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth: w, widest: outer.slice(0, 5).map(describe) };
  });
  expect.soft(scrollWidth, `${where} is ${scrollWidth} px wide in a ${innerWidth} px window; too wide: ${widest.join(', ')}`).toBeLessThanOrEqual(innerWidth);
}

export async function attachScreenshot(page: Page, testInfo: TestInfo, name: string, size: Size): Promise<void> {
  const body = await page.screenshot({ fullPage: true, animations: 'disabled', path: testInfo.outputPath(`${name}-${size.width}x${size.height}.png`) });
  await testInfo.attach(`${name} ${size.width}×${size.height}`, { body, contentType: 'image/png' });
}

/**
 * Every verdict chip says its verdict in words, with an icon as a second carrier, so colour is never the only sign;
 * `atLeast` is how many the page must show where a verdict belongs.
 */
export async function expectVerdictsInWords(page: Page, where: string, atLeast: number): Promise<void> {
  const chips = page.locator('[data-verdict]:visible');
  expect(await chips.count(), `${where} shows its verdicts`).toBeGreaterThanOrEqual(atLeast);
  for (const chip of await chips.all()) {
    const verdict = await chip.getAttribute('data-verdict');
    await expect.soft(chip, `${where}: the ${verdict} chip says it in words`).toHaveText(/[A-Za-z]{2,}/);
    await expect.soft(chip.locator('.p-tag-icon'), `${where}: the ${verdict} chip has an icon beside its words`).toHaveCount(1);
  }
}
