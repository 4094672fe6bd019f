import { readFile } from 'node:fs/promises';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { TEMPLATE_HEADERS } from '../../server/lib/csv-mapping';
import { DEMO_VESSELS } from '../../seed/fleet';
import { DEMO_SIGN_INS } from '../../seed/scenario';
import { LOG_FLAG_CODES } from '../../shared/schemas/logs';
import { freshPage, sharedBrowser, signIn } from './browser';

// The chief engineer of one vessel (seed/fleet.ts: Shearwater Bay), who may edit its log (logs:edit).
const CHIEF = DEMO_SIGN_INS.find((s) => s.role === 'chief_engineer' && s.vessels.length === 1);
if (!CHIEF) throw new Error('seed/scenario.ts DEMO_SIGN_INS has no chief engineer with one vessel');
const VESSEL = DEMO_VESSELS.find((v) => v.name === CHIEF.vessels[0]);
if (!VESSEL) throw new Error(`seed/fleet.ts has no vessel ${CHIEF.vessels[0]}`);

type LogPage = { total: number; page: number; pageSize: number; rows: { logDate: string; designation: string }[]; missingDays: { designation: string; date: string }[] };

/** The log API as the signed-in page sees it (same cookies), for the figures the table must show. */
function apiLogs(page: Page, vesselId: string, query: string): Promise<LogPage> {
  return page.evaluate(async ({ id, q }) => (await (await fetch(`/api/vessels/${id}/logs?${q}`)).json()) as LogPage, { id: vesselId, q: query });
}

/** "Page 1 of 31 · 1 520 set-days (one row per set and day)" under the log table. */
async function pagerText(page: Page): Promise<string> {
  const p = page.locator('span', { hasText: /^Page \d+ of \d+/ });
  await p.first().waitFor();
  return (await p.first().textContent()) ?? '';
}
const daysIn = (pager: string) => Number(/·\s*([\d,\s\u00a0]+)\s*set-days?/.exec(pager)?.[1].replace(/[^\d]/g, ''));
const logTable = (page: Page) => page.locator('table', { has: page.locator('caption', { hasText: 'Daily genset log with derived figures' }) });

const browser = sharedBrowser();

