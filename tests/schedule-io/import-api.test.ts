/**
 * The import and export routes with the shipped sample files: the preview names each bad
 * row (row, column, why) and writes nothing; the fixed file imports every row in one go;
 * the export reads back to the same rows; bad uploads are refused with a clear message.
 */
import fs from 'node:fs';
import path from 'node:path';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { getDb } from '@/lib/db';
import { readScheduleFile } from '@/lib/schedule-io';
import { actAs, call, setupWorld, snapshot, teardownWorld, type World } from '../api/helpers';

vi.mock('@/lib/auth/session', async () => (await import('../api/helpers')).sessionMock());

const cabinets = await import('@/app/api/projects/[projectId]/cabinets/route');
const importRoute =
  await import('@/app/api/projects/[projectId]/cabinets/[cabinetId]/import/route');
const exportRoute =
  await import('@/app/api/projects/[projectId]/cabinets/[cabinetId]/export/route');
const cabinetTerminals =
  await import('@/app/api/projects/[projectId]/cabinets/[cabinetId]/terminals/route');
const channels = await import('@/app/api/projects/[projectId]/channels/route');

const SAMPLES = path.join(process.cwd(), 'public', 'samples');
const sample = (name: string) => new Uint8Array(fs.readFileSync(path.join(SAMPLES, name)));

let w: World;
let cabinetId: number;

function upload(name: string, bytes: Uint8Array, fields: Record<string, string> = {}) {
  const form = new FormData();
  form.set('file', new File([bytes as BlobPart], name));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return call(importRoute.POST, { params: { projectId: w.projectId, cabinetId }, form });
}

/** Row number of the row whose `label` cell is `label`, read straight from the workbook. */
async function workbookRowOf(file: string, label: string): Promise<number> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(fs.readFileSync(path.join(SAMPLES, file)) as unknown as ExcelJS.Buffer);
  const sheet = workbook.worksheets[0];
  const labelColumn = (sheet.getRow(1).values as unknown[]).indexOf('label');
  let found = -1;
  sheet.eachRow((row, n) => {
    if (row.getCell(labelColumn).value === label) found = n;
  });
  return found;
}

beforeAll(async () => {
  w = await setupWorld();
  actAs(w.users.engineer);
  const created = await call(cabinets.POST, {
    params: { projectId: w.projectId },
    body: {
      tag: '+CP23',
      name: 'Crystalliser and dryer panel',
      location: 'Dryer floor, column D2',
    },
  });
  cabinetId = created.body.id;
});
afterAll(() => teardownWorld(w));

describe('the sample with three bad rows', () => {
  it('preview names each bad row, the column and why; nothing is written', async () => {
    const before = await snapshot();
    const res = await upload(
      'cabinet-sample-with-errors.xlsx',
      sample('cabinet-sample-with-errors.xlsx'),
    );
    expect(res.status).toBe(200);
    const bad = res.body.rows.filter((r: { errors: unknown[] }) => r.errors.length > 0);
    expect(bad).toHaveLength(3);
    expect(
      bad.map((r: { row: number; errors: unknown[] }) => ({ row: r.row, errors: r.errors })),
    ).toEqual([
      {
        row: await workbookRowOf('cabinet-sample-with-errors.xlsx', 'X31:10'),
        errors: [
          {
            column: 'position',
            message: 'position must be a whole number of 1 or more; "abc" is not.',
          },
        ],
      },
      {
        row: await workbookRowOf('cabinet-sample-with-errors.xlsx', 'X32:3'),
        errors: [
          {
            column: 'circuit_class',
            message:
              'circuit_class "mains" is not one of: hazard, sensitive, return, earth, spare, barrier.',
          },
        ],
      },
      {
        row: await workbookRowOf('cabinet-sample-with-errors.xlsx', 'X33:3.1'),
        errors: [
          {
            column: 'voltage',
            message: 'voltage is required on a hazard terminal (V, RMS for AC).',
          },
        ],
      },
    ]);
    expect(res.body.errorCount).toBe(3);
    expect(res.body.validCount).toBe(res.body.rows.length - 3);
    expect(res.body.mappingErrors).toEqual([]);
    expect(res.body.headers[0]).toBe('strip');
    expect(await snapshot()).toEqual(before);
  });

  it('a commit of it answers 422 with the same rows and writes nothing', async () => {
    const before = await snapshot();
    const res = await upload(
      'cabinet-sample-with-errors.xlsx',
      sample('cabinet-sample-with-errors.xlsx'),
      { mode: 'commit' },
    );
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/3 row\(s\) have errors; nothing was imported/);
    expect(res.body.rows.filter((r: { errors: unknown[] }) => r.errors.length > 0)).toHaveLength(3);
    expect(await snapshot()).toEqual(before);
  });
});

