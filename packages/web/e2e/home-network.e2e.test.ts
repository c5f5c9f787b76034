import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';

import { capture, launchBrowser, openApp, PHONE, WIDE } from './browser';

// The server as a phone on the home Wi-Fi sees it: plain http at a name that is not loopback
// (browsers treat http://127.0.0.1 and http://localhost as secure, so they would hide the fault).
const baseUrl = inject('baseUrl');
const homeUrl = baseUrl.replace('127.0.0.1', 'workback.home');

let browser: Browser;

/** The sign-in page asks who is signed in first; the browser logs that 401 itself. */
const signedOutAnswersAside = (errors: string[]) =>
  errors.filter((text) => !text.includes('(Unauthorized)'));

beforeAll(async () => {
  browser = await launchBrowser(['--host-resolver-rules=MAP workback.home 127.0.0.1']);
});

afterAll(async () => {
  await browser?.close();
});

describe('on the home network', () => {
  it('opens over plain http at a home-network name and signs in on a phone', async () => {
    const watched = await openApp(browser, homeUrl, PHONE);
    const { page } = watched;
    const response = await page.goto('/sign-in');
    expect(response?.headers()['content-security-policy']).not.toMatch(/upgrade-insecure-requests/);
    expect(await page.evaluate(() => window.isSecureContext)).toBe(false);

    // Rendered, not blank: the form came from the app's own scripts and styles over http.
    await page.getByLabel('E-mail').fill('parent@workback.test');
    await page.getByLabel('Password').fill('workback-demo');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${homeUrl}/students`);
    await page.getByRole('heading', { name: 'Students', exact: true }).waitFor();
    expect(await page.evaluate(() => getComputedStyle(document.body).fontFamily)).toMatch(/Plex/);
    await capture(page, 'home-network-students', PHONE);

    // No service worker here (browsers allow one only over https or on localhost): the notebook
    // still opens, its rows showing the small square photos.
    expect(await page.evaluate(() => 'serviceWorker' in navigator)).toBe(false);
    await page.goto('/notebook');
    const thumb = page.locator('ul[aria-label="Misses"] img.wb-thumb').first();
    await thumb.waitFor();
    const size = await thumb.evaluate(async (img: HTMLImageElement) => {
      await img.decode();
      return [img.naturalWidth, img.naturalHeight];
    });
    expect(size).toEqual([128, 128]);

    expect(watched.foreignRequests, 'requests to other sites').toEqual([]);
    expect(signedOutAnswersAside(watched.consoleErrors), 'console errors').toEqual([]);
    expect(watched.cspViolations, 'CSP violations').toEqual([]);
    await watched.context.close();
  });

  it('shows the notebook as a table on a wide screen with nothing refused by the CSP (the table watches its size without inline styles)', async () => {
    const watched = await openApp(browser, homeUrl, WIDE);
    const { page } = watched;
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('parent@workback.test');
    await page.getByLabel('Password').fill('workback-demo');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${homeUrl}/students`);
    await page.goto('/notebook');
    const table = page.getByRole('region', { name: 'Misses' });
    await table.locator('.bp6-table-cell').first().waitFor();
    await capture(page, 'home-network-notebook-table');

    // Each row's step error is read whole: a rule's title wraps within the column, never cut at
    // its edge; only a pair's two titles may run past three lines, and then the cell's tooltip
    // holds the whole of it.
    const stepErrors = table.locator('.bp6-table-cell-col-7 .wb-row-hit');
    expect(await stepErrors.count()).toBeGreaterThan(5);
    const cut = await stepErrors.evaluateAll((cells) =>
      cells
        .filter((cell) => {
          const parts = [cell, ...cell.querySelectorAll('*')];
          const wide = parts.some((el) => el.scrollWidth > el.clientWidth + 1);
          const tall = parts.some((el) => el.scrollHeight > el.clientHeight + 1);
          const title = cell.closest('.bp6-table-cell')?.getAttribute('title');
          const text = cell.textContent ?? '';
          return wide || (tall && !(text.includes(' + ') && title === text));
        })
        .map((cell) => cell.textContent),
    );
    expect(cut, 'step errors cut short').toEqual([]);

    expect(signedOutAnswersAside(watched.consoleErrors), 'console errors').toEqual([]);
    expect(watched.cspViolations, 'CSP violations').toEqual([]);
    await watched.context.close();
  });
});
