import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';

const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

/**
 * axe-core's violations of impact "serious" or "critical" on the page, one line each. axe is
 * loaded through the DevTools protocol (page.evaluate), which the page's CSP does not govern,
 * so the page itself still runs under its strict policy.
 */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  await page.evaluate(AXE_SOURCE);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(context: Document, options: object): Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[] }> } }).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')) }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.impact} ${v.id}: ${v.help} (${v.targets.join(', ')})`);
}

/** What the keyboard reaches: every control's label and whether its focus shows. */
export interface KeyboardReport {
  /** Visible controls Tab never reached. */
  unreachable: string[];
  /** Controls that showed no outline or shadow when focused. */
  invisibleFocus: string[];
  /** Controls with no accessible name. */
  unlabelled: string[];
  reached: number;
}

/**
 * Presses Tab through the page (from the top) and reports the controls the keyboard does not
 * reach, those whose focus is not visible, and those without a name a screen reader could say.
 */
export async function keyboardReport(page: Page, maxTabs = 250): Promise<KeyboardReport> {
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    for (const el of document.querySelectorAll<HTMLElement>('[data-tab-reached]')) delete el.dataset.tabReached;
    window.scrollTo(0, 0);
  });
  const describe = () => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return null;
    const style = getComputedStyle(el);
    const outline = style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0;
    const shadow = style.boxShadow !== 'none';
    const labelled = el.getAttribute('aria-label') || (el.getAttribute('aria-labelledby') && document.getElementById(el.getAttribute('aria-labelledby')!)?.textContent?.trim()) || ((el as HTMLInputElement).labels?.[0]?.textContent?.trim()) || el.textContent?.trim() || el.getAttribute('title') || ((el as HTMLInputElement).type === 'submit' && (el as HTMLInputElement).value);
    const key = `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}${el.getAttribute('name') ? `[name=${el.getAttribute('name')}]` : ''}${el.getAttribute('href') ? `[href=${el.getAttribute('href')}]` : ''}:${(labelled || '').slice(0, 30)}`;
    const already = el.dataset.tabReached === '1';
    el.dataset.tabReached = '1';
    return { key, already, visible: outline || shadow, labelled: Boolean(labelled) };
  };
  const invisibleFocus = new Set<string>();
  const unlabelled = new Set<string>();
  let reached = 0;
  for (let i = 0; i < maxTabs; i++) {
    await page.keyboard.press('Tab');
    const info = await page.evaluate(describe);
    if (!info) continue;
    if (info.already) break; // wrapped round to the start
    reached++;
    if (!info.visible) invisibleFocus.add(info.key);
    if (!info.labelled) unlabelled.add(info.key);
  }
  const unreachable = await page.evaluate(() =>
    [...document.querySelectorAll<HTMLElement>('a[href], button, input:not([type=hidden]), select, textarea, [tabindex]:not([tabindex="-1"])')]
      .filter((el) => !el.dataset.tabReached && !(el as HTMLInputElement).disabled && el.getClientRects().length > 0 && getComputedStyle(el).visibility !== 'hidden')
      .map((el) => `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}${el.getAttribute('href') ? `[href=${el.getAttribute('href')}]` : ''}`),
  );
  return { unreachable, invisibleFocus: [...invisibleFocus], unlabelled: [...unlabelled], reached };
}
