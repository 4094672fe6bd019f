import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';

/** Debian's chromium package; scripts/test.ts installs it when missing. */
export const CHROMIUM_PATH = '/usr/bin/chromium';

/** Address of the server under test, e.g. http://127.0.0.1:41234 (no trailing slash). */
export function baseUrl(): string {
  const url = process.env.E2E_BASE_URL;
  if (!url) throw new Error('Browser tests need E2E_BASE_URL, the address of a running Kilowatch server (scripts/test.ts sets it)');
  return url.replace(/\/+$/, '');
}

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

/**
 * A fresh context (own cookies) with one page whose relative URLs resolve against the server under test. Any
 * request that leaves that server fails the page: the client bundles everything and loads nothing from outside.
 */
export async function freshPage(browser: Browser): Promise<{ context: BrowserContext; page: Page; outsideRequests: string[] }> {
  const origin = new URL(baseUrl()).origin;
  const context = await browser.newContext({ baseURL: baseUrl() });
  const outsideRequests: string[] = [];
  await context.route('**/*', (route) => {
    const url = route.request().url();
    if (url.startsWith(origin) || url.startsWith('data:') || url.startsWith('blob:')) return route.continue();
    outsideRequests.push(url);
    return route.abort();
  });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  return { context, page, outsideRequests };
}

/**
 * One browser for the test file: launched before its first test, closed after its last. Call at the top level of
 * a test file; the returned function gives the running browser inside a test.
 */
export function sharedBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error('sharedBrowser(): the browser is not running (call it at the top level of the test file)');
    return browser;
  };
}

/** Fills and submits the sign-in form; does not wait for the outcome (a wrong password stays on the form). */
export async function submitSignIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  await page.locator('#sign-in-email').fill(email);
  await page.locator('#sign-in-password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

/** Signs in and waits for the signed-in navigation (its fleet entry). */
export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await submitSignIn(page, email, password);
  await page.locator('[data-nav="fleet"]').waitFor();
}
