/**
 * The terminal schedule as a controls engineer and a site technician use it: import with a
 * preview of bad rows, keyboard editing, spreadsheet paste, two people on one terminal, the
 * read-only view, and the strip drawing at desktop and tablet sizes.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launch, shot, signIn } from './browser';

const PASSWORD = 'crossfault-demo';
const ENGINEER = 'orla.engineer@vessmoor.example';
const ADMIN = 'tamsin.admin@vessmoor.example';
const TECHNICIAN = 'bram.technician@vessmoor.example';
const REVIEWER = 'nadia.reviewer@vessmoor.example';
const EVAPORATOR_PROJECT = 'Evaporator line 2 controls upgrade';

interface Session {
  context: BrowserContext;
  page: Page;
}

/** A fresh browser context (its own cookies) signed in as one demo user. */
async function session(
  browser: Browser,
  email: string,
  viewport = { width: 1440, height: 900 },
): Promise<Session> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  page.setDefaultTimeout(30_000);
  await signIn(page, email, PASSWORD);
  await page.waitForURL(/\/projects/);
  return { context, page };
}

/** The project's id, found the way a user finds it: by its name on the project list. */
async function projectId(page: Page, name = EVAPORATOR_PROJECT): Promise<number> {
  await page.goto(`${BASE_URL()}/projects`);
  const href = await page.getByRole('link', { name }).first().getAttribute('href');
  const id = Number(/\/projects\/(\d+)/.exec(href ?? '')?.[1]);
  if (!id) throw new Error(`No project called ${name} on the project list`);
  return id;
}

/** Opens a cabinet from the schedule's cabinet list and waits for its table. */
async function openCabinet(page: Page, project: number, tag: string) {
  await page.goto(`${BASE_URL()}/projects/${project}/cabinets`);
  await page.getByRole('link', { name: tag, exact: true }).click();
  await page.waitForURL(/\/cabinets\/\d+/);
  await page.getByRole('grid', { name: 'Terminal schedule' }).waitFor();
}

function cabinetIdOf(page: Page): number {
  return Number(/\/cabinets\/(\d+)/.exec(page.url())?.[1]);
}

interface ApiTerminal {
  id: number;
  label: string;
  version: number;
  wireNumber: string | null;
  cableId: string | null;
  cableCore: string | null;
  circuitClass: string;
  position: number;
}

/** The cabinet's terminals as the server now holds them (through the signed-in page's cookies). */
async function serverTerminals(
  page: Page,
  project: number,
  cabinet: number,
): Promise<ApiTerminal[]> {
  const res = await page.request.get(
    `${BASE_URL()}/api/projects/${project}/cabinets/${cabinet}/terminals?pageSize=5000`,
  );
  if (!res.ok()) throw new Error(`terminals list answered ${res.status()}`);
  return ((await res.json()) as { items: ApiTerminal[] }).items;
}

/** The table cell of a terminal (by its label) in one of our columns. */
function cell(page: Page, label: string, column: string) {
  return page.locator(
    `tr:has(td[data-column="label"]:text-is("${label}")) td[data-column="${column}"]`,
  );
}

/** A paste from a spreadsheet: tab-separated text delivered as a real paste event. */
async function pasteText(page: Page, text: string) {
  await page.getByRole('grid', { name: 'Terminal schedule' }).evaluate((grid, t) => {
    const data = new DataTransfer();
    data.setData('text/plain', t);
    grid.dispatchEvent(
      new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
    );
  }, text);
}

const SAMPLES = path.resolve('public/samples');

/** Row numbers as the file shows them (header is row 1), found from the clean CSV of the same schedule. */
function sampleRowOf(label: string): number {
  const lines = readFileSync(path.join(SAMPLES, 'cabinet-sample.csv'), 'utf8')
    .replace(/^\uFEFF/, '')
    .split(/\r?\n/);
  const index = lines.findIndex((line) => line.split(',')[4] === label);
  if (index < 1) throw new Error(`${label} is not in the sample`);
  return index + 1;
}

