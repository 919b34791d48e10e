/// <reference lib="dom" />
/**
 * Moving through the app with the keyboard alone, as a person without a mouse does: Tab
 * and Shift+Tab to reach a control, Enter or Space to act, arrow keys in lists, typing.
 * Locators here only ask where the focus is; they never click or focus anything.
 */
import type { Locator, Page } from 'playwright-core';

/** A short description of the focused element, for failure messages. */
function describeFocus(page: Page): Promise<string> {
  return page.evaluate(() => {
    const el = document.activeElement;
    if (!el || el === document.body) return '(page body)';
    const label = el.getAttribute('aria-label') ?? (el as HTMLInputElement).labels?.[0]?.textContent ?? el.textContent ?? '';
    return `<${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}> ${label.replace(/\s+/g, ' ').trim().slice(0, 60)}`;
  });
}

/** Whether the focus is on the target or inside it. */
export async function hasFocus(target: Locator): Promise<boolean> {
  return target.evaluate((el) => el === document.activeElement || el.contains(document.activeElement));
}

/**
 * Presses Tab (or Shift+Tab) until the target has the focus. Fails with the list of stops
 * it went through when the control cannot be reached: that is a keyboard trap or a control
 * that takes no focus.
 */
export async function tabTo(page: Page, target: Locator, options: { backwards?: boolean; max?: number } = {}): Promise<void> {
  const key = options.backwards ? 'Shift+Tab' : 'Tab';
  await target.waitFor();
  const stops: string[] = [];
  for (let i = 0; i < (options.max ?? 120); i += 1) {
    if (await hasFocus(target)) return;
    await page.keyboard.press(key);
    stops.push(await describeFocus(page));
  }
  throw new Error(`${key} never reached ${target.toString()}; the focus went through:\n  ${stops.join('\n  ')}`);
}

/** Tabs to a text field, replaces what is in it and types the text. */
export async function typeInto(page: Page, field: Locator, text: string, options: { backwards?: boolean } = {}): Promise<void> {
  await tabTo(page, field, options);
  await page.keyboard.press('ControlOrMeta+A');
  await page.keyboard.press('Delete');
  await page.keyboard.type(text);
}

/**
 * Tabs to a Material select, opens it with Space, walks the options with the down arrow
 * until the wanted one is active and takes it with Enter.
 */
export async function selectByKeys(page: Page, combobox: Locator, option: RegExp, options: { backwards?: boolean } = {}): Promise<void> {
  await tabTo(page, combobox, options);
  await page.keyboard.press('Space');
  const listbox = page.getByRole('listbox');
  await listbox.waitFor();
  const active = listbox.locator('mat-option.mat-mdc-option-active');
  const activeText = async () => ((await active.count()) ? (await active.innerText()).trim() : '');
  const seen: string[] = [];
  let text = await activeText();
  for (let i = 0; i < 200; i += 1) {
    if (option.test(text)) {
      await page.keyboard.press('Enter');
      await listbox.waitFor({ state: 'detached' });
      return;
    }
    seen.push(text);
    await page.keyboard.press('ArrowDown');
    // The active option moves on the next frame; at the end of the list it stays put.
    let next = text;
    for (let wait = 0; wait < 20 && next === text; wait += 1) {
      await page.waitForTimeout(25);
      next = await activeText();
    }
    if (next === text) break;
    text = next;
  }
  throw new Error(`No option matching ${option} in ${combobox.toString()}; the arrows went through: ${seen.join(' | ')}`);
}
