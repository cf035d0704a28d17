// Browser-test helpers for the record pages: one signed-in browser context per
// demo person, and sending an event through a record's action buttons.
import { afterAll, beforeAll } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, signInAs } from './browser';

export const isoDay = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

/**
 * One Chromium for the test file (launched before its tests, closed after them)
 * and `as(email)`: a person signed in, in a browser context of their own.
 */
export function browserSessions() {
  let browser: Browser | undefined;
  const contexts: BrowserContext[] = [];
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    for (const context of contexts) await context.close().catch(() => undefined);
    await browser?.close();
  });
  return {
    async as(email: string): Promise<Page> {
      const context = await browser!.newContext({ viewport: { width: 1280, height: 900 } });
      contexts.push(context);
      const page = await context.newPage();
      await signInAs(page, email);
      await page.getByRole('heading', { level: 1 }).waitFor();
      return page;
    },
  };
}

/** Clicks the event's button among the record's actions, fills its form, and confirms with `confirm` (the same label by default). */
export async function sendEvent(page: Page, button: string, fill?: (dialog: ReturnType<Page['getByRole']>) => Promise<void>, confirm = button) {
  await page.getByRole('group', { name: 'Actions' }).getByRole('button', { name: button, exact: false }).click();
  const dialog = page.getByRole('dialog');
  await dialog.waitFor();
  if (fill) await fill(dialog);
  await dialog.getByRole('button', { name: confirm, exact: false }).last().click();
  await dialog.waitFor({ state: 'hidden' });
}
