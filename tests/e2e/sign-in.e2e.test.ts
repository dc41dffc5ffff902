import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_USERS } from '@/seeders/demo-scenario';
import { BASE_URL, launch, shot, signIn } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

describe('sign-in as each demo role', () => {
  for (const user of DEMO_USERS) {
    it(`${user.demoRole} lands on the project list and sees the demo project`, async () => {
      const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
      await signIn(page, user.email, DEMO_PASSWORD);
      await page.waitForURL(/\/projects$/);
      await expect(page.getByRole('heading', { name: 'Projects' }).isVisible()).resolves.toBe(true);
      await expect(page.getByText('Evaporator line 2 controls upgrade').isVisible()).resolves.toBe(
        true,
      );
      await expect(page.getByText(user.name).isVisible()).resolves.toBe(true);
      await shot(page, `projects-${user.demoRole}`);
      await page.close();
    });
  }

  it('a wrong password is refused with a message, and the visitor stays on the sign-in page', async () => {
    const page = await browser.newPage();
    await signIn(page, DEMO_USERS[1].email, 'not-the-password');
    // Next's own route announcer is also an alert region, so find ours by its words.
    await page.getByText('That e-mail and password do not match an active account.').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.close();
  });

  it('a signed-out visitor is sent to sign-in, and the API answers 401', async () => {
    const page = await browser.newPage();
    await page.goto(`${BASE_URL()}/projects/1`);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    const res = await fetch(`${BASE_URL()}/api/projects/1/settings`);
    expect(res.status).toBe(401);
    await page.close();
  });

  it('the engineer sees the demo counts on the overview, at desktop and tablet sizes', async () => {
    const page = await browser.newPage({ viewport: { width: 1024, height: 768 } });
    await signIn(page, DEMO_USERS.find((u) => u.demoRole === 'engineer')!.email, DEMO_PASSWORD);
    await page.waitForURL(/\/projects$/);
    await page.getByText('Evaporator line 2 controls upgrade').click();
    await page.waitForURL(/\/projects\/\d+$/);
    const counts = page.getByRole('definition');
    await expect(counts.first().textContent()).resolves.toMatch(/^\d+$/);
    const terminals = Number(await page.locator('dt:text("Terminals") + dd').textContent());
    expect(terminals).toBeGreaterThanOrEqual(150);
    await shot(page, 'overview-engineer-1024');
    await page.close();
  });

  it('a technician sees the assumptions read-only, and the API refuses a change with 403', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, DEMO_USERS.find((u) => u.demoRole === 'technician')!.email, DEMO_PASSWORD);
    await page.waitForURL(/\/projects$/);
    await page.getByText('Evaporator line 2 controls upgrade').click();
    await page.getByRole('link', { name: 'Assumptions' }).click();
    await page.waitForURL(/settings$/);
    await expect(page.getByLabel('Cabinet ambient (°C)').isDisabled()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Save assumptions' }).count()).resolves.toBe(0);
    const projectPath = new URL(page.url()).pathname.replace(/\/settings$/, '');
    const current = await page.request.get(`${BASE_URL()}/api${projectPath}/settings`);
    const settings = await current.json();
    const refused = await page.request.patch(`${BASE_URL()}/api${projectPath}/settings`, {
      data: { ...settings, ambientC: 60 },
    });
    expect(refused.status()).toBe(403);
    const after = await (await page.request.get(`${BASE_URL()}/api${projectPath}/settings`)).json();
    expect(after).toEqual(settings);
    await context.close();
  });
});
