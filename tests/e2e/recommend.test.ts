import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_VESSELS } from '../../seed/fleet';
import { DEMO_SIGN_INS } from '../../seed/scenario';
import { RECOMMENDATION_CAUTION } from '../../shared/schemas/recommendations';
import { freshPage, sharedBrowser, signIn } from './browser';

// A chief engineer of one vessel (seed/fleet.ts: the first chief engineer, Shearwater Bay, four 2 400 kW sets).
const CHIEF = DEMO_SIGN_INS.find((s) => s.role === 'chief_engineer' && s.vessels.length === 1);
if (!CHIEF) throw new Error('seed/scenario.ts DEMO_SIGN_INS has no chief engineer with one vessel');
const VESSEL = DEMO_VESSELS.find((v) => v.name === CHIEF.vessels[0]);
if (!VESSEL) throw new Error(`seed/fleet.ts has no vessel ${CHIEF.vessels[0]}`);
/** The vessel's typical sea-passage load in the demo scenario (seed/fleet.ts modeLoadKw.sea). */
const SEA_LOAD_KW = VESSEL.modeLoadKw.sea;

/** The vessel id in a nav key such as "recommend-<id>". */
async function vesselIdFromNav(page: Page, prefix: string): Promise<string> {
  const keys = await page.locator(`nav[aria-label="Main"] [data-nav^="${prefix}-"]`).evaluateAll((links) => links.map((a) => a.getAttribute('data-nav') ?? ''));
  expect(keys).toHaveLength(1);
  return keys[0].slice(prefix.length + 1);
}

const browser = sharedBrowser();

describe('recommendations for a chief engineer', () => {
  it('ranks the combinations for a typed load with the caution, and the guideline shows its bands', async () => {
    const { context, page, outsideRequests } = await freshPage(browser());
    try {
      await signIn(page, CHIEF.email, CHIEF.password);
      const vesselId = await vesselIdFromNav(page, 'recommend');
      // The other pages of the feature are in the navigation too, for the same (own) vessel only.
      for (const prefix of ['guideline', 'plans', 'rules']) expect(await vesselIdFromNav(page, prefix)).toBe(vesselId);

      await page.locator(`[data-nav="recommend-${vesselId}"]`).click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Recommend sets for a load');
      await page.locator('#sp-mode').selectOption('sea');
      await page.locator('#sp-load').fill(String(SEA_LOAD_KW));
      await page.getByRole('button', { name: 'Recommend', exact: true }).click();

      const result = page.locator('[data-result="single-point"]');
      await result.waitFor();
      const rows = result.locator('tr[data-rank]');
      const ranked = await rows.evaluateAll((trs) => trs.map((tr) => ({ rank: Number(tr.getAttribute('data-rank')), sets: tr.getAttribute('data-sets'), fuel: Number(tr.getAttribute('data-fuel-kg-per-h')) })));
      expect(ranked.length).toBeGreaterThan(0);
      // Ranked 1, 2, 3… by fuel rate, least first.
      expect(ranked.map((r) => r.rank)).toEqual(ranked.map((_, i) => i + 1));
      for (let i = 1; i < ranked.length; i++) expect(ranked[i].fuel).toBeGreaterThanOrEqual(ranked[i - 1].fuel);
      // The page shows what the server answered for the same input (best combination and how many are feasible).
      const answer = await page.evaluate(
        async ({ id, loadKw }) => {
          const r = await fetch(`/api/vessels/${id}/recommendations`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ mode: 'sea', loadKw }) });
          return (await r.json()) as { feasible: boolean; combinations: { designations: string[] }[] };
        },
        { id: vesselId, loadKw: SEA_LOAD_KW },
      );
      expect(answer.feasible).toBe(true);
      expect(ranked.length).toBe(answer.combinations.length);
      expect(await result.getAttribute('data-best')).toBe(answer.combinations[0].designations.join('+'));
      expect(await page.getByRole('heading', { name: `Run ${answer.combinations[0].designations.join(' + ')}` }).count()).toBe(1);
      // Every set's load is shown with its unit, and the caution is on the page.
      expect(await rows.first().locator('td').nth(1).textContent()).toMatch(/kW/);
      expect(await page.locator('[data-alert="error"]').filter({ hasText: RECOMMENDATION_CAUTION }).count()).toBeGreaterThan(0);

      await page.locator(`[data-nav="guideline-${vesselId}"]`).click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Operating guideline');
      const sheet = page.locator('.guideline-sheet');
      await sheet.waitFor({ timeout: 45_000 });
      const seaBands = sheet.locator('section[data-mode="sea"] tr[data-band]');
      await expect.poll(() => seaBands.count(), { timeout: 45_000 }).toBeGreaterThan(0);
      // Bands run upward in load, each from below its end, and the typed load falls in the band of the best combination.
      const bands = await seaBands.evaluateAll((trs) => trs.map((tr) => ({ sets: tr.getAttribute('data-band'), fromKw: Number(tr.getAttribute('data-from-kw')), toKw: Number(tr.getAttribute('data-to-kw')) })));
      for (const b of bands) expect(b.fromKw).toBeLessThanOrEqual(b.toKw);
      for (let i = 1; i < bands.length; i++) expect(bands[i].fromKw).toBeGreaterThanOrEqual(bands[i - 1].toKw);
      const band = bands.find((b) => b.fromKw <= SEA_LOAD_KW && SEA_LOAD_KW <= b.toKw);
      if (band) expect(band.sets).toBe(answer.combinations[0].designations.join('+'));
      expect(await sheet.textContent()).toContain(RECOMMENDATION_CAUTION);

      expect(outsideRequests).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('opens the operating rules of the own vessel from the vessel page, with the N-1 reason and the caution', async () => {
    const { context, page } = await freshPage(browser());
    try {
      await signIn(page, CHIEF.email, CHIEF.password);
      await page.locator('nav[aria-label="Main"] [data-nav^="vessel-"]').first().click();
      await page.locator('[data-action="open-rules"]').click();
      await expect.poll(() => page.locator('h1').textContent()).toBe('Operating rules and set status');
      await expect.poll(() => page.locator('form[data-form^="rule-"]').count()).toBe(4);
      // The chief engineer may edit rules (plant:edit) and set status (plant:status): the controls are enabled.
      expect(await page.locator('#rule-manoeuvring-marginPct').isEnabled()).toBe(true);
      // seed/index.ts demoOperatingRules: N-1 when manoeuvring, bus tie open there on a two-section vessel.
      expect(await page.locator('#rule-manoeuvring-nMinus1').isChecked()).toBe(true);
      expect(await page.locator('#rule-manoeuvring-busTieClosed').inputValue()).toBe(VESSEL.busSections.length > 1 ? 'false' : 'true');
      expect(await page.locator('form[data-form="rule-manoeuvring"]').textContent()).toContain('SOLAS II-1/41');
      await expect.poll(() => page.locator('form[data-form^="status-"]').count()).toBe(VESSEL.gensets.filter((g) => g.duty === 'service').length);
      expect(await page.locator('[data-alert="error"]').filter({ hasText: RECOMMENDATION_CAUTION }).count()).toBe(1);
    } finally {
      await context.close();
    }
  });
});
