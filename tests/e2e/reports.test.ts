import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_VESSELS } from '../../seed/fleet';
import { DEMO_SIGN_INS } from '../../seed/scenario';
import { SCENARIO_LAST_DATE } from '../../seed/dates';
import type { FleetBenchmark } from '../../shared/schemas/fleet';
import type { MonthlyReport } from '../../shared/schemas/reports';
import { SAVINGS_CAUTION } from '../../shared/schemas/savings';
import { freshPage, sharedBrowser, signIn } from './browser';

const ENERGY = DEMO_SIGN_INS.find((s) => s.role === 'energy_officer');
if (!ENERGY) throw new Error('seed/scenario.ts DEMO_SIGN_INS has no energy officer');

// A month inside the demo scenario (its last full month, seed/dates.ts), so every vessel has logged days.
const MONTH = SCENARIO_LAST_DATE.slice(0, 7);
const FROM = `${MONTH}-01`;
const TO = SCENARIO_LAST_DATE;

async function getJson<T>(page: Page, url: string): Promise<T> {
  return page.evaluate(async (u) => {
    const r = await fetch(u);
    if (!r.ok) throw new Error(`${u}: ${r.status}`);
    return r.json();
  }, url) as Promise<T>;
}

const rowIds = (page: Page) => page.locator('[data-table="vessels"] tbody tr[data-row]').evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-row') ?? ''));

const browser = sharedBrowser();

