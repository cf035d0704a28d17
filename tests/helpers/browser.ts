// Debian's Chromium driven by playwright-core. The flags keep it off the network.
import { chromium, type Browser, type Page } from 'playwright-core';
import path from 'node:path';
import { inject } from 'vitest';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const DEMO_PASSWORD = 'whorl-demo-2026';

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
    ],
  });
}

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${inject('baseUrl')}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export function screenshotPath(name: string): string {
  return path.join(inject('outputDir'), `${name}.png`);
}