describe('the fixed sample', () => {
  it('imports every row in one go, creating the strips and the channels it names', async () => {
    const expected = await readScheduleFile('cabinet-sample.xlsx', sample('cabinet-sample.xlsx'));
    const preview = await upload('cabinet-sample.xlsx', sample('cabinet-sample.xlsx'));
    expect(preview.body.errorCount).toBe(0);
    expect(preview.body.channelsToCreate).toContain('TT-2301');

    const { models } = getDb();
    const logBefore = await models.AuditLog.count();
    const res = await upload('cabinet-sample.xlsx', sample('cabinet-sample.xlsx'), {
      mode: 'commit',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      created: expected.rows.length,
      updated: 0,
      unchanged: 0,
      stripsCreated: ['X31', 'X32', 'X33'],
    });
    expect(await models.AuditLog.count()).toBe(logBefore + 1);

    const list = await call(cabinetTerminals.GET, {
      method: 'GET',
      params: { projectId: w.projectId, cabinetId },
      query: { pageSize: 5000 },
    });
    expect(list.body.total).toBe(expected.rows.length);
    const tt = list.body.items.filter(
      (r: { channelTag: string | null }) => r.channelTag === 'TT-2301',
    );
    expect(tt.map((r: { label: string }) => r.label)).toEqual(['X32:4', 'X32:5']);
    // The channel created by the import got its signal and return terminals from the schedule.
    const ch = await call(channels.GET, {
      method: 'GET',
      params: { projectId: w.projectId },
      query: { cabinetId },
    });
    expect(ch.body.items.find((c: { tag: string }) => c.tag === 'TT-2301')).toMatchObject({
      signalType: 'other',
      signalTerminalLabel: 'X32:4',
      returnTerminalLabel: 'X32:5',
      guardRecipeName: null,
    });
  });

  it('the CSV sample holds the same schedule: importing it changes nothing', async () => {
    const res = await upload('cabinet-sample.csv', sample('cabinet-sample.csv'), {
      mode: 'commit',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ created: 0, updated: 0 });
    expect(res.body.unchanged).toBeGreaterThan(30);
  });
});

describe('export', () => {
  it('CSV and XLSX both read back to the rows imported, and re-import as unchanged', async () => {
    const imported = await readScheduleFile('cabinet-sample.xlsx', sample('cabinet-sample.xlsx'));
    for (const format of ['csv', 'xlsx'] as const) {
      const res = await call(exportRoute.GET, {
        method: 'GET',
        params: { projectId: w.projectId, cabinetId },
        query: { format },
      });
      expect(res.status).toBe(200);
      expect(res.response.headers.get('content-disposition')).toBe(
        `attachment; filename="schedule-CP23.${format}"`,
      );
      const bytes = new Uint8Array(await res.response.arrayBuffer());
      const table = await readScheduleFile(`export.${format}`, bytes);
      expect(table.headers).toEqual(imported.headers);
      expect(table.rows.map((r) => r.cells)).toEqual(imported.rows.map((r) => r.cells));
      const again = await upload(`export.${format}`, bytes, { mode: 'commit' });
      expect(again.body).toMatchObject({ created: 0, updated: 0, unchanged: imported.rows.length });
    }
  });

  it('an unknown format is refused', async () => {
    const res = await call(exportRoute.GET, {
      method: 'GET',
      params: { projectId: w.projectId, cabinetId },
      query: { format: 'pdf' },
    });
    expect(res.status).toBe(422);
    expect(res.body.fieldErrors.format[0]).toBe('format must be csv or xlsx.');
  });
});

