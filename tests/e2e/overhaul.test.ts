import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_VESSELS } from '../../seed/fleet';
import { DEMO_SIGN_INS } from '../../seed/scenario';
import type { VesselOverhaul } from '../../shared/schemas/overhaul';
import { freshPage, sharedBrowser, signIn } from './browser';

const PLANNER = DEMO_SIGN_INS.find((s) => s.role === 'planner');
if (!PLANNER) throw new Error('seed/scenario.ts DEMO_SIGN_INS has no planner');
// The chief engineer of one vessel (seed/fleet.ts: Shearwater Bay): overhaul:record, not overhaul:plan.
const CHIEF = DEMO_SIGN_INS.find((s) => s.role === 'chief_engineer' && s.vessels.length === 1);
if (!CHIEF) throw new Error('seed/scenario.ts DEMO_SIGN_INS has no chief engineer with one vessel');
const VESSEL = DEMO_VESSELS.find((v) => v.name === CHIEF.vessels[0]);
if (!VESSEL) throw new Error(`seed/fleet.ts has no vessel ${CHIEF.vessels[0]}`);
const SERVICE_SETS = VESSEL.gensets.filter((g) => g.duty === 'service').map((g) => g.designation);

/** "12 Mar 2027" as src/lib/format formatDate writes a date (en-GB, day month year). */
const SHORT_DATE = /\d{1,2} [A-Z][a-z]{2,3} \d{4}/;

/** From the navigation entry of the vessel to its overhaul page; the vessel id from the address. */
async function openOverhaul(page: Page): Promise<string> {
  await page.locator('nav[aria-label="Main"] [data-nav^="vessel-"]', { hasText: VESSEL!.name }).click();
  await page.locator('[data-action="open-overhaul"]').click();
  await expect.poll(() => page.locator('h1').textContent()).toBe(`${VESSEL!.name}: running hours and overhauls`);
  const id = /\/vessels\/([^/]+)\/overhaul/.exec(page.url())?.[1];
  if (!id) throw new Error(`not an overhaul page: ${page.url()}`);
  return id;
}

function apiOverhaul(page: Page, vesselId: string): Promise<VesselOverhaul> {
  return page.evaluate(async (id) => (await (await fetch(`/api/vessels/${id}/overhaul`)).json()) as VesselOverhaul, vesselId);
}

const dueTable = (page: Page) => page.locator('table', { has: page.locator('caption', { hasText: 'Hours and due dates per set' }) });
/** Rows of the due table as cell texts: set, maintenance, hours since, interval, hours left, due at meter, usage, due. */
async function dueRows(page: Page): Promise<string[][]> {
  await dueTable(page).waitFor();
  return dueTable(page).locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent ?? '')));
}

function plusDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

const browser = sharedBrowser();

describe('overhaul planner', () => {
  it('shows a planner every service set with hours left and a due date, the timeline, and a stagger proposal in hours', async () => {
    const { context, page, outsideRequests } = await freshPage(browser());
    try {
      await signIn(page, PLANNER.email, PLANNER.password);
      const vesselId = await openOverhaul(page);
      const rows = await dueRows(page);
      const api = await apiOverhaul(page, vesselId);
      // One row per maintenance kind of each set, and every service set of the vessel among them.
      expect(rows.length).toBe(api.sets.reduce((n, s) => n + s.items.length, 0));
      for (const name of SERVICE_SETS) expect(rows.some((r) => r[0] === name)).toBe(true);
      for (const r of rows) {
        expect(r[4]).toMatch(/\d\u00a0h$|^overdue/); // hours left, in h
        expect(r[7]).toMatch(SHORT_DATE); // a forecast due date
      }
      // The timeline chart has drawn (ECharts renders a canvas or an svg inside the labelled figure).
      const chart = page.locator('[role="img"][aria-label^="Forecast due dates"]');
      await expect.poll(() => chart.locator('canvas, svg').count()).toBeGreaterThan(0);
      expect(await page.locator('[data-alert="error"]').filter({ hasText: 'Advice only' }).count()).toBe(1);

      // The planning controls are there; a stagger proposal over a year from the latest readings.
      expect(await page.locator('[data-action="add-window"]').count()).toBe(1);
      const latest = api.sets.map((s) => s.asOfDate).filter((d): d is string => !!d).sort().at(-1)!;
      await page.locator('#st-until').fill(plusDays(latest, 365));
      await page.locator('form[data-form="stagger"] input[type="checkbox"]').check(); // sets may stay short of their due
      await page.locator('[data-action="propose"]').click();
      const result = page.locator('[data-stagger-status]');
      await result.waitFor({ timeout: 30_000 });
      expect(await result.getAttribute('data-stagger-status')).not.toBe('infeasible');
      const budgets = result.locator('table', { has: page.locator('caption', { hasText: 'Proposed hour budgets' }) });
      const budgetRows = await budgets.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent ?? '')));
      expect(budgetRows.length).toBeGreaterThan(0);
      for (const b of budgetRows) {
        expect(b[2]).toMatch(/\d\u00a0h$/); // hours left now
        expect(b[3]).toMatch(/\d\u00a0h$/); // hour budget
        expect(b[4]).toMatch(/h\/day$/);
      }
      expect(await page.locator('[data-action="save-budgets"]').count()).toBe(1);
      expect(outsideRequests).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('lets the chief engineer record completed work, without the planning controls', async () => {
    const { context, page } = await freshPage(browser());
    try {
      await signIn(page, CHIEF.email, CHIEF.password);
      const vesselId = await openOverhaul(page);
      await dueTable(page).waitFor();
      expect(await page.locator('form[data-form="stagger"]').count()).toBe(0);
      expect(await page.locator('[data-action="add-window"]').count()).toBe(0);
      expect(await page.locator('[data-action="approve-budgets"]').count()).toBe(0);

      // Work done on the day of the latest reading at that reading: hours since 0 h, hours left the interval.
      const api = await apiOverhaul(page, vesselId);
      const set = api.sets.find((s) => s.designation === SERVICE_SETS[0] && s.items.length > 0 && s.asOfDate && s.latestMeterH !== null);
      expect(set).toBeDefined();
      const item = set!.items[0];
      const form = page.locator('form[data-form="record-work"]');
      await form.locator('#rw-set').selectOption(set!.gensetId);
      await form.locator('#rw-kind').fill(item.kind);
      await form.locator('#rw-date').fill(set!.asOfDate!);
      await form.locator('#rw-hours').fill(String(set!.latestMeterH));
      await form.locator('#rw-remarks').fill('browser test');
      await form.getByRole('button', { name: 'Record completed work' }).click();
      await form.getByText('Recorded. The interval counts from this work now.').waitFor();
      const done = page.locator('table', { has: page.locator('caption', { hasText: 'Completed work' }) }).locator('tbody tr', { hasText: 'browser test' });
      await done.waitFor();
      expect(await done.textContent()).toContain(item.kind);

      await expect
        .poll(async () => (await dueRows(page)).find((r) => r[0] === set!.designation && r[1] === item.kind)?.[2])
        .toBe('0\u00a0h');
      const after = (await apiOverhaul(page, vesselId)).sets.find((s) => s.gensetId === set!.gensetId)!.items.find((i) => i.kind === item.kind)!;
      expect(after.hoursSince).toBe(0);
      expect(after.hoursLeft).toBe(item.intervalHours);
    } finally {
      await context.close();
    }
  });
});
