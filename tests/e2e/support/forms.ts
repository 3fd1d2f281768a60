import type { Locator, Page } from 'playwright-core';

/**
 * Picks a Material select's option and waits until its panel has gone, so the next click cannot
 * land on the closing panel (on a loaded machine the panel's exit animation outlives the click).
 * A select that resets after each pick (e.g. "Add a need") shows nothing afterwards, so waiting for
 * the shown value is the caller's (see `chosen`).
 */
export async function choose(page: Page, within: Locator | Page, label: string, option: string): Promise<void> {
  const select = within.getByRole('combobox', { name: label });
  await select.click();
  await page.getByRole('option', { name: option, exact: true }).click();
  await page.getByRole('listbox').waitFor({ state: 'detached' });
}

/** Waits until a select shows the option, as a user checks before going on. */
export async function chosen(within: Locator | Page, label: string, option: string): Promise<void> {
  await within.getByRole('combobox', { name: label }).filter({ hasText: option }).waitFor();
}

/** Clicks a dialog's submit button and waits for the dialog to close; if it stays, says what it shows (a refusal, a field's error). */
export async function submitDialog(dialog: Locator, button: string): Promise<void> {
  await dialog.getByRole('button', { name: button }).click();
  try {
    await dialog.waitFor({ state: 'detached' });
  } catch (error) {
    throw new Error(`the dialog stayed open after "${button}": ${(await dialog.innerText()).replace(/\s+/g, ' ')}`, { cause: error });
  }
}
