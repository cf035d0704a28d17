import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('the trail page', () => {
  it('when the administrator checks the trail of the demo data, then it reports the chain intact', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'admin@tarnbrook.example');
    await page.getByRole('link', { name: 'Trail' }).click();
    await page.getByRole('button', { name: 'Check the whole trail' }).click();
    const status = page.getByRole('status').filter({ hasText: 'Intact' });
    await status.waitFor();
    expect(await status.textContent()).toMatch(/All [\d,]+ entries verify/);
    await page.getByRole('textbox', { name: 'Record' }).fill('user:1');
    await page.getByRole('button', { name: 'Show entries' }).click();
    await page.getByText('Person added').first().waitFor();
    expect(await page.getByText('USER_CREATED').count()).toBe(0);
    // A record number finds its record, and the entries read in words with what changed.
    await page.getByRole('textbox', { name: 'Record' }).fill('F-2026-0001');
    await page.getByRole('button', { name: 'Show entries' }).click();
    await page.getByRole('heading', { name: 'Finding F-2026-0001' }).waitFor();
    await page.getByText('Finding raised').first().waitFor();
    expect(await page.getByText(/areaId|FINDING_RAISED|\{"/).count()).toBe(0);
    await page.screenshot({ path: screenshotPath('trail-verified'), fullPage: true });
    await context.close();
  });
});
