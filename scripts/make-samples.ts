/**
 * Writes the sample import files in public/samples/ (run: npx tsx scripts/make-samples.ts):
 *   cabinet-sample.csv / .xlsx         — one cabinet's schedule, imports cleanly
 *   cabinet-sample-with-errors.xlsx    — the same with exactly three bad rows
 * The cabinet is invented in the style of the demo scenario (Vessmoor Brine Works) and is not
 * in the seed, so it can be imported into a new cabinet, e.g. "+CP23 Crystalliser and dryer
 * panel". Its channel tags are new too: the import creates them (signal type "other").
 */
import fs from 'node:fs';
import path from 'node:path';
import ExcelJS from 'exceljs';
import { SCHEDULE_COLUMNS, writeCsv, writeXlsx, type ExportRow } from '@/lib/schedule-io';

type Row = Partial<ExportRow> & Pick<ExportRow, 'strip' | 'position' | 'label' | 'circuit_class'>;

let wire = 3000;
const nextWire = () => String(wire++);

const mains = (
  strip: string,
  position: number,
  kind: 'mains-line' | 'mains-neutral',
  extra: Partial<Row> = {},
): Row => ({
  strip,
  position,
  label: `${strip}:${position}`,
  terminal_no: String(position),
  wire_no: nextWire(),
  colour: kind === 'mains-line' ? 'BK' : 'LBU',
  circuit_class: 'hazard',
  hazard_kind: kind,
  voltage: 230,
  ac_dc: 'ac',
  frequency_hz: 50,
  ...extra,
});
const dc24 = (strip: string, position: number, extra: Partial<Row> = {}): Row => ({
  strip,
  position,
  label: `${strip}:${position}`,
  terminal_no: String(position),
  wire_no: nextWire(),
  colour: 'BU',
  circuit_class: 'hazard',
  hazard_kind: 'dc-supply',
  voltage: 24,
  ac_dc: 'dc',
  ...extra,
});
const input = (
  strip: string,
  position: number,
  channel: string,
  extra: Partial<Row> = {},
): Row => ({
  strip,
  position,
  label: `${strip}:${position}`,
  terminal_no: String(position),
  wire_no: nextWire(),
  colour: 'BU',
  circuit_class: 'sensitive',
  ac_dc: 'dc',
  channel,
  ...extra,
});
const ret = (
  strip: string,
  position: number,
  channel: string | null,
  extra: Partial<Row> = {},
): Row => ({
  strip,
  position,
  label: `${strip}:${position}`,
  terminal_no: String(position),
  wire_no: nextWire(),
  colour: 'BU',
  circuit_class: 'return',
  ac_dc: 'dc',
  channel,
  ...extra,
});
const earth = (strip: string, position: number, extra: Partial<Row> = {}): Row => ({
  strip,
  position,
  label: `${strip}:${position}`,
  terminal_no: String(position),
  wire_no: 'PE',
  colour: 'GNYE',
  circuit_class: 'earth',
  ...extra,
});
const spare = (strip: string, position: number): Row => ({
  strip,
  position,
  label: `${strip}:${position}`,
  terminal_no: String(position),
  circuit_class: 'spare',
});
const barrier = (strip: string, position: number, n: number): Row => ({
  strip,
  position,
  label: `${strip}:BP${n}`,
  circuit_class: 'barrier',
  notes: 'Partition plate',
});

