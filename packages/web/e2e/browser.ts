import { existsSync, mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';

import axe from 'axe-core';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { expect } from 'vitest';

export const screenshotDir = resolve(import.meta.dirname, '../../../.screenshots');

export const WIDE = { width: 1280, height: 900 };
export const PHONE = { width: 390, height: 844 };

const CHROMIUM = '/usr/bin/chromium';

/** Debian's Chromium; `extraArgs` add to the usual flags (a host mapping, say). */
export function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  if (!existsSync(CHROMIUM)) {
    throw new Error(
      `Chromium is not installed at ${CHROMIUM}: install Debian's chromium package (apt-get install chromium; .ci/run does it when missing)`,
    );
  }
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
      ...extraArgs,
    ],
  });
}

export type Watched = {
  context: BrowserContext;
  page: Page;
  /** Requests that left the app's own origin (there must be none: fonts are bundled). */
  foreignRequests: string[];
  /** Console errors and uncaught exceptions. */
  consoleErrors: string[];
  /** What the server's strict CSP blocked. */
  cspViolations: string[];
};

const CSP_REPORT = 'workback-csp-violation';

/** A fresh browser context (its own cookies) on the app, watching what the page does. */
export async function openApp(
  browser: Browser,
  baseUrl: string,
  viewport = WIDE,
): Promise<Watched> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport });
  const page = await context.newPage();
  const foreignRequests: string[] = [];
  const consoleErrors: string[] = [];
  const cspViolations: string[] = [];
  // Runs through the DevTools protocol, so the page's CSP does not apply to this listener itself.
  await context.addInitScript((tag) => {
    document.addEventListener('securitypolicyviolation', (event) => {
      console.info(tag, event.effectiveDirective, event.blockedURI, event.sourceFile);
    });
  }, CSP_REPORT);
  page.on('request', (request) => {
    const url = request.url();
    if (!url.startsWith(baseUrl) && !url.startsWith('data:') && !url.startsWith('blob:')) {
      foreignRequests.push(url);
    }
  });
  page.on('console', (message) => {
    const text = message.text();
    if (text.startsWith(CSP_REPORT)) {
      cspViolations.push(text);
      return;
    }
    if (message.type() === 'error') consoleErrors.push(text);
  });
  page.on('pageerror', (error) => consoleErrors.push(error.message));
  return { context, page, foreignRequests, consoleErrors, cspViolations };
}

/**
 * Runs axe-core in the page. The app's CSP forbids inline scripts, so axe is evaluated through
 * the DevTools protocol instead of an injected <script> tag, and the CSP stays in force.
 */
export async function expectNoSeriousA11yProblems(page: Page, where: string) {
  // A dialog fading in is read with its text half transparent: wait for transitions to end.
  await page.waitForFunction(() =>
    document.getAnimations().every((a) => a.playState !== 'running'),
  );
  await page.evaluate(axe.source);
  const violations = await page.evaluate(async () => {
    const result = await (window as unknown as { axe: typeof axe }).axe.run(document, {
      resultTypes: ['violations'],
    });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      nodes: v.nodes.slice(0, 3).map((n) => n.target.join(' ')),
    }));
  });
  const serious = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(serious, `accessibility problems on ${where}`).toEqual([]);
}

/** Saves the page at 1280 px and 390 px wide under .screenshots/, then returns to `back`. */
export async function capture(page: Page, name: string, back = WIDE) {
  mkdirSync(screenshotDir, { recursive: true });
  for (const [label, size] of [
    ['1280', WIDE],
    ['390', PHONE],
  ] as const) {
    await page.setViewportSize(size);
    await page.waitForTimeout(250);
    await page.screenshot({ path: join(screenshotDir, `${name}-${label}.png`), fullPage: true });
  }
  await page.setViewportSize(back);
  await page.waitForTimeout(150);
}

/** Checks the page at both widths for accessibility, and saves its screenshots. */
export async function checkPage(page: Page, name: string, back = WIDE) {
  await expectNoSeriousA11yProblems(page, `${name} (1280 px)`);
  await page.setViewportSize(PHONE);
  await page.waitForTimeout(250);
  await expectNoSeriousA11yProblems(page, `${name} (390 px)`);
  await capture(page, name, back);
}
