import type { Locator, Page } from 'playwright-core';

/**
 * Locators and moves for the Turnover checklist and Rooms now in the browser, waiting on what
 * the screen shows (never on time).
 */

/**
 * A step's row on the checklist, by step key.
 * @example await stepRow(page, 'table').locator('.ticked').waitFor();
 */
export function stepRow(page: Page, key: string): Locator {
  return page.locator(`tw-checklist-step-row[data-step="${key}"]`);
}

/**
 * A room's card on Rooms now, by room name.
 * @example await boardCard(page, 'MR 1', 'ready').waitFor();
 */
export function boardCard(page: Page, room: string, state?: string): Locator {
  const card = page.locator('tw-board-card').filter({ has: page.getByRole('heading', { name: new RegExp(`^${room}\\b`) }) });
  return state ? card.and(page.locator(`tw-board-card[data-state="${state}"]`)) : card;
}

/**
 * Ticks a step with the Done button (picking `product` first, by its label) and waits until the
 * row shows it done. With `earlyReason` the step is expected to be still blocked by a wet
 * surface: the button reads "Tick early", asks for the reason, then sends it.
 * @example await tickStep(page, 'bore', { product: /Sporicidal/ });
 */
export async function tickStep(page: Page, key: string, options: { product?: RegExp; earlyReason?: string } = {}): Promise<void> {
  const row = stepRow(page, key);
  const button = row.locator('button.tick');
  if (options.product) {
    const select = row.getByLabel('Product');
    const label = (await select.locator('option').allTextContents()).find((text) => options.product!.test(text));
    if (!label) throw new Error(`no product matching ${options.product} on step ${key}`);
    await select.selectOption({ label });
  }
  if (options.earlyReason) {
    await button.filter({ hasText: 'Tick early' }).click();
    await row.getByLabel('Why tick it before the surface is dry?').fill(options.earlyReason);
    await button.click();
  } else {
    await button.filter({ hasText: 'Done' }).click();
  }
  await row.locator('.ticked').waitFor();
}

/**
 * Opens a screen and waits until its day stream is live, so no change is missed.
 * @example await openLive(page, `${baseUrl}/rooms-now`);
 */
export async function openLive(page: Page, url: string): Promise<void> {
  await page.goto(url);
  await page.locator('tw-live-indicator[data-status="live"]').waitFor();
}