function scheduleRows(): Row[] {
  const rows: Row[] = [];
  // X31: 230 V AC distribution for the dryer fans and heaters; a partition plate before the spares.
  rows.push(
    mains('X31', 1, 'mains-line', { bridge: 'X31-L' }),
    mains('X31', 2, 'mains-line', { bridge: 'X31-L' }),
    mains('X31', 3, 'mains-line', {
      bridge: 'X31-L',
      cable: 'W-2320',
      core: '1',
      notes: 'Dryer heater contactor feed',
    }),
    mains('X31', 4, 'mains-neutral', { bridge: 'X31-N' }),
    mains('X31', 5, 'mains-neutral', { bridge: 'X31-N' }),
    mains('X31', 6, 'mains-neutral', { bridge: 'X31-N', cable: 'W-2320', core: '2' }),
    barrier('X31', 7, 1),
    earth('X31', 8),
    earth('X31', 9),
    spare('X31', 10),
  );
  // X32: 4–20 mA inputs; an anti-condensation heater feed at the head of the strip.
  rows.push(
    mains('X32', 1, 'mains-line', { notes: 'Enclosure anti-condensation heater feed.' }),
    mains('X32', 2, 'mains-neutral'),
    earth('X32', 3),
  );
  const analog: Array<[string, string, string]> = [
    ['TT-2301', 'W-2301', 'Dryer inlet air temperature'],
    ['TT-2302', 'W-2302', 'Dryer outlet air temperature'],
    ['PT-2303', 'W-2303', 'Crystalliser vacuum'],
    ['FT-2304', 'W-2304', 'Mother liquor flow'],
    ['LT-2305', 'W-2305', 'Crystalliser level'],
    ['WT-2306', 'W-2306', 'Dried salt belt weigher'],
  ];
  analog.forEach(([tag, cable, note], i) => {
    const position = 4 + 2 * i;
    rows.push(
      input('X32', position, tag, { cable, core: '1', notes: note }),
      ret('X32', position + 1, tag, { cable, core: '2' }),
    );
  });
  rows.push(earth('X32', 16, { notes: 'Shield bar' }));
  // X33: digital inputs on two-level blocks: 24 V feed on level 1, the input on level 2.
  const digital: Array<[string, string]> = [
    ['ZSC-2311', 'Dryer damper closed'],
    ['ZSO-2312', 'Dryer damper open'],
    ['TSH-2313', 'Dryer high temperature switch'],
    ['YS-2314', 'Belt conveyor running'],
    ['LSH-2315', 'Crystalliser high level switch'],
  ];
  digital.forEach(([tag, note], i) => {
    const position = i + 1;
    const block = `X33-B${position}`;
    rows.push(
      dc24('X33', position, {
        level: 1,
        block,
        label: `X33:${position}.1`,
        bridge: 'X33-24V',
        cable: 'W-2311',
        core: String(2 * i + 1),
      }),
      input('X33', position, tag, {
        level: 2,
        block,
        label: `X33:${position}.2`,
        cable: 'W-2311',
        core: String(2 * i + 2),
        notes: note,
      }),
    );
  });
  rows.push(
    ret('X33', 6, null, { bridge: 'X33-0V', notes: 'Common 0 V of the digital inputs' }),
    ret('X33', 7, null, { bridge: 'X33-0V' }),
    earth('X33', 8),
  );
  return rows;
}

function complete(rows: Row[]): ExportRow[] {
  return rows.map((r) => {
    const full = {} as ExportRow;
    for (const c of SCHEDULE_COLUMNS) full[c] = r[c] ?? (c === 'level' ? 1 : null);
    return full;
  });
}

/** The same schedule with three rows spoiled, each in one way a user really makes. */
async function withErrors(rows: ExportRow[]): Promise<Uint8Array> {
  const bad = rows.map((r) => ({ ...r })) as Array<Record<string, string | number | null>>;
  const at = (label: string) => bad.findIndex((r) => r.label === label);
  bad[at('X31:10')].position = 'abc'; // a word where a number belongs
  bad[at('X32:3')].circuit_class = 'mains'; // not one of our classes
  bad[at('X33:3.1')].voltage = null; // a hazard without its voltage
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet('+CP23');
  sheet.columns = SCHEDULE_COLUMNS.map((c) => ({
    header: c,
    key: c,
    width: Math.max(10, c.length + 2),
  }));
  sheet.getRow(1).font = { bold: true };
  for (const r of bad) sheet.addRow(SCHEDULE_COLUMNS.map((c) => r[c] ?? null));
  return new Uint8Array((await workbook.xlsx.writeBuffer()) as ArrayBuffer);
}

async function main() {
  const dir = path.join(process.cwd(), 'public', 'samples');
  fs.mkdirSync(dir, { recursive: true });
  const rows = complete(scheduleRows());
  fs.writeFileSync(path.join(dir, 'cabinet-sample.csv'), writeCsv(rows));
  fs.writeFileSync(path.join(dir, 'cabinet-sample.xlsx'), await writeXlsx(rows, '+CP23'));
  fs.writeFileSync(path.join(dir, 'cabinet-sample-with-errors.xlsx'), await withErrors(rows));
  console.log(
    `Wrote ${rows.length} rows to public/samples/cabinet-sample.{csv,xlsx} and cabinet-sample-with-errors.xlsx`,
  );
}

void main();