describe('log intake for a chief engineer', () => {
  it('pages and filters the own log, imports a CSV through the wizard with a row error shown, undoes it, and opens the fuel lots', async () => {
    const { context, page, outsideRequests } = await freshPage(browser());
    page.on('dialog', (d) => void d.accept());
    try {
      await signIn(page, CHIEF.email, CHIEF.password);
      await page.locator('nav[aria-label="Main"] [data-nav^="vessel-"]').first().click();
      await page.locator('[data-action="open-logs"]').click();
      await expect.poll(() => page.locator('h1').textContent()).toBe(`Engine-room log · ${VESSEL.name}`);
      const vesselId = /\/vessels\/([^/]+)\/logs/.exec(page.url())?.[1] ?? '';
      expect(vesselId).not.toBe('');

      // Paging: 50 days a page, newest first; the next page starts after the first ends.
      const all = await apiLogs(page, vesselId, 'pageSize=50');
      expect(all.total).toBeGreaterThan(50);
      const firstPager = await pagerText(page);
      expect(daysIn(firstPager)).toBe(all.total);
      const rows = logTable(page).locator('tbody tr');
      await expect.poll(() => rows.count()).toBe(50);
      const firstRowText = await rows.first().textContent();
      await page.getByRole('button', { name: 'Next', exact: true }).click();
      await expect.poll(() => pagerText(page)).toMatch(/^Page 2 of /);
      await expect.poll(() => rows.first().textContent()).not.toBe(firstRowText);
      // Derived figures carry their units (hours run, energy, average load, load of rating, SFOC).
      const cells = await rows.first().locator('td').allTextContents();
      expect(cells[2]).toMatch(/\sh$|–/);
      expect(cells[3]).toMatch(/kWh|–/);
      expect(cells[4]).toMatch(/kW|–/);
      expect(cells[5]).toMatch(/%|–/);
      expect(cells[8]).toMatch(/g\/kWh|–/);
      const bodyText = (await logTable(page).locator('tbody').textContent()) ?? '';
      expect(bodyText).toMatch(/\d\u00a0kWh/);
      expect(bodyText).toMatch(/g\/kWh/);

      // A flag filter: the first flag the vessel's log carries; every row shown carries it, the count is the API's.
      let flag: string | null = null;
      let flagged = 0;
      for (const code of LOG_FLAG_CODES.filter((c) => c !== 'MISSING_DAY')) {
        const r = await apiLogs(page, vesselId, `pageSize=1&flag=${code}`);
        if (r.total > 0) {
          flag = code;
          flagged = r.total;
          break;
        }
      }
      expect(flag).not.toBeNull();
      await page.locator('#f-flag').selectOption(flag!);
      await expect.poll(async () => daysIn(await pagerText(page))).toBe(flagged);
      const flagCells = await rows.evaluateAll((trs) => trs.map((tr) => tr.querySelectorAll('td')[11]?.textContent ?? ''));
      expect(flagCells.length).toBe(Math.min(50, flagged));
      for (const text of flagCells) expect(text).toContain(flag!);
      await page.locator('#f-flag').selectOption('');
      await expect.poll(async () => daysIn(await pagerText(page))).toBe(all.total);

      // The import page: the template downloads with the documented header row.
      await page.getByRole('link', { name: 'Import CSV and history' }).click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Import engine-room logs');
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download the CSV template' }).click()]);
      const template = await readFile((await download.path())!, 'utf8');
      const header = template.replace(/^\uFEFF/, '').split(/\r?\n/)[0];
      expect(header).toBe(TEMPLATE_HEADERS.join(','));

      // A missing day of the own log (new), and a row naming a set not in the register (an error on row 3).
      const missing = all.missingDays[0];
      expect(missing).toBeDefined();
      const cols = TEMPLATE_HEADERS.length;
      const line = (values: Record<string, string>) => TEMPLATE_HEADERS.map((h) => values[h] ?? '').join(',');
      const csv = [header, line({ date: missing.date, genset: missing.designation, hours_run_h: '20', kwh_produced_kwh: '24000' }), line({ date: missing.date, genset: 'DG9', hours_run_h: '12', kwh_produced_kwh: '9000' })].join('\n');
      expect(csv.split('\n')[1].split(',')).toHaveLength(cols);
      await page.locator('#imp-file').setInputFiles({ name: 'e2e-missing-day.csv', mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });
      const preview = page.locator('table', { has: page.locator('caption', { hasText: 'Preview of the rows' }) });
      await preview.waitFor();
      const errorRow = preview.locator('tbody tr').first();
      const errorCells = await errorRow.locator('td').allTextContents();
      expect(errorCells[0]).toBe('3');
      expect(errorCells[3]).toBe('error');
      expect(errorCells[7]).toMatch(/^genset: .*DG9/);
      const newRow = preview.locator('tbody tr').nth(1);
      expect(await newRow.locator('td').allTextContents()).toEqual(expect.arrayContaining(['2', missing.designation, missing.date, 'new', '20.0\u00a0h', '24000\u00a0kWh']));
      expect(await page.getByText('1 with errors (not imported)').count()).toBe(1);

      await page.getByRole('button', { name: 'Import 1 row' }).click();
      await page.getByText(/Imported: 1 new, 0 overwritten, 0 unchanged, 1 rejected/).waitFor();
      const history = page.locator('table', { has: page.locator('caption', { hasText: 'Import history' }) });
      const imported = history.locator('tbody tr', { hasText: 'e2e-missing-day.csv' });
      await imported.waitFor();
      const hcells = await imported.locator('td').allTextContents();
      expect(hcells.slice(3, 8)).toEqual(['1', '0', '0', '1', 'committed']);
      expect((await apiLogs(page, vesselId, 'pageSize=1')).total).toBe(all.total + 1);

      await imported.getByRole('button', { name: 'Undo' }).click();
      await expect.poll(async () => (await imported.locator('td').nth(7).textContent()) ?? '').not.toBe('committed');
      expect(await imported.getByRole('button', { name: 'Undo' }).count()).toBe(0);

      // Back on the log: the day count is what it was before the import.
      await page.getByRole('link', { name: 'Back to the log' }).click();
      await expect.poll(async () => daysIn(await pagerText(page))).toBe(all.total);
      expect((await apiLogs(page, vesselId, 'pageSize=1')).total).toBe(all.total);

      // The fuel lots the log refers to: every lot with its density and LCV in their units.
      await page.getByRole('link', { name: 'Fuel lots', exact: true }).click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Fuel lot register');
      const lots = page.locator('table', { has: page.locator('caption', { hasText: 'Fuel lots' }) }).locator('tbody tr');
      await lots.first().waitFor();
      const lotCells = await lots.evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent ?? '')));
      for (const l of lotCells) {
        expect(l[3]).toMatch(/\d\u00a0kg\/m³$/);
        expect(l[4]).toMatch(/\d\u00a0MJ\/kg/);
      }
      expect(outsideRequests).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