let browser: Browser;
let project: number;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe('terminal schedule', () => {
  it('imports the sample XLSX: three bad rows are named and nothing is written; the fixed file imports whole', async () => {
    const { page, context } = await session(browser, ENGINEER);
    project = await projectId(page);
    await page.goto(`${BASE_URL()}/projects/${project}/cabinets`);
    await page.getByRole('button', { name: 'New cabinet' }).click();
    await page.getByLabel('Tag').fill('+CP23');
    await page.getByLabel('Name').fill('Crystalliser and dryer panel');
    await page.getByRole('button', { name: 'Create cabinet' }).click();
    await page.getByRole('link', { name: '+CP23', exact: true }).click();
    await page.waitForURL(/\/cabinets\/\d+/);
    const cabinet = cabinetIdOf(page);

    await page.getByRole('button', { name: 'Import CSV / XLSX' }).click();
    await page
      .getByLabel('File to import')
      .setInputFiles(path.join(SAMPLES, 'cabinet-sample-with-errors.xlsx'));
    await page.getByRole('button', { name: 'Read file' }).click();
    // Our column names are the file's headers, so the suggestion maps every one.
    await expectValue(page.getByLabel('Their column for circuit_class'), 'circuit_class');
    await page.getByRole('button', { name: 'Check rows' }).click();

    const errors = page.getByTestId('import-errors');
    await errors.waitFor();
    const rows = await errors
      .locator('tbody tr')
      .evaluateAll((trs) =>
        trs.map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent ?? '')),
      );
    const badRows = [...new Set(rows.map((r) => Number(r[0])))].sort((a, b) => a - b);
    const expected = [sampleRowOf('X31:10'), sampleRowOf('X32:3'), sampleRowOf('X33:3.1')].sort(
      (a, b) => a - b,
    );
    expect(badRows).toEqual(expected);
    // Each names the column and why (the three spoilt cells of the sample file).
    const byRow = (label: string) => rows.filter((r) => Number(r[0]) === sampleRowOf(label));
    expect(byRow('X31:10').some((r) => r[1] === 'position')).toBe(true);
    expect(byRow('X32:3').some((r) => r[1] === 'circuit_class' && /mains/.test(r[2]))).toBe(true);
    expect(byRow('X33:3.1').some((r) => r[1] === 'voltage')).toBe(true);
    await expect(page.getByTestId('import-summary').textContent()).resolves.toMatch(
      /3 with errors.*Nothing has been written/,
    );
    expect(await page.getByRole('button', { name: /^Import \d+ rows$/ }).isDisabled()).toBe(true);
    expect(await serverTerminals(page, project, cabinet)).toHaveLength(0);

    await page.getByRole('button', { name: 'Choose the fixed file' }).click();
    await page
      .getByLabel('File to import')
      .setInputFiles(path.join(SAMPLES, 'cabinet-sample.xlsx'));
    await page.getByRole('button', { name: 'Read file' }).click();
    await page.getByRole('button', { name: 'Check rows' }).click();
    await page.getByTestId('import-summary').waitFor();
    expect(await page.getByTestId('import-errors').count()).toBe(0);
    const sampleRows =
      readFileSync(path.join(SAMPLES, 'cabinet-sample.csv'), 'utf8').trim().split(/\r?\n/).length -
      1;
    await page.getByRole('button', { name: `Import ${sampleRows} rows` }).click();
    await page
      .getByText(`Imported ${sampleRows} rows: ${sampleRows} terminals added, 0 updated.`)
      .waitFor();
    await page.getByTestId('import-wizard').getByRole('button', { name: 'Close' }).click();

    const stored = await serverTerminals(page, project, cabinet);
    expect(stored).toHaveLength(sampleRows);
    expect(stored.map((t) => t.label)).toEqual(
      expect.arrayContaining(['X31:10', 'X32:3', 'X33:3.1']),
    );
    await page.getByText(`${sampleRows} of ${sampleRows} terminals`).waitFor();
    await context.close();
  });

  it('edits a cell in place with the keyboard; a bad value is refused beside the row and nothing is saved', async () => {
    const { page, context } = await session(browser, ENGINEER);
    project ??= await projectId(page);
    await openCabinet(page, project, '+CP21');
    const cabinet = cabinetIdOf(page);

    await cell(page, 'X1:13', 'wire_no').click();
    await page.keyboard.type('W-7713');
    await page.keyboard.press('Enter');
    await expectText(cell(page, 'X1:13', 'wire_no'), 'W-7713');
    await waitForServer(
      page,
      project,
      cabinet,
      (ts) => ts.find((t) => t.label === 'X1:13')?.wireNumber === 'W-7713',
    );

    // Arrow keys move the selection: up from X1:14's core lands on X1:13's core.
    await cell(page, 'X1:14', 'core').click();
    await page.keyboard.press('ArrowUp');
    await page.keyboard.type('3');
    await page.keyboard.press('Tab');
    await waitForServer(
      page,
      project,
      cabinet,
      (ts) => ts.find((t) => t.label === 'X1:13')?.cableCore === '3',
    );

    const before = (await serverTerminals(page, project, cabinet)).find(
      (t) => t.label === 'X1:14',
    )!;
    await cell(page, 'X1:14', 'position').click();
    await page.keyboard.press('Enter');
    await page.keyboard.press('ControlOrMeta+a');
    await page.keyboard.type('fourteen');
    await page.keyboard.press('Enter');
    const rowError = page.getByTestId('row-error').filter({ hasText: 'X1:14' });
    await expectText(rowError, 'position must be a whole number');
    expect(await cell(page, 'X1:14', 'position').getAttribute('aria-invalid')).toBe('true');
    const after = (await serverTerminals(page, project, cabinet)).find((t) => t.label === 'X1:14')!;
    expect(after.version).toBe(before.version);
    expect(after.position).toBe(before.position);
    // Escape on the refused cell drops the typed value and its message.
    await cell(page, 'X1:14', 'position').click();
    await page.keyboard.press('Escape');
    expect(await rowError.count()).toBe(0);
    await context.close();
  });

  it('keeps sort, filters and column choice in the URL, so a view can be shared', async () => {
    const { page, context } = await session(browser, ENGINEER);
    project ??= await projectId(page);
    await openCabinet(page, project, '+CP21');
    const cabinet = cabinetIdOf(page);
    const all = await serverTerminals(page, project, cabinet);
    const hazards = all.filter((t) => t.circuitClass === 'hazard').length;

    await page.getByRole('columnheader', { name: 'wire_no' }).getByRole('button').click();
    await page.waitForURL(/sort=wire_no&dir=asc/);
    await page.getByLabel('Circuit class').selectOption('hazard');
    await page.waitForURL(/class=hazard/);
    await page.getByText(`${hazards} of ${all.length} terminals`).waitFor();
    await page.locator('summary', { hasText: 'Columns' }).click();
    await page.getByRole('checkbox', { name: 'notes' }).check();
    await page.waitForURL(/hide=/);

    // The same URL in a fresh page shows the same view.
    const shared = page.url();
    const other = await context.newPage();
    await other.goto(shared);
    await other.getByText(`${hazards} of ${all.length} terminals`).waitFor();
    expect(
      await other.getByRole('columnheader', { name: 'wire_no' }).getAttribute('aria-sort'),
    ).toBe('ascending');
    expect(await other.getByRole('columnheader', { name: 'notes' }).count()).toBe(1);
    const wires = await other.locator('td[data-column="wire_no"]').allTextContents();
    // Natural order (numbers inside text compare as numbers), blanks first.
    const natural = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });
    expect(wires).toEqual([...wires].sort(natural.compare));
    await context.close();
  });

  it('pastes a block from a spreadsheet down and right as one save, and refuses a block with a bad cell whole', async () => {
    const { page, context } = await session(browser, ENGINEER);
    project ??= await projectId(page);
    await openCabinet(page, project, '+CP21');
    const cabinet = cabinetIdOf(page);

    // wire_no is followed by cable among the visible columns.
    await cell(page, 'X1:13', 'wire_no').click();
    await pasteText(page, 'P-901\tW-2199\r\nP-902\tW-2199\r\n');
    await waitForServer(page, project, cabinet, (ts) => {
      const a = ts.find((t) => t.label === 'X1:13');
      const b = ts.find((t) => t.label === 'X1:14');
      return (
        a?.wireNumber === 'P-901' &&
        b?.wireNumber === 'P-902' &&
        a?.cableId === 'W-2199' &&
        b?.cableId === 'W-2199'
      );
    });
    await expectText(cell(page, 'X1:14', 'cable'), 'W-2199');

    const before = await serverTerminals(page, project, cabinet);
    await cell(page, 'X1:13', 'circuit_class').click();
    await pasteText(page, 'earth\nmains\n');
    await expectText(
      page.getByTestId('row-error').filter({ hasText: 'X1:14' }),
      'circuit_class must be one of',
    );
    await expectText(
      page.getByRole('alert').filter({ hasText: 'nothing was saved' }),
      'nothing was saved',
    );
    const after = await serverTerminals(page, project, cabinet);
    expect(after.find((t) => t.label === 'X1:13')).toEqual(before.find((t) => t.label === 'X1:13'));
    expect(after.find((t) => t.label === 'X1:14')).toEqual(before.find((t) => t.label === 'X1:14'));
    await context.close();
  });

  it('two people edit the same terminal: the second is told who/what changed, and neither edit is lost', async () => {
    const first = await session(browser, ENGINEER);
    const second = await session(browser, ADMIN);
    project ??= await projectId(first.page);
    await openCabinet(first.page, project, '+CP21');
    await openCabinet(second.page, project, '+CP21');
    const cabinet = cabinetIdOf(first.page);

    // 1. Keep mine: the second save lands on top of the first, with the first visible in the dialog.
    await cell(first.page, 'X2:6', 'wire_no').click();
    await first.page.keyboard.press('Enter');
    await first.page.keyboard.press('ControlOrMeta+a');
    await first.page.keyboard.type('FIRST-1');
    await first.page.keyboard.press('Enter');
    await waitForServer(
      first.page,
      project,
      cabinet,
      (ts) => ts.find((t) => t.label === 'X2:6')?.wireNumber === 'FIRST-1',
    );

    await cell(second.page, 'X2:6', 'wire_no').click();
    await second.page.keyboard.press('Enter');
    await second.page.keyboard.press('ControlOrMeta+a');
    await second.page.keyboard.type('SECOND-2');
    await second.page.keyboard.press('Enter');
    const dialog = second.page.getByTestId('conflict-dialog');
    await expectText(dialog, 'was changed by');
    await expectText(dialog, '“FIRST-1”');
    await expectText(dialog, '“SECOND-2”');
    // The typed value stays on screen while the choice is open.
    await expectText(cell(second.page, 'X2:6', 'wire_no'), 'SECOND-2');
    await second.page.getByRole('button', { name: 'Keep mine and save again' }).click();
    await waitForServer(
      second.page,
      project,
      cabinet,
      (ts) => ts.find((t) => t.label === 'X2:6')?.wireNumber === 'SECOND-2',
    );

    // 2. Reload theirs: the second person sees the first person's value and nothing is overwritten.
    await cell(first.page, 'X2:6', 'core').click();
    await first.page.keyboard.type('7');
    await first.page.keyboard.press('Enter');
    // first's copy of X2:6 is stale after step 1 (its version moved): it gets the conflict too.
    const firstDialog = first.page.getByTestId('conflict-dialog');
    await expectText(firstDialog, '“SECOND-2”');
    await first.page.getByRole('button', { name: 'Keep mine and save again' }).click();
    await waitForServer(first.page, project, cabinet, (ts) => {
      const t = ts.find((x) => x.label === 'X2:6');
      return t?.cableCore === '7' && t?.wireNumber === 'SECOND-2';
    });

    await cell(second.page, 'X2:6', 'core').click();
    await second.page.keyboard.type('8');
    await second.page.keyboard.press('Enter');
    await expectText(dialog, '“7”');
    await second.page.getByRole('button', { name: 'Reload theirs' }).click();
    await expectText(cell(second.page, 'X2:6', 'core'), '7');
    const final = (await serverTerminals(second.page, project, cabinet)).find(
      (t) => t.label === 'X2:6',
    )!;
    expect(final.cableCore).toBe('7');
    expect(final.wireNumber).toBe('SECOND-2');
    await first.context.close();
    await second.context.close();
  });

  it.each([
    ['technician', TECHNICIAN],
    ['reviewer', REVIEWER],
  ])('a %s sees the schedule read-only and a write is refused with 403', async (_role, email) => {
    const { page, context } = await session(browser, email);
    project ??= await projectId(page);
    await openCabinet(page, project, '+CP21');
    const cabinet = cabinetIdOf(page);
    await page.getByText('read-only for your role').first().waitFor();
    expect(await page.getByRole('button', { name: 'Import CSV / XLSX' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Add terminal' }).count()).toBe(0);
    expect(
      await page.getByRole('grid', { name: 'Terminal schedule' }).getAttribute('aria-readonly'),
    ).toBe('true');

    await cell(page, 'X1:13', 'wire_no').click();
    await page.keyboard.press('Enter');
    expect(await page.getByRole('textbox', { name: 'Edit wire_no' }).count()).toBe(0);
    await page.getByText('Your role sees this schedule read-only.').waitFor();

    const target = (await serverTerminals(page, project, cabinet)).find(
      (t) => t.label === 'X1:13',
    )!;
    const res = await page.request.patch(
      `${BASE_URL()}/api/projects/${project}/terminals/${target.id}`,
      {
        data: { version: target.version, wireNumber: 'TECH-1' },
      },
    );
    expect(res.status()).toBe(403);
    await context.close();
  });

  it('draws the strips legibly at desktop and tablet sizes (screenshots)', async () => {
    for (const [name, viewport] of [
      ['strip-drawing-desktop-1440x900', { width: 1440, height: 900 }],
      ['strip-drawing-tablet-1024x768', { width: 1024, height: 768 }],
    ] as const) {
      const { page, context } = await session(browser, ENGINEER, viewport);
      project ??= await projectId(page);
      await openCabinet(page, project, '+CP21');
      const drawing = page.getByTestId('strip-drawing');
      // Every terminal is a focusable, named target of at least 44 px (touch).
      const tile = drawing.locator('g[role="listitem"]').first();
      const box = await tile.boundingBox();
      expect(box!.width).toBeGreaterThanOrEqual(44);
      expect(box!.height).toBeGreaterThanOrEqual(44);
      // Open a terminal from the drawing with the keyboard.
      await drawing.locator('g[aria-label^="X3:4,"]').focus();
      await page.keyboard.press('Enter');
      await expectText(page.getByTestId('terminal-detail'), 'X3:4');
      await page.getByTestId('terminal-detail').scrollIntoViewIfNeeded();
      await drawing.scrollIntoViewIfNeeded();
      await shot(page, name);
      await context.close();
    }
  });
});

async function expectText(locator: Locator, text: string) {
  await locator.filter({ hasText: text }).first().waitFor({ timeout: 20_000 });
}

async function expectValue(locator: Locator, value: string) {
  await expect.poll(() => locator.inputValue(), { timeout: 20_000 }).toBe(value);
}

async function waitForServer(
  page: Page,
  project: number,
  cabinet: number,
  ok: (ts: ApiTerminal[]) => boolean,
) {
  await expect
    .poll(async () => ok(await serverTerminals(page, project, cabinet)), {
      timeout: 20_000,
      interval: 300,
    })
    .toBe(true);
}
