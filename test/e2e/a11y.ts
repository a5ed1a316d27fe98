/** Accessibility check with axe-core (Deque, axe-core 4.14, WCAG 2.x A/AA rules) injected into the page. */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

export interface AxeFinding {
  id: string;
  impact: string | null;
  help: string;
  targets: string[];
}

/** Serious and critical violations on the page as it stands (WCAG 2.0/2.1 A and AA rule tags). */
export async function seriousViolations(page: Page): Promise<AxeFinding[]> {
  await page.addScriptTag({ content: axeSource });
  const results = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[] }> } }).axe;
    const r = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) }));
  });
  return results.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}
