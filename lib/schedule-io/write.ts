/** Export: the schedule in the import's own columns, as CSV (UTF-8) or XLSX, so a file exported can be edited and imported back. */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { COLUMN_FIELD, SCHEDULE_COLUMNS, type ExportRow } from './columns';

/** What the export reads from a schedule row (structurally a TerminalRow). */
export type ExportSource = Record<string, unknown> & {
  stripTag: string;
  channelTag: string | null;
};

export function toExportRows(rows: ExportSource[]): ExportRow[] {
  return rows.map((r) => {
    const out = {} as ExportRow;
    for (const column of SCHEDULE_COLUMNS) {
      const value = r[COLUMN_FIELD[column]];
      out[column] = typeof value === 'number' || typeof value === 'string' ? value : null;
    }
    return out;
  });
}

export function writeCsv(rows: ExportRow[]): string {
  const data = rows.map((r) => SCHEDULE_COLUMNS.map((c) => (r[c] === null ? '' : String(r[c]))));
  // CRLF and a BOM: spreadsheet programs then open the UTF-8 text (Ω, °) correctly.
  return (
    '\uFEFF' + Papa.unparse({ fields: [...SCHEDULE_COLUMNS], data }, { newline: '\r\n' }) + '\r\n'
  );
}

export async function writeXlsx(rows: ExportRow[], sheetName = 'Schedule'): Promise<Uint8Array> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Crossfault';
  const sheet = workbook.addWorksheet(sheetName.slice(0, 31), {
    views: [{ state: 'frozen', ySplit: 1 }],
  });
  sheet.columns = SCHEDULE_COLUMNS.map((c) => ({
    header: c,
    key: c,
    width: c === 'notes' ? 40 : Math.max(10, c.length + 2),
  }));
  sheet.getRow(1).font = { bold: true };
  for (const r of rows) sheet.addRow(SCHEDULE_COLUMNS.map((c) => r[c] ?? null));
  const buffer = await workbook.xlsx.writeBuffer();
  return new Uint8Array(buffer as ArrayBuffer);
}
