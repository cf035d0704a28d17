// Every dashboard drill-down opens a list whose total is the bar's count from
// the server, and the list's State control shows the filter the address holds.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshotPath } from '../helpers/browser';
import { browserSessions } from '../helpers/record-pages';
import { waitForListTotal } from '../helpers/lists';
import type { DashboardView } from '../../shared/schemas/dashboard';
import { AGE_BANDS } from '../../shared/schemas/dashboard';

const { as } = browserSessions();

async function dashboard(page: Page): Promise<DashboardView> {
  const response = await page.request.get(`${inject('baseUrl')}/api/dashboard`);
  expect(response.status()).toBe(200);
  return (await response.json()) as DashboardView;
}

/** The text of the option a filter select shows. */
function chosen(page: Page, label: string) {
  return page
    .getByRole('search')
    .locator('label', { hasText: label })
    .locator('select')
    .evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? '');
}

async function openDashboardTable(page: Page, chartId: string) {
  await page.goto(`${inject('baseUrl')}/dashboard`);
  const chart = page.locator(`[data-chart="${chartId}"]`);
  await chart.getByText('The numbers behind this chart').click();
  return chart;
}

describe('dashboard drill-downs in the browser', () => {
  it('when the quality manager opens each bar of open findings by class, then the list holds exactly the bar\'s findings', async () => {
    const page = await as('quality@tarnbrook.example');
    const data = await dashboard(page);
    // The default range reaches into the future, so actions not yet due are counted.
    expect(data.range.to > data.range.today).toBe(true);
    expect(data.actionsByMonth.some((row) => row.openNotDue > 0)).toBe(true);

    const classes = [...new Set(data.openFindingsByClassAge.map((row) => row.class))];
    expect(classes).toContain('unclassified');
    for (const cls of classes) {
      const expected = data.openFindingsByClassAge.filter((row) => row.class === cls).reduce((sum, row) => sum + row.count, 0);
      const chart = await openDashboardTable(page, 'open-findings');
      const row = chart.locator('tbody tr', { has: page.locator('td').first() }).nth(classes.indexOf(cls));
      expect(Number(await row.locator('td').nth(AGE_BANDS.length + 1).textContent())).toBe(expected);
      await row.getByRole('link').click();
      await page.waitForURL(/\/findings\?/);
      await waitForListTotal(page, 'Findings', expected);
      expect(await chosen(page, 'State')).toBe('Open (not closed or withdrawn)');
      if (cls === 'unclassified') {
        expect(await chosen(page, 'Class')).toBe('Not yet classified');
        await page.screenshot({ path: screenshotPath('dashboard-drilldown-unclassified'), fullPage: true });
      }
    }
  });

  it('when the quality manager opens a count of each kind of actions by due month, then the list holds exactly that count', async () => {
    const page = await as('quality@tarnbrook.example');
    const data = await dashboard(page);
    const kinds = ['closedOnTime', 'closedLate', 'overdue', 'openNotDue'] as const;
    let checked = 0;
    for (const [kindIndex, kind] of kinds.entries()) {
      // The latest month with such actions: one per kind keeps the test short.
      const index = data.actionsByMonth.findLastIndex((row) => row[kind] > 0);
      const month = data.actionsByMonth[index];
      {
        if (!month) continue;
        const chart = await openDashboardTable(page, 'actions-by-month');
        await chart.locator('tbody tr').nth(index).locator('td').nth(2 + kindIndex).getByRole('link').click();
        await page.waitForURL(/\/actions\?/);
        await waitForListTotal(page, 'Corrective actions', month[kind]);
        checked += 1;
        if (kind === 'openNotDue') await page.screenshot({ path: screenshotPath('dashboard-drilldown-not-yet-due'), fullPage: true });
      }
    }
    expect(checked).toBeGreaterThan(0);
  });

  it('when the quality manager opens an area\'s open findings, then the list total is the bar\'s', async () => {
    const page = await as('quality@tarnbrook.example');
    const data = await dashboard(page);
    const area = data.findingsByArea.find((row) => row.open > 0)!;
    const chart = await openDashboardTable(page, 'findings-by-area');
    await chart.locator('tbody tr', { hasText: area.areaName }).locator('td').nth(1).getByRole('link').click();
    await waitForListTotal(page, 'Findings', area.open);
  });
});
