import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { inject } from 'vitest';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('capability demonstrations in the browser', () => {
  it('when the Level 3 opens a technique whose demonstration exceeds its claim, then the POD plots, a90/95 and the failing rule show', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1800 } });
    const page = await context.newPage();
    await signInAs(page, 'level3@tarnbrook.example');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.goto(`${inject('baseUrl')}/techniques?q=TAC-ET-011`);
    await page.getByRole('link', { name: 'TAC-ET-011' }).click();
    const section = page.getByRole('region', { name: 'Capability demonstrations' });
    await section.getByRole('article').first().waitFor();
    const text = await section.textContent();
    expect(text).toMatch(/Bore notches, 45 flaws, signal response/);
    expect(text).toMatch(/Accepted by Sunniva Brack/);
    expect(text).toMatch(/a90\/95\s*1\.8\d* mm/);
    expect(text).toMatch(/delta method/);
    expect(text).toMatch(/false-call probability/);
    await expect.poll(async () => section.locator('svg.recharts-surface').count()).toBeGreaterThanOrEqual(3);
    await expect.poll(async () => (await page.textContent('body')) ?? '').toMatch(/Not demonstrated: a90\/95 = 1\.8\d* mm in length/);
    // People see labels, never codes.
    expect(text).not.toMatch(/signal-response|hit-miss|non_constant_variance/);
    await page.screenshot({ path: screenshotPath('pod-demonstration-technique-page'), fullPage: true });
    await context.close();
  });
});
