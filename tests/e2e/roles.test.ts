import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO_VESSELS } from '../../seed/fleet';
import { DEMO_SIGN_INS } from '../../seed/scenario';
import { freshPage, sharedBrowser, signIn, submitSignIn } from './browser';

// What each role must see in the navigation. Written out by hand from the capability table in shared/roles.ts
// (users:manage, outbox:read, company:settings, audit:read; reports:read for the fleet benchmark and fleet report;
// fleet:read, i.e. everyone, for fuel prices and subscriptions), so a change to either side shows up here.
const COMPANY_LINKS = ['users', 'outbox', 'settings', 'audit', 'fuel-prices', 'fleet-benchmark', 'fleet-report', 'subscriptions'] as const;
const EXPECTED_COMPANY_LINKS: Record<string, readonly (typeof COMPANY_LINKS)[number][]> = {
  admin: ['users', 'outbox', 'settings', 'audit', 'fuel-prices', 'fleet-benchmark', 'fleet-report', 'subscriptions'],
  superintendent: ['audit', 'fuel-prices', 'fleet-benchmark', 'fleet-report', 'subscriptions'],
  chief_engineer: ['fuel-prices', 'subscriptions'],
  energy_officer: ['fuel-prices', 'fleet-benchmark', 'fleet-report', 'subscriptions'],
  planner: ['fuel-prices', 'subscriptions'],
};

const ALL_VESSEL_NAMES = DEMO_VESSELS.map((v) => v.name).sort();

/** One demo sign-in per role (the first chief engineer stands for all of them). */
const ONE_PER_ROLE = Object.keys(EXPECTED_COMPANY_LINKS).map((role) => {
  const entry = DEMO_SIGN_INS.find((s) => s.role === role);
  if (!entry) throw new Error(`seed/scenario.ts DEMO_SIGN_INS has no ${role}`);
  return entry;
});

async function navKeys(page: Page): Promise<string[]> {
  return page.locator('nav[aria-label="Main"] [data-nav]').evaluateAll((links) => links.map((a) => a.getAttribute('data-nav') ?? ''));
}

async function vesselLinkNames(page: Page): Promise<string[]> {
  const names = await page.locator('nav[aria-label="Main"] [data-nav^="vessel-"]').allTextContents();
  return names.map((n) => n.trim()).sort();
}

const browser = sharedBrowser();

describe('signed-in navigation follows the role', () => {
  it.each(ONE_PER_ROLE.map((s) => [s.role, s] as const))('%s sees its own pages and vessels, and signs out', async (_role, demo) => {
    const { context, page, outsideRequests } = await freshPage(browser());
    try {
      await signIn(page, demo.email, demo.password);
      await page.locator('[data-nav="fleet"]').waitFor();
      await expect.poll(() => page.locator('[data-user-name]').textContent()).toBe(demo.name);

      // Company pages: exactly the ones the role may open.
      const keys = await navKeys(page);
      expect(keys.filter((k) => (COMPANY_LINKS as readonly string[]).includes(k)).sort()).toEqual([...EXPECTED_COMPANY_LINKS[demo.role]].sort());

      // Vessels: a chief engineer sees only their own, everyone else the whole fleet (from seed/fleet.ts).
      const expectedVessels = demo.vessels.length > 0 ? [...demo.vessels].sort() : ALL_VESSEL_NAMES;
      await expect.poll(() => vesselLinkNames(page)).toEqual(expectedVessels);
      await expect.poll(() => page.locator('[data-list="fleet"] > li').count()).toBe(expectedVessels.length);

      if (demo.role === 'admin') {
        await page.locator('[data-nav="users"]').click();
        await expect.poll(() => page.locator('h1').textContent()).toBe('Users and invitations');
        await page.locator('[data-nav="outbox"]').click();
        await expect.poll(() => page.locator('h1').textContent()).toBe('Outbox');
      } else if (!EXPECTED_COMPANY_LINKS[demo.role].includes('users')) {
        // Typing the address does not open the page either (the server refuses the data as well).
        await page.goto('/admin/users');
        await page.locator('[data-state="forbidden"]').waitFor();
      }

      await page.locator('[data-action="sign-out"]').click();
      await page.waitForURL((url) => url.pathname === '/sign-in');
      await expect.poll(() => page.locator('h1').textContent()).toBe('Sign in to Kilowatch');
      // The session is really gone: a signed-in page sends the visitor back to sign-in.
      await page.goto('/');
      await page.waitForURL((url) => url.pathname === '/sign-in');

      expect(outsideRequests).toEqual([]);
    } finally {
      await context.close();
    }
  });
});

describe('sign-in', () => {
  it('shows an error and stays on the sign-in page for a wrong password', async () => {
    const { context, page } = await freshPage(browser());
    try {
      const admin = ONE_PER_ROLE[0];
      await submitSignIn(page, admin.email, `${admin.password}-wrong`);
      const alert = page.locator('[data-alert="error"]');
      await alert.waitFor();
      expect(await alert.textContent()).toContain('wrong');
      expect(new URL(page.url()).pathname).toBe('/sign-in');
      expect(await page.locator('[data-nav]').count()).toBe(0);
    } finally {
      await context.close();
    }
  });
});