describe('reports for an energy officer', () => {
  it('compares the fleet per vessel with units and method tooltips, and a vessel report carries the caution', async () => {
    const { context, page, outsideRequests } = await freshPage(browser());
    try {
      await signIn(page, ENERGY.email, ENERGY.password);
      await page.locator('[data-nav="fleet-benchmark"]').click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Fleet benchmark');

      // Choose the period with the date fields; the address keeps it.
      await page.locator('#benchmark-from').fill(FROM);
      await page.locator('#benchmark-to').fill(TO);
      await page.waitForURL((url) => url.searchParams.get('from') === FROM && url.searchParams.get('to') === TO);
      const rows = page.locator('[data-table="vessels"] tbody tr[data-row]');
      await rows.first().waitFor({ timeout: 45_000 });

      // One row per vessel of the fleet (an energy officer sees every vessel, seed/fleet.ts), as the API answers.
      const api = await getJson<FleetBenchmark>(page, `/api/fleet/benchmark?from=${FROM}&to=${TO}`);
      expect(await rows.count()).toBe(DEMO_VESSELS.length);
      expect((await rowIds(page)).sort()).toEqual(api.vessels.map((v) => v.vesselId).sort());

      // Every figure carries its unit: energy in MWh, plant SFOC in g/kWh, load factor in %, hours in h.
      const cells = async (col: string) => rows.locator(`td[data-col="${col}"]`).allTextContents();
      for (const text of await cells('energy')) expect(text).toMatch(/MWh$/);
      const unitOf: Record<string, RegExp> = { plantSfoc: /g\/kWh$/, loadFactor: /%$/, lowLoad: /%$/, hoursToOverhaul: /h$/ };
      for (const [col, unit] of Object.entries(unitOf)) {
        for (const text of await cells(col)) if (text !== '–') expect(text).toMatch(unit);
      }
      expect((await cells('plantSfoc')).filter((t) => t !== '–').length).toBeGreaterThan(0);

      // Sorting by plant SFOC orders the rows as the API's figures do, in the direction the header states (missing last).
      const sfocHeader = page.locator('[data-table="vessels"] th', { has: page.locator('[data-sort="plantSfoc"]') });
      // The header names its unit, and its tooltip is the API's method text.
      expect(await sfocHeader.textContent()).toContain('g/kWh');
      expect(await sfocHeader.getAttribute('title')).toBe(api.method.plantSfoc);
      await page.locator('[data-table="vessels"] [data-sort="plantSfoc"]').click();
      await expect.poll(() => sfocHeader.getAttribute('aria-sort')).not.toBe('none');
      const sign = (await sfocHeader.getAttribute('aria-sort')) === 'ascending' ? 1 : -1;
      const withSfoc = api.vessels.filter((v) => v.plantSfocIsoGPerKwh !== null).sort((a, b) => sign * ((a.plantSfocIsoGPerKwh ?? 0) - (b.plantSfocIsoGPerKwh ?? 0)));
      const expected = [...withSfoc, ...api.vessels.filter((v) => v.plantSfocIsoGPerKwh === null)].map((v) => v.vesselId);
      const ids = await rowIds(page);
      expect(ids.slice(0, withSfoc.length)).toEqual(expected.slice(0, withSfoc.length));
      expect(ids.slice(withSfoc.length).sort()).toEqual(expected.slice(withSfoc.length).sort());

      // Filtering by a vessel name keeps that vessel only.
      const one = api.vessels[0];
      await page.locator('[data-filter="vessels"]').fill(one.vesselName);
      await expect.poll(() => rowIds(page)).toEqual([one.vesselId]);

      // The vessel's monthly report from the vessel page: the caution and the method are on it.
      await page.locator(`[data-nav="vessel-${one.vesselId}"]`).click();
      await page.locator('[data-action="open-report"]').click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Monthly report');
      await page.locator('#report-month').fill(MONTH);
      await page.waitForURL((url) => url.searchParams.get('month') === MONTH);
      const sheet = page.locator('.report-sheet[data-report="vessel"]');
      await sheet.waitFor({ timeout: 45_000 });
      const report = await getJson<MonthlyReport>(page, `/api/vessels/${one.vesselId}/reports/monthly?month=${MONTH}`);
      expect(report.caution).toBe(SAVINGS_CAUTION);
      expect(await sheet.locator('[data-report-caution]').textContent()).toContain(SAVINGS_CAUTION);
      expect(await sheet.locator('h2').textContent()).toBe(report.title);
      expect(await sheet.locator('[data-report-method] li').count()).toBe(report.method.length);
      // The download links fetch the same month, and the CSV states the caution too.
      const csvHref = await page.locator('[data-download="csv"]').getAttribute('href');
      expect(await page.locator('[data-download="xlsx"]').getAttribute('href')).toBe(`/api/vessels/${one.vesselId}/reports/monthly.xlsx?month=${MONTH}`);
      expect(csvHref).toBe(`/api/vessels/${one.vesselId}/reports/monthly.csv?month=${MONTH}`);
      const csv = await page.evaluate(async (u) => (await fetch(u)).text(), csvHref ?? '');
      expect(csv).toContain(SAVINGS_CAUTION);

      // On paper (print media): the navigation, the month picker and the download links are gone; the caution stays.
      await page.emulateMedia({ media: 'print' });
      expect(await page.locator('nav[aria-label="Main"]').isVisible()).toBe(false);
      expect(await page.locator('[data-download="csv"]').isVisible()).toBe(false);
      expect(await page.locator('#report-month').isVisible()).toBe(false);
      expect(await sheet.locator('[data-report-caution]').isVisible()).toBe(true);
      await page.emulateMedia({ media: 'screen' });

      expect(outsideRequests).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('subscribes to a vessel report and unsubscribes; reads the fuel prices without editing them', async () => {
    const { context, page, outsideRequests } = await freshPage(browser());
    try {
      await signIn(page, ENERGY.email, ENERGY.password);
      await page.locator('[data-nav="subscriptions"]').click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Subscriptions');
      const form = page.locator('[data-form="subscribe"]');
      await form.waitFor();
      // An energy officer may receive the fleet report (reports:read in shared/roles.ts).
      expect(await page.locator('#sub-kind option[value="fleet_monthly_report"]').count()).toBe(1);
      await page.locator('#sub-kind').selectOption('vessel_monthly_report');
      const vesselName = (await page.locator('#sub-vessel option:checked').textContent())?.trim() ?? '';
      const before = await page.locator('tr[data-subscription="vessel_monthly_report"]').count();
      await form.getByRole('button', { name: 'Subscribe', exact: true }).click();
      const row = page.locator('tr[data-subscription="vessel_monthly_report"]', { hasText: vesselName });
      await row.waitFor();
      expect(await page.locator('tr[data-subscription="vessel_monthly_report"]').count()).toBe(before + 1);
      // Overhaul alerts take hours before due, in h.
      await page.locator('#sub-kind').selectOption('overhaul_alert');
      expect(await page.locator('#sub-hours').isVisible()).toBe(true);
      await row.locator('[data-action="unsubscribe"]').click();
      await expect.poll(() => page.locator('tr[data-subscription="vessel_monthly_report"]', { hasText: vesselName }).count()).toBe(0);

      await page.locator('[data-nav="fuel-prices"]').click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Fuel prices');
      await page.locator('[data-price], [data-state="empty"]').first().waitFor();
      // Reading only: the form is for administrators (company:settings).
      expect(await page.locator('[data-form="fuel-price"]').count()).toBe(0);
      for (const price of await page.locator('[data-price] td:nth-child(4)').allTextContents()) expect(price).toMatch(/\/t$/);

      expect(outsideRequests).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
