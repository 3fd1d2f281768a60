import fs from 'node:fs';
import type { BrowserContext, Page } from 'playwright-core';

/** axe-core's browser build from node_modules (never a CDN). */
const AXE_SOURCE = fs.readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

/** The rule sets the product promises to meet: WCAG 2.0, 2.1 and 2.2 at levels A and AA. */
export const WCAG_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** One failed rule on one screen, with the elements that fail it. */
export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  helpUrl: string;
  targets: string[];
  /** axe's own words on what to fix, for the first failing element. */
  summary: string;
}

/**
 * Makes axe-core available in every page the context opens. An init script (not a script tag)
 * runs before the app and is not subject to the page's Content-Security-Policy, which refuses
 * inline scripts, so the CSP under test stays as it ships.
 * @example await installAxe(context);
 */
export async function installAxe(context: BrowserContext): Promise<void> {
  await context.addInitScript({ content: AXE_SOURCE });
}

// Runs inside the page. No DOM lib in the test tsconfig, hence the loose typing; no named inner
// functions (see in-page.ts on tsx's keepNames).
declare const axe: {
  run(context: unknown, options: unknown): Promise<{
    violations: {
      id: string;
      impact?: string | null;
      help: string;
      helpUrl: string;
      nodes: { target: unknown[]; failureSummary?: string }[];
    }[];
  }>;
};
declare const document: {
  getAnimations(): { finished: Promise<unknown>; effect: { getComputedTiming(): { endTime?: number | string } } | null }[];
};
declare function requestAnimationFrame(callback: () => void): number;

async function runAxeInPage(tags: string[]): Promise<AxeViolation[]> {
  // A dialog or panel still fading in is half transparent, and axe would measure its blended
  // colours: wait two frames (an opening class lands on the next one), then for every animation
  // that ends (spinners and other endless ones excepted).
  for (let frame = 0; frame < 2; frame++) await new Promise<void>((resolve) => requestAnimationFrame(() => resolve()));
  await Promise.all(
    document
      .getAnimations()
      .filter((animation) => Number.isFinite(Number(animation.effect?.getComputedTiming().endTime)))
      .map((animation) => animation.finished.catch(() => undefined)),
  );
  const result = await axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
  return result.violations.map((violation) => ({
    id: violation.id,
    impact: violation.impact ?? null,
    help: violation.help,
    helpUrl: violation.helpUrl,
    targets: violation.nodes.map((node) => node.target.map(String).join(' ')),
    summary: violation.nodes[0]?.failureSummary ?? '',
  }));
}

/**
 * The WCAG 2.2 AA violations axe finds on the page once its running animations have ended.
 * @example assert.deepEqual(await axeViolations(page), []);
 */
export function axeViolations(page: Page): Promise<AxeViolation[]> {
  return page.evaluate(runAxeInPage, WCAG_AA_TAGS);
}

/** A violation as a reader fixing it wants it: rule, help, and every failing element. */
export function describeViolation(where: string, violation: AxeViolation): string {
  const targets = violation.targets.map((target) => `\n      ${target}`).join('');
  return `${where}: ${violation.id} (${violation.impact ?? 'no impact given'}): ${violation.help}${targets}\n    ${violation.summary.replace(/\n/g, '\n    ')}`;
}
