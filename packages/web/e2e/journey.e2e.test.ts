import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';

import { capture, checkPage, launchBrowser, openApp, PHONE, type Watched } from './browser';

const baseUrl = inject('baseUrl');
const DEMO_PASSWORD = 'workback-demo';

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL('**/students');
  await page.getByRole('heading', { name: 'Students', exact: true }).waitFor();
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).first().click();
  await page.waitForURL('**/sign-in');
  await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
}

/** Names in the students table (wide screens). */
async function tableNames(page: Page) {
  await page.locator('.wb-table .wb-cell-strong').first().waitFor();
  return page.locator('.wb-table .wb-cell-strong').allInnerTexts();
}

/** The path of the address-confirmation link mailed to `email`, from the fake server's outbox. */
async function confirmationPath(email: string): Promise<string> {
  let link: string | undefined;
  await expect
    .poll(async () => {
      const res = await fetch(`${baseUrl}/api/dev/outbox`);
      const { items } = (await res.json()) as {
        items: { to: string; subject: string; links: string[] }[];
      };
      link = items
        .find((m) => m.to.includes(email) && /Confirm your e-mail/.test(m.subject))
        ?.links.find((l) => l.includes('/verify-email/'));
      return link !== undefined;
    })
    .toBe(true);
  return new URL(link!).pathname;
}

function expectCleanRun(watched: Watched) {
  expect(watched.foreignRequests, 'requests to other sites').toEqual([]);
  expect(watched.cspViolations, 'CSP violations').toEqual([]);
}

describe('a new household', () => {
  it('creates an account, adds a student, signs out and back in', async () => {
    const watched = await openApp(browser, baseUrl);
    const { page } = watched;
    const email = `e2e-${Date.now()}@example.test`;

    await page.goto('/');
    await page.waitForURL('**/sign-in');
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    await checkPage(page, 'sign-in');

    await page.getByRole('link', { name: /create an account/i }).click();
    await page.waitForURL('**/create-account');
    await page.getByRole('heading', { name: 'Create an account', exact: true }).waitFor();
    await checkPage(page, 'create-account');

    await page.getByRole('button', { name: 'Create account' }).click();
    await expect.poll(() => page.getByText('Give your household a name.').isVisible()).toBe(true);
    await expect
      .poll(() => page.getByText(/Only a parent or guardian can create a household/).isVisible())
      .toBe(true);
    await capture(page, 'create-account-errors');

    await page.getByLabel('Household name').fill('Birch Lane Learners');
    await page.getByLabel('Your name').fill('Alex');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('squared paper 1');
    // A parent ticks the box by its words (Blueprint draws its own box over the real input).
    await page.getByText(/I am an adult/).click();
    expect(await page.getByRole('checkbox', { name: /I am an adult/ }).isChecked()).toBe(true);
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.waitForURL('**/students');
    await page.getByText('No students yet. Add your first child to start a notebook.').waitFor();
    expect(await page.getByText('Birch Lane Learners').first().isVisible()).toBe(true);
    await checkPage(page, 'students-empty');

    // A new account is asked to confirm its address; the mailed link does it.
    expect(await page.getByText('Please confirm your e-mail address').isVisible()).toBe(true);
    await page.goto(await confirmationPath(email));
    await page.getByRole('button', { name: 'Confirm my address' }).click();
    await page.getByText(`Thank you: ${email} is confirmed.`).waitFor();
    await checkPage(page, 'verify-email');
    await page.getByRole('link', { name: 'Open Workback' }).click();
    await page.waitForURL('**/students');
    await page.getByText('No students yet. Add your first child to start a notebook.').waitFor();
    expect(await page.getByText('Please confirm your e-mail address').count()).toBe(0);

    await page.getByRole('button', { name: 'Add a student' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    await checkPage(page, 'student-dialog');
    await dialog.getByLabel('First name or nickname').fill('Wren');
    await dialog.getByLabel('Grade').selectOption('3');
    await dialog.getByRole('button', { name: 'Add student' }).click();
    await dialog.waitFor({ state: 'detached' });
    expect(await tableNames(page)).toEqual(['Wren']);
    expect(await page.locator('.wb-table').getByText('Grade 3').isVisible()).toBe(true);
    await page.getByText('Added Wren.').waitFor({ state: 'detached', timeout: 10_000 });
    await checkPage(page, 'students');

    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Account' })
      .click();
    await page.getByRole('heading', { name: 'Account', exact: true }).waitFor();
    expect(await page.getByText(email).isVisible()).toBe(true);
    await checkPage(page, 'account');

    await signOut(page);
    await page.goto('/students');
    await page.waitForURL('**/sign-in?redirectTo=%2Fstudents');

    await signIn(page, email, 'squared paper 1');
    expect(await tableNames(page)).toEqual(['Wren']);
    await signOut(page);
    expectCleanRun(watched);
    await watched.context.close();
  });

  it('says so when the password is wrong', async () => {
    const watched = await openApp(browser, baseUrl);
    const { page } = watched;
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('parent@workback.test');
    await page.getByLabel('Password').fill('not the password');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByText('That e-mail and password do not match an account.').waitFor();
    await capture(page, 'sign-in-wrong-password');
    await watched.context.close();
  });
});

describe('the demo household', () => {
  it('shows the demo sign-ins; the owner sees and can change both children', async () => {
    const watched = await openApp(browser, baseUrl);
    const { page } = watched;
    await page.goto('/sign-in');
    await page.getByText('Try the demo household').waitFor();
    await page.getByRole('button', { name: /^parent@workback\.test/ }).click();
    expect(await page.getByLabel('Password').inputValue()).toBe(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL('**/students');
    expect(await tableNames(page)).toHaveLength(2);
    expect(await page.getByRole('button', { name: /^Edit / }).count()).toBe(2);
    await checkPage(page, 'students-demo-owner');

    await page.setViewportSize(PHONE);
    const cards = page.getByRole('list', { name: 'Students' });
    await cards.waitFor();
    expect(await cards.getByRole('listitem').count()).toBe(2);
    // Less frequent pages sit behind “More” on the phone bar.
    const phoneNav = page.getByRole('navigation', { name: 'Main (phone)' });
    await phoneNav.getByRole('button', { name: 'More' }).click();
    await phoneNav.getByRole('link', { name: 'Account' }).click();
    await page.getByRole('heading', { name: 'Account', exact: true }).waitFor();
    await signOut(page);
    expectCleanRun(watched);
    await watched.context.close();
  });

  it('the tutor sees only the one child shared with them, read-only', async () => {
    const watched = await openApp(browser, baseUrl);
    const { page } = watched;
    await signIn(page, 'tutor@workback.test', DEMO_PASSWORD);
    expect(await tableNames(page)).toHaveLength(1);
    expect(await page.getByRole('button', { name: 'Add a student' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /^Edit / }).count()).toBe(0);
    await checkPage(page, 'students-demo-tutor');
    await signOut(page);
    await watched.context.close();
  });

  it('the site admin is told that admins see no children’s data', async () => {
    const watched = await openApp(browser, baseUrl);
    const { page } = watched;
    await signIn(page, 'admin@workback.test', DEMO_PASSWORD);
    await page.getByText('Site admins see no children’s data').waitFor();
    await checkPage(page, 'students-demo-admin');
    await signOut(page);
    await watched.context.close();
  });
});
