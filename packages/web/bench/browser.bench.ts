import { appendFileSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';

import { type Browser, type BrowserContext, type Page } from 'playwright-core';
import sharp from 'sharp';

import { launchBrowser } from '../e2e/browser';
import { startBuiltServer } from '../e2e/built-server';

/**
 * The lab profile "slow 4G" of issue 12: 150 ms round trip, 1.6 Mbit/s down, 750 kbit/s up.
 * Chromium applies it per request through the DevTools protocol (throughput in bytes/s).
 */
const SLOW_4G = {
  offline: false,
  latency: 150,
  downloadThroughput: 1_600_000 / 8,
  uploadThroughput: 750_000 / 8,
};
const PHONE = { width: 390, height: 844 };
const RUNS = Number(process.env.BENCH_BROWSER_RUNS ?? 3);
const TARGET = { coldMs: 3000, coldBytes: 400 * 1024, saveMs: 8000 };

type Figure = { area: string; measure: string; value: string; target?: string; met?: boolean };

/** Appends headline figures for the root `npm run bench` table (BENCH_REPORT, one JSON a line). */
function report(figures: readonly Figure[]): void {
  const file = process.env.BENCH_REPORT;
  if (file) appendFileSync(file, figures.map((f) => `${JSON.stringify(f)}\n`).join(''));
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
};
const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
const kilobytes = (bytes: number) => `${Math.round(bytes / 1024).toLocaleString('en')} KB`;

/**
 * A 12 MP (4000×3000) JPEG that compresses like a phone photo of a worksheet: paper-coloured
 * gradients, fine sensor-like noise and pencil strokes, at the quality phones use.
 */
async function twelveMegapixelPhoto(): Promise<Buffer> {
  const width = 4000;
  const height = 3000;
  const grain = await sharp({
    create: {
      width,
      height,
      channels: 3,
      background: '#808080',
      noise: { type: 'gaussian', mean: 128, sigma: 9 },
    },
  })
    .raw()
    .toBuffer();
  const light = Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">
      <defs><radialGradient id="g" cx="0.4" cy="0.35" r="0.9">
        <stop offset="0" stop-color="#f4efe2"/><stop offset="1" stop-color="#9c9482"/>
      </radialGradient></defs>
      <rect width="100%" height="100%" fill="url(#g)"/>
      ${Array.from(
        { length: 60 },
        (_, i) =>
          `<path d="M${150 + (i % 10) * 370} ${300 + Math.floor(i / 10) * 430} q 80 ${60 + (i % 7) * 25} 160 0 t 160 ${20 + (i % 5) * 12}" stroke="#3b3a40" stroke-width="${7 + (i % 4)}" fill="none"/>`,
      ).join('')}
    </svg>`,
  );
  return sharp(light)
    .composite([
      { input: grain, raw: { width, height, channels: 3 }, blend: 'soft-light' as const },
    ])
    .jpeg({ quality: 95, chromaSubsampling: '4:4:4' })
    .toBuffer();
}

type Load = { ms: number; bytes: number; requests: number };

/**
 * Counts what crosses the wire for one page (headers included: Chromium's encodedDataLength),
 * under the slow 4G profile.
 */
async function throttle(context: BrowserContext, page: Page) {
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', SLOW_4G);
  let bytes = 0;
  let requests = 0;
  let lastActivity = performance.now();
  let origin = performance.now();
  const started = new Map<string, { url: string; at: number }>();
  const sizes: { url: string; bytes: number; start: number; end: number }[] = [];
  cdp.on('Network.requestWillBeSent', (event) => {
    requests += 1;
    started.set(event.requestId, { url: event.request.url, at: performance.now() - origin });
    lastActivity = performance.now();
  });
  cdp.on('Network.loadingFinished', (event) => {
    bytes += event.encodedDataLength;
    const start = started.get(event.requestId);
    sizes.push({
      url: start?.url ?? '?',
      bytes: event.encodedDataLength,
      start: start?.at ?? 0,
      end: performance.now() - origin,
    });
    lastActivity = performance.now();
  });
  cdp.on('Network.loadingFailed', () => {
    lastActivity = performance.now();
  });
  return {
    reset() {
      bytes = 0;
      requests = 0;
      sizes.length = 0;
      origin = performance.now();
    },
    /** Every transfer in the order they finished, for BENCH_VERBOSE runs. */
    waterfall: () =>
      [...sizes]
        .sort((a, b) => a.end - b.end)
        .map((s) => ({
          url: new URL(s.url).pathname.slice(0, 48),
          size: kilobytes(s.bytes),
          start: Math.round(s.start),
          end: Math.round(s.end),
        })),
    /** Waits until nothing has moved for `quietMs`, so late requests (icons, images) count too. */
    async settled(quietMs = 1500) {
      while (performance.now() - lastActivity < quietMs) {
        await new Promise((done) => setTimeout(done, 100));
      }
      return { bytes, requests };
    },
  };
}

const firstNotebookRow = (page: Page) =>
  page.locator('ul[aria-label="Misses"] > li, [aria-label="Misses"] .bp6-table-cell').first();

async function openNotebook(page: Page, meter: Awaited<ReturnType<typeof throttle>>) {
  meter.reset();
  const start = performance.now();
  await page.goto('/notebook', { waitUntil: 'commit' });
  await firstNotebookRow(page).waitFor({ timeout: 120_000 });
  const ms = performance.now() - start;
  const { bytes, requests } = await meter.settled();
  return { ms, bytes, requests } satisfies Load;
}

async function signedInState(browser: Browser, baseUrl: string) {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: PHONE });
  const page = await context.newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('parent@workback.test');
  await page.getByLabel('Password').fill('workback-demo');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL('**/students');
  const state = await context.storageState();
  await context.close();
  return state;
}

async function saveMissWithPhoto(page: Page, photoFile: string): Promise<number> {
  await page.goto('/misses/new');
  await page.getByRole('heading', { name: 'Log a miss', exact: true }).waitFor();
  await page.getByLabel('Student').selectOption({ label: 'Wren' });
  await page.getByLabel('The problem').fill('58 + 27');
  await page.getByLabel('The child’s answer').fill('715');
  await page.getByLabel('Photos of the work').setInputFiles(photoFile);
  await page.getByRole('img', { name: 'Photo 1 to send' }).waitFor({ timeout: 60_000 });
  const start = performance.now();
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await page.waitForURL(/\/misses\/\d+$/, { timeout: 120_000 });
  await page.getByRole('heading', { name: '58 + 27', exact: true }).waitFor();
  return performance.now() - start;
}

export async function benchBrowser(): Promise<void> {
  const work = await mkdtemp(join(tmpdir(), 'workback-bench-web-'));
  const photo = await twelveMegapixelPhoto();
  const photoFile = join(work, 'worksheet-12mp.jpg');
  await writeFile(photoFile, photo);

  // The browser first: a machine without Chromium stops here, before a server is left running.
  const browser = await launchBrowser();
  const server = await startBuiltServer({ SIGN_IN_LIMIT_PER_MINUTE: '1000', LOG_LEVEL: 'silent' });
  try {
    const storageState = await signedInState(browser, server.baseUrl);
    const cold: Load[] = [];
    const warm: Load[] = [];
    const saves: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      // A fresh context has an empty HTTP cache: the cold open. The same page opened again is warm.
      const context = await browser.newContext({
        baseURL: server.baseUrl,
        viewport: PHONE,
        storageState,
      });
      const page = await context.newPage();
      const meter = await throttle(context, page);
      cold.push(await openNotebook(page, meter));
      if (process.env.BENCH_VERBOSE) console.table(meter.waterfall());
      await page.goto('about:blank');
      warm.push(await openNotebook(page, meter));
      saves.push(await saveMissWithPhoto(page, photoFile));
      await context.close();
    }

    const coldMs = median(cold.map((l) => l.ms));
    const coldBytes = median(cold.map((l) => l.bytes));
    const warmMs = median(warm.map((l) => l.ms));
    const warmBytes = median(warm.map((l) => l.bytes));
    const saveMs = median(saves);
    console.log(
      `\nBrowser on slow 4G (150 ms RTT, 1.6 Mbit/s down, 750 kbit/s up), 390 px phone, ` +
        `signed in, medians of ${RUNS} runs`,
    );
    console.table([
      ...cold.map((l, i) => ({
        run: i + 1,
        open: 'cold',
        'first row': seconds(l.ms),
        'on the wire': kilobytes(l.bytes),
        requests: l.requests,
      })),
      ...warm.map((l, i) => ({
        run: i + 1,
        open: 'warm',
        'first row': seconds(l.ms),
        'on the wire': kilobytes(l.bytes),
        requests: l.requests,
      })),
    ]);
    console.log(
      `save a miss with a ${(photo.length / 1024 / 1024).toFixed(1)} MB 12 MP JPEG: ` +
        saves.map(seconds).join(', '),
    );
    report([
      {
        area: 'web, slow 4G',
        measure: 'cold open: notebook first row (median)',
        value: seconds(coldMs),
        target: '≤ 3 s',
        met: coldMs <= TARGET.coldMs,
      },
      {
        area: 'web, slow 4G',
        measure: 'cold open: bytes on the wire',
        value: kilobytes(coldBytes),
        target: '≤ 400 KB',
        met: coldBytes <= TARGET.coldBytes,
      },
      { area: 'web, slow 4G', measure: 'warm open: notebook first row', value: seconds(warmMs) },
      {
        area: 'web, slow 4G',
        measure: 'warm open: bytes on the wire',
        value: kilobytes(warmBytes),
      },
      {
        area: 'web, slow 4G',
        measure: `save a miss with a ${(photo.length / 1024 / 1024).toFixed(1)} MB 12 MP photo`,
        value: seconds(saveMs),
        target: '≤ 8 s',
        met: saveMs <= TARGET.saveMs,
      },
    ]);
  } finally {
    await browser.close();
    await server.stop();
    await rm(work, { recursive: true, force: true });
  }
}
