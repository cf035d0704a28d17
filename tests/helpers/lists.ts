// Browser-test helpers for the server-paged lists. A list keeps the previous
// rows on screen (marked aria-busy) while a new filter loads, so a test waits
// for the list the server holds for that filter, not for "some rows".
import { expect, inject } from 'vitest';
import type { Page } from 'playwright-core';

/** `total` of GET /api/<path>?<query>, asked with the page's own session. */
export async function listTotal(page: Page, path: string, query: Record<string, string> = {}): Promise<number> {
  const response = await page.request.get(`${inject('baseUrl')}/api/${path}?${new URLSearchParams(query)}`);
  expect(response.status()).toBe(200);
  return ((await response.json()) as { total: number }).total;
}

/** Waits until the table captioned `caption` has finished loading and says it holds `total` records. */
export async function waitForListTotal(page: Page, caption: string, total: number): Promise<void> {
  const frame = page.locator('[aria-busy]', { has: page.getByRole('table', { name: caption, exact: true }) });
  const noun = total === 1 ? 'record' : 'records';
  await expect
    .poll(async () => ({ busy: await frame.getAttribute('aria-busy'), footer: (await frame.textContent()) ?? '' }))
    .toSatisfy(({ busy, footer }: { busy: string | null; footer: string }) => busy === 'false' && footer.includes(`${total} ${noun} · page`));
}
