// Evidence upload with its progress and hash, and the messages page showing a
// reminder (to the administrator, who reads everyone's) and a person's own
// delivery choice. The reminder comes from the scheduler running in this test process
// against the e2e database, as a second app server would run it: the server
// under test then sends it from the outbox to its local SMTP fake.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { Sequelize } from 'sequelize';
import PDFDocument from 'pdfkit';
import type { Browser } from 'playwright-core';
import { inject } from 'vitest';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';
import { loadConfig } from '../../server/config/env';
import { createLogger } from '../../server/lib/logger';
import { initModels } from '../../server/models';
import { createScheduler } from '../../server/jobs';
import { remindersJob } from '../../server/jobs/reminders.job';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

function makePdf(text: string): Promise<Buffer> {
  return new Promise((resolve) => {
    const doc = new PDFDocument();
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.text(text);
    doc.end();
  });
}

describe('evidence and mail in the browser', () => {
  it('when the quality manager uploads files on a corrective action page, then each shows its progress and the stored hash; an executable is refused with the reason', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'quality@tarnbrook.example');
    await page.getByRole('heading', { level: 1 }).waitFor();
    // An action still being worked on: evidence is frozen once an action is verified.
    const open = await page.request.get(`${inject('baseUrl')}/api/actions?state=in_progress&pageSize=1`);
    const [action] = ((await open.json()) as { items: { id: number }[] }).items;
    await page.goto(`${inject('baseUrl')}/actions/${action.id}`);
    const panel = page.getByRole('region', { name: 'Evidence' });
    await panel.getByRole('heading', { name: 'Evidence' }).waitFor();

    const pdf = await makePdf(`Rotating probe demonstration on the reference block, ${Date.now()}`);
    const hash = createHash('sha256').update(pdf).digest('hex');
    const csv = Buffer.from(`channel,frequency_hz,phase_deg\n1,300000,41.7\n2,300000,${Date.now() % 90}\n`);
    await panel.getByLabel('Evidence files to upload').setInputFiles([
      { name: 'demonstration.pdf', mimeType: 'application/pdf', buffer: pdf },
      { name: 'instrument-export.csv', mimeType: 'text/csv', buffer: csv },
      { name: 'setup.pdf', mimeType: 'application/pdf', buffer: Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(200)]) },
    ]);
    const uploads = panel.getByRole('list', { name: 'Uploads' });
    await uploads.getByText(`Stored · SHA-256 ${hash.slice(0, 12)}`).waitFor();
    expect(await uploads.getByRole('progressbar', { name: 'Upload of demonstration.pdf' }).getAttribute('aria-valuenow')).toBe('100');
    await uploads.getByText(`Stored · SHA-256 ${createHash('sha256').update(csv).digest('hex').slice(0, 12)}`).waitFor();
    const refusal = uploads.getByRole('alert');
    await refusal.waitFor();
    expect(await refusal.textContent()).toContain('setup.pdf');
    expect(await refusal.textContent()).toContain('not accepted');

    const row = panel.locator('tr', { hasText: 'demonstration.pdf' });
    await row.waitFor();
    expect(await row.getByTestId('evidence-hash').textContent()).toBe(hash.slice(0, 12));
    expect(await row.getByTestId('evidence-hash').getAttribute('title')).toBe(hash);
    expect(await row.textContent()).toContain('Ines Harrow');
    await page.screenshot({ path: screenshotPath('evidence-upload'), fullPage: true });
    await context.close();
  });

  it('when the reminder job has run, then admin@ sees the overdue reminder in the mailbox with its link', async () => {
    const socketPath = inject('e2eDatabaseSocket');
    const sequelize = new Sequelize('whorl_e2e', 'root', '', {
      dialect: 'mariadb',
      dialectOptions: { socketPath },
      logging: false,
      timezone: '+00:00',
      define: { underscored: true },
    });
    try {
      initModels(sequelize);
      const config = loadConfig({
        NODE_ENV: 'test',
        DATABASE_URL: 'mariadb://unused@127.0.0.1/unused',
        SESSION_SECRET: 'e2e-second-server-secret-long-enough',
        PUBLIC_URL: inject('baseUrl'),
        LOG_LEVEL: 'silent',
      });
      const scheduler = createScheduler({ config, sequelize, logger: createLogger('silent'), clock: { now: () => new Date() } }, [remindersJob]);
      await sequelize.query(`UPDATE scheduled_jobs SET next_run_at = '2000-01-01' WHERE name = 'reminders'`);
      await scheduler.tick();
    } finally {
      await sequelize.close();
    }

    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'admin@tarnbrook.example');
    await page.getByRole('heading', { level: 1 }).waitFor();
    const messages = page.getByRole('list', { name: 'Messages, newest first' });
    const reminder = messages.getByRole('listitem').filter({ hasText: /is overdue by/ }).filter({ hasText: 'Sent' }).first();
    // The server's sender polls its outbox every few seconds; a busy machine may take longer.
    const deadline = Date.now() + 60_000;
    for (;;) {
      await page.goto(`${inject('baseUrl')}/messages?person=all&q=${encodeURIComponent('overdue by')}`);
      await page.getByRole('heading', { name: 'Messages', level: 1 }).waitFor();
      if (await reminder.isVisible().catch(() => false)) break;
      if (Date.now() > deadline) throw new Error('no overdue reminder was sent');
      await page.waitForTimeout(1_000);
    }
    expect(await reminder.textContent()).toContain('Reminder: corrective action overdue');
    expect(await reminder.getByRole('link', { name: 'Open the record' }).getAttribute('href')).toMatch(/^\/actions\/\d+$/);
    await reminder.getByText('Read the message').click();
    const body = await reminder.locator('details p').textContent();
    expect(body).toMatch(/Hello .+,/);
    expect(body).toContain(`${inject('baseUrl')}/actions/`);
    // Nothing of a developer's mail tool: no message ids, no raw HTML.
    expect(await page.locator('main').textContent()).not.toMatch(/Message-ID|<outbox-|<p>/);
    await page.screenshot({ path: screenshotPath('messages-reminder'), fullPage: true });
    await context.close();
  });

  it('when a technician opens Messages, then only their own messages show and they switch themselves to a daily digest', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'technician@tarnbrook.example');
    await page.getByRole('link', { name: 'Messages' }).click();
    await page.getByRole('heading', { name: 'Messages', level: 1 }).waitFor();
    await page.getByRole('heading', { name: 'Sent to you' }).waitFor();
    expect(await page.getByLabel('Whose messages').count()).toBe(0);
    const digest = page.getByRole('radio', { name: /One daily digest/ });
    const save = page.getByRole('button', { name: 'Save my choice' });
    await page.getByRole('radio', { name: /Each message as it happens/ }).waitFor();
    expect(await save.isDisabled()).toBe(true);
    await digest.check();
    await save.click();
    await page.getByRole('status').filter({ hasText: 'Saved.' }).waitFor();
    await page.reload();
    await page.getByRole('heading', { name: 'How you receive messages' }).waitFor();
    await expect.poll(() => digest.isChecked()).toBe(true);
    await page.screenshot({ path: screenshotPath('messages-technician'), fullPage: true });
    await context.close();
  });
});
