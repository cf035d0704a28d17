// Pages opened by address by a role that may not use them say so at once.
import { describe, expect, inject, it } from 'vitest';
import { screenshotPath } from '../helpers/browser';
import { browserSessions } from '../helpers/record-pages';

const { as } = browserSessions();

describe('admin pages by address', () => {
  for (const email of ['quality@tarnbrook.example', 'technician@tarnbrook.example', 'auditor@tarnbrook.example']) {
    it(`when ${email} opens /admin/users by address, then the page says it is not available to their role and offers no controls`, async () => {
      const page = await as(email);
      await page.goto(`${inject('baseUrl')}/admin/users`);
      await page.getByText('This page is not available to your role').waitFor();
      expect(await page.getByRole('button', { name: /Add|Edit|Deactivate/ }).count()).toBe(0);
      expect(await page.getByRole('table').count()).toBe(0);
      if (email.startsWith('technician')) await page.screenshot({ path: screenshotPath('admin-users-not-available'), fullPage: true });
    });
  }

  it('when the administrator opens /admin/users, then the people register shows with its controls', async () => {
    const page = await as('admin@tarnbrook.example');
    await page.goto(`${inject('baseUrl')}/admin/users`);
    await page.getByRole('table').waitFor();
    expect(await page.getByText('This page is not available to your role').count()).toBe(0);
  });
});
