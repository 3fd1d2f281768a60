import type { Locator, Page } from 'playwright-core';
import type { Verdict } from '../../../shared/turnover/model';

// twoFrames and measures run in the page; the server tsconfig has no DOM lib (see in-page.ts).
declare function requestAnimationFrame(callback: () => void): number;

/**
 * Finding things on the Day plan's timeline the way a user does (by accession, as every block and
 * gap marker names it in its accessible label) and moving them with the real mouse.
 */

/**
 * The exam block of `accession`; its label reads "MR 1, 08:00–08:30, TL-1, …", so the commas
 * keep `TL-1` from also matching `TL-10`.
 * @example await examBlock(page, 'TL-2').focus();
 */
export function examBlock(page: Page, accession: string): Locator {
  return page.locator(`.tw-exam-block[aria-label*=", ${accession}, "]`);
}

/**
 * The marker of the gap before `accession` ("Turnover before TL-2: short by 10 min, needs 20, has 10"),
 * only while its verdict is `verdict` when one is given: waiting on it waits for that verdict.
 * @example await gapMarker(page, 'TL-2', 'fits').waitFor();
 */
export function gapMarker(page: Page, toAccession: string, verdict?: Verdict): Locator {
  const host = verdict ? `tw-gap-marker[data-verdict="${verdict}"]` : 'tw-gap-marker';
  return page.locator(`${host} button.marker[aria-label^="Turnover before ${toAccession}:"]`);
}

/**
 * How many pixels a minute is at the current zoom, read off a block of known length.
 * @example const px = await pxPerMinute(examBlock(page, 'TL-2'), 30);
 */
export async function pxPerMinute(block: Locator, durationMinutes: number): Promise<number> {
  const box = await block.boundingBox();
  if (!box) throw new Error('the block is not on screen');
  return box.width / durationMinutes;
}

/**
 * Presses the mouse on `block`, moves it `dx` pixels to the right in `steps` pointer moves and
 * releases it: the same pointer events a person's drag makes.
 * @example await dragBy(page, examBlock(page, 'TL-2'), 20.4 * px);
 */
export async function dragBy(page: Page, block: Locator, dx: number, steps = 12): Promise<void> {
  await block.scrollIntoViewIfNeeded();
  const box = await block.boundingBox();
  if (!box) throw new Error('the block is not on screen');
  const x = box.x + box.width / 2;
  const y = box.y + box.height / 2;
  await page.mouse.move(x, y);
  await page.mouse.down();
  await page.mouse.move(x + dx, y, { steps });
  await page.mouse.up();
}

/**
 * Resolves after the page has painted twice more: long enough for a pointer handler that acts
 * on the next animation frame to have acted. For checking that something did *not* happen.
 * @example await page.evaluate(twoFrames);
 */
export function twoFrames(): Promise<void> {
  return new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(() => resolve())));
}

/**
 * Durations (ms) of the `performance.measure` entries called `name` on the page, oldest first.
 * @example const frames = await page.evaluate(measures, 'tw-drag-frame');
 */
export function measures(name: string): { startTime: number; duration: number }[] {
  return performance.getEntriesByName(name, 'measure').map((entry) => ({ startTime: entry.startTime, duration: entry.duration }));
}
