/**
 * The guard recipe builder as a controls engineer uses it: start from a preset (its typical
 * values are labelled as such), change a figure in engineering notation, see a bad figure
 * refused in place, save, and find the recipe as saved; other roles only read it.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launch, shot, signIn } from './browser';

const PASSWORD = 'crossfault-demo';
const ENGINEER = 'orla.engineer@vessmoor.example';
const TECHNICIAN = 'bram.technician@vessmoor.example';
const PROJECT = 'Evaporator line 2 controls upgrade';

let browser: Browser;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(email: string, viewport = { width: 1440, height: 900 }) {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  page.setDefaultTimeout(30_000);
  await signIn(page, email, PASSWORD);
  await page.waitForURL(/\/projects/);
  return { context, page };
}

async function projectId(page: Page): Promise<number> {
  await page.goto(`${BASE_URL()}/projects`);
  const href = await page.getByRole('link', { name: PROJECT }).first().getAttribute('href');
  return Number(/\/projects\/(\d+)/.exec(href ?? '')?.[1]);
}

describe('guard recipe builder', () => {
  it('builds a recipe from a preset with engineering notation, refuses a bad figure in place, and saves it', async () => {
    const { page, context } = await signedIn(ENGINEER);
    const project = await projectId(page);
    await page.goto(`${BASE_URL()}/projects/${project}/guards`);
    await page.getByRole('link', { name: 'New recipe' }).click();
    await page.waitForURL(/\/guards\/new$/);

    await page
      .getByLabel('Start from a preset')
      .selectOption({ label: '0–10 V analog voltage input' });
    await page
      .getByTestId('typical-caution')
      .filter({ hasText: "typical — verify against the actual part's datasheet" })
      .waitFor();
    await page.getByLabel('Name').fill('0–10 V input, 4k99 series');

    const series = page.getByRole('group', { name: 'Series element' });
    const resistance = series.getByLabel(/^Resistance/);
    await resistance.fill('4q');
    const error = series.getByText(/unknown unit or suffix/);
    await error.waitFor();
    expect(await resistance.getAttribute('aria-invalid')).toBe('true');
    await page.getByRole('button', { name: 'Create recipe' }).click();
    await page.getByRole('alert').filter({ hasText: 'nothing was saved' }).waitFor();
    expect(page.url()).toMatch(/\/guards\/new$/);

    await resistance.fill('4k99');
    await series.getByLabel(/^Rated power/).fill('0.25W');
    expect(await resistance.getAttribute('aria-invalid')).toBeNull();
    // The schematic redraws from the figures as typed.
    await page.getByTestId('guard-schematic').getByText('4.99 kΩ').waitFor();

    await page.getByRole('button', { name: 'Create recipe' }).click();
    await page.waitForURL(/\/guards\/\d+$/);
    const recipeId = Number(/\/guards\/(\d+)$/.exec(page.url())?.[1]);

    const res = await page.request.get(`${BASE_URL()}/api/projects/${project}/guard-recipes`);
    const saved = (
      (await res.json()) as {
        items: Array<{
          id: number;
          name: string;
          guard: { stages: Array<{ series: Record<string, number> }> };
        }>;
      }
    ).items.find((r) => r.id === recipeId)!;
    expect(saved.name).toBe('0–10 V input, 4k99 series');
    // Stored in SI: 4k99 → 4990 Ω, 0.25W → 0.25 W (IEC 60062 RKM code for the first).
    expect(saved.guard.stages[0].series.resistance).toBe(4990);
    expect(saved.guard.stages[0].series.ratedPower).toBe(0.25);

    await page.reload();
    expect(
      await page
        .getByRole('group', { name: 'Series element' })
        .getByLabel(/^Resistance/)
        .inputValue(),
    ).toBe('4.99 kΩ');
    await page.getByTestId('guard-schematic').scrollIntoViewIfNeeded();
    await shot(page, 'guard-builder-1440');
    await context.close();
  });

  it('shows recipes read-only to a technician', async () => {
    const { page, context } = await signedIn(TECHNICIAN, { width: 1024, height: 768 });
    const project = await projectId(page);
    await page.goto(`${BASE_URL()}/projects/${project}/guards`);
    expect(await page.getByRole('link', { name: 'New recipe' }).count()).toBe(0);
    await page.getByRole('link', { name: '4–20 mA input with 250 Ω burden', exact: true }).click();
    await page.waitForURL(/\/guards\/\d+$/);
    await page.getByTestId('guard-schematic').waitFor();
    expect(
      await page
        .getByRole('group', { name: 'Series element' })
        .first()
        .getByLabel(/^Resistance/)
        .isDisabled(),
    ).toBe(true);
    expect(await page.getByRole('button', { name: 'Save recipe' }).count()).toBe(0);
    await page.getByText('Your role sees guard recipes read-only.').waitFor();
    await shot(page, 'guard-recipe-technician-1024');
    await context.close();
  });
});