describe('bad uploads are refused with a clear message and change nothing', () => {
  it('oversized, wrong type, disguised, missing', async () => {
    const before = await snapshot();
    const big = new Uint8Array(5 * 1024 * 1024 + 10).fill(0x61);
    const oversized = await upload('huge.csv', big);
    expect(oversized.status).toBe(422);
    expect(oversized.body.fieldErrors.file[0]).toMatch(/5\.0 MB; the import limit is 5 MB/);
    const pdf = await upload('schedule.pdf', new TextEncoder().encode('%PDF-1.7'));
    expect(pdf.status).toBe(422);
    expect(pdf.body.error).toMatch(/Only \.csv and \.xlsx files can be imported/);
    const disguised = await upload(
      'schedule.xlsx',
      new TextEncoder().encode('strip,position\nX1,1\n'),
    );
    expect(disguised.status).toBe(422);
    expect(disguised.body.error).toMatch(/not an Excel workbook/);
    const none = await call(importRoute.POST, {
      params: { projectId: w.projectId, cabinetId },
      form: new FormData(),
    });
    expect(none.status).toBe(422);
    expect(none.body.fieldErrors.file[0]).toMatch(/Choose a \.csv or \.xlsx file/);
    const badMode = await upload('cabinet-sample.csv', sample('cabinet-sample.csv'), {
      mode: 'write',
    });
    expect(badMode.status).toBe(422);
    expect(badMode.body.fieldErrors.mode[0]).toBe('mode must be preview or commit.');
    expect(await snapshot()).toEqual(before);
  });

  it('a mapping that leaves out a required column is reported, and a commit with it writes nothing', async () => {
    const before = await snapshot();
    const mapping = JSON.stringify({ strip: 'strip', position: 'position', label: 'label' });
    const preview = await upload('cabinet-sample.csv', sample('cabinet-sample.csv'), { mapping });
    expect(preview.body.mappingErrors).toEqual([
      {
        column: 'circuit_class',
        message: "circuit_class is required: map one of the file's columns to it.",
      },
    ]);
    expect(preview.body.validCount).toBe(0);
    const commit = await upload('cabinet-sample.csv', sample('cabinet-sample.csv'), {
      mapping,
      mode: 'commit',
    });
    expect(commit.status).toBe(422);
    expect(commit.body.error).toMatch(/column mapping needs attention/);
    expect(await snapshot()).toEqual(before);
  });

  it('a hazard row in a file without the hazard columns says which columns are missing', async () => {
    const csv = 'strip,position,label,circuit_class\nX41,1,X41:1,hazard\n';
    const res = await upload('short.csv', new TextEncoder().encode(csv));
    expect(res.body.rows[0].errors).toEqual([
      {
        column: 'hazard_kind',
        message: expect.stringMatching(
          /^hazard_kind is required on a hazard terminal .*\(the file has no hazard_kind column\)\.$/,
        ),
      },
      {
        column: 'voltage',
        message:
          'voltage is required on a hazard terminal (V, RMS for AC) (the file has no voltage column).',
      },
      {
        column: 'ac_dc',
        message:
          'ac_dc is required on a hazard terminal (ac or dc) (the file has no ac_dc column).',
      },
    ]);
  });

  it('a file with its own headers imports through a mapping', async () => {
    const csv = 'Rail;Pos;Marker;Kind;Remarks\nX40;1;X40:1;spare;added by mapping\n';
    const mapping = JSON.stringify({
      strip: 'Rail',
      position: 'Pos',
      label: 'Marker',
      circuit_class: 'Kind',
      notes: 'Remarks',
    });
    const preview = await upload('theirs.csv', new TextEncoder().encode(csv));
    expect(preview.body.suggestedMapping).toMatchObject({
      strip: 'Rail',
      position: 'Pos',
      label: 'Marker',
      notes: 'Remarks',
    });
    const res = await upload('theirs.csv', new TextEncoder().encode(csv), {
      mapping,
      mode: 'commit',
    });
    expect(res.body).toMatchObject({ created: 1, stripsCreated: ['X40'] });
  });
});
