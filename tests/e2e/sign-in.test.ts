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

const DEMO_ACCOUNTS = [
  { email: 'auditor@tarnbrook.example', name: 'Mara Quillon', role: 'Auditor' },
  { email: 'auditor2@tarnbrook.example', name: 'Tobias Venn', role: 'Auditor' },
  { email: 'quality@tarnbrook.example', name: 'Ines Harrow', role: 'Quality manager' },
  { email: 'accountable@tarnbrook.example', name: 'Rafael Oduya', role: 'Accountable manager' },
  { email: 'level3@tarnbrook.example', name: 'Sunniva Brack', role: 'ET Level 3' },
  { email: 'technician@tarnbrook.example', name: 'Deniz Calloway', role: 'Technician' },
  { email: 'admin@tarnbrook.example', name: 'Petra Lowe', role: 'Administrator' },
];

describe('signing in with the demo accounts', () => {
  for (const account of DEMO_ACCOUNTS) {
    it(`when ${account.email} signs in, then their home page shows their name and role`, async () => {
      const context = await browser.newContext();
      const page = await context.newPage();
      await signInAs(page, account.email);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await expect(page.getByRole('button', { name: new RegExp(account.name) }).textContent()).resolves.toContain(account.role);
      expect(new URL(page.url()).pathname).toBe('/');
      await expect(page.getByRole('note').first().textContent()).resolves.toContain('certified ET Level 3');
      if (account.email.startsWith('quality@')) await page.screenshot({ path: screenshotPath('home-quality-manager'), fullPage: true });
      await context.close();
    });
  }

  it('when the password is wrong, then the error is shown plainly and no session starts', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'auditor@tarnbrook.example', 'not-the-demo-password');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.textContent()).toContain('The e-mail address or password is not right');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });

  it('when a signed-in user signs out, then they are back on the sign-in page and the home page needs a session again', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'technician@tarnbrook.example');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.getByRole('button', { name: /Deniz Calloway/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.goto(`${inject('baseUrl')}/admin/users`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });
});
