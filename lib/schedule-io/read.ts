/**
 * Reading an uploaded schedule: size and type checks (the name's extension AND the bytes —
 * an .xlsx is a zip archive, which starts with "PK"), then the cells as text with the row
 * numbers a spreadsheet user sees (the header is row 1).
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { ValidationError } from '@/lib/errors';

export const MAX_IMPORT_BYTES = 5 * 1024 * 1024;
/** A whole plant's schedule fits many times over; more is a wrong file. */
export const MAX_IMPORT_ROWS = 20_000;

export type ScheduleFileKind = 'csv' | 'xlsx';

export interface ScheduleTable {
  kind: ScheduleFileKind;
  headers: string[];
  /** Data rows that hold anything, each with its row number as the spreadsheet shows it. */
  rows: { row: number; cells: string[] }[];
}

function refuse(message: string): never {
  throw new ValidationError(message, { file: [message] });
}

function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

const ZIP_MAGIC = [0x50, 0x4b, 0x03, 0x04]; // "PK\3\4": the local file header of a zip archive
const OLE_MAGIC = [0xd0, 0xcf, 0x11, 0xe0]; // the old binary .xls / compound document

function startsWith(bytes: Uint8Array, magic: number[]): boolean {
  return magic.every((b, i) => bytes[i] === b);
}

/** Decides the file's kind from its name and its first bytes; refuses anything else with the reason. */
export function checkScheduleFile(name: string, bytes: Uint8Array): ScheduleFileKind {
  if (bytes.byteLength === 0) refuse(`"${name}" is empty.`);
  if (bytes.byteLength > MAX_IMPORT_BYTES) {
    refuse(
      `"${name}" is ${megabytes(bytes.byteLength)}; the import limit is 5 MB. Split the schedule by cabinet or strip.`,
    );
  }
  const extension = /\.([^./\\]+)$/.exec(name)?.[1]?.toLowerCase() ?? '';
  if (extension !== 'csv' && extension !== 'xlsx') {
    const hint = extension === 'xls' ? ' Save the workbook as .xlsx first.' : '';
    refuse(
      `Only .csv and .xlsx files can be imported; "${name}" is ${extension ? `.${extension}` : 'without an extension'}.${hint}`,
    );
  }
  const isZip = startsWith(bytes, ZIP_MAGIC);
  if (extension === 'xlsx' && !isZip) {
    refuse(
      `"${name}" is named .xlsx but is not an Excel workbook (its content does not start like one). Save it again as .xlsx.`,
    );
  }
  if (extension === 'csv') {
    if (isZip)
      refuse(
        `"${name}" is named .csv but holds a workbook (a zip archive). Rename it to .xlsx or export it as CSV.`,
      );
    if (startsWith(bytes, OLE_MAGIC) || bytes.subarray(0, 8192).includes(0)) {
      refuse(`"${name}" is named .csv but is not text. Export the sheet as CSV (UTF-8).`);
    }
  }
  return extension as ScheduleFileKind;
}

/** A schedule workbook unpacks to a few MB at most; far more is a wrong file or a zip bomb. */
export const MAX_XLSX_UNPACKED_BYTES = 100 * 1024 * 1024;

/**
 * Total uncompressed size of a zip archive's entries, from its central directory (PKWARE
 * APPNOTE 4.3.12/4.3.16), read before anything is inflated. null when the directory cannot be
 * found or uses ZIP64 (sizes of 4 GiB and over): treated as too large.
 */
export function zipUnpackedSize(bytes: Uint8Array): number | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const EOCD = 0x06054b50;
  const CENTRAL = 0x02014b50;
  let eocd = -1;
  // The end record is 22 bytes plus a comment of at most 65535 bytes.
  for (let i = bytes.byteLength - 22; i >= Math.max(0, bytes.byteLength - 22 - 65535); i -= 1) {
    if (view.getUint32(i, true) === EOCD) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) return null;
  const entries = view.getUint16(eocd + 10, true);
  let offset = view.getUint32(eocd + 16, true);
  let total = 0;
  for (let n = 0; n < entries; n += 1) {
    if (offset + 46 > bytes.byteLength || view.getUint32(offset, true) !== CENTRAL) return null;
    const size = view.getUint32(offset + 24, true);
    if (size === 0xffffffff) return null;
    total += size;
    offset +=
      46 +
      view.getUint16(offset + 28, true) +
      view.getUint16(offset + 30, true) +
      view.getUint16(offset + 32, true);
  }
  return total;
}

function cellsToTable(
  kind: ScheduleFileKind,
  records: { row: number; cells: string[] }[],
): ScheduleTable {
  const [head, ...body] = records;
  if (!head) refuse('The file has no header row: the first row must name the columns.');
  const headers = head.cells.map((h) => h.trim());
  while (headers.length && headers.at(-1) === '') headers.pop();
  if (headers.every((h) => h === '')) refuse('The first row must name the columns; it is empty.');
  const rows = body
    // One cell per named column, so CSV and XLSX rows read alike (XLSX omits trailing blanks).
    .map((r) => ({ row: r.row, cells: headers.map((_, i) => (r.cells[i] ?? '').trim()) }))
    .filter((r) => r.cells.some((c) => c !== ''));
  if (rows.length > MAX_IMPORT_ROWS)
    refuse(`The file has ${rows.length} rows; at most ${MAX_IMPORT_ROWS} can be imported at once.`);
  return { kind, headers, rows };
}

export function readCsv(textIn: string): ScheduleTable {
  const text = textIn.replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(text, {
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t', '|'],
  });
  const broken = parsed.errors.find((e) => e.type === 'Quotes');
  if (broken)
    refuse(`The CSV has an unclosed quote near row ${(broken.row ?? 0) + 1}: ${broken.message}.`);
  // Each parsed record is one spreadsheet row, so its index + 1 is the row number a user sees.
  return cellsToTable(
    'csv',
    parsed.data.map((cells, i) => ({ row: i + 1, cells: cells.map((c) => String(c ?? '')) })),
  );
}

/** A cell's value as the text a user sees in it (formulas by their result). */
function cellText(value: ExcelJS.CellValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  if (typeof value === 'object') {
    if ('richText' in value) return value.richText.map((r) => r.text).join('');
    if ('formula' in value || 'sharedFormula' in value)
      return cellText((value as { result?: ExcelJS.CellValue }).result ?? null);
    if ('text' in value) return String((value as { text: unknown }).text);
    if ('error' in value) return String((value as { error: unknown }).error);
  }
  return String(value);
}

export async function readXlsx(bytes: Uint8Array): Promise<ScheduleTable> {
  const unpacked = zipUnpackedSize(bytes);
  if (unpacked === null)
    refuse(
      'The workbook could not be read (its zip directory is missing or damaged). Save it again as .xlsx.',
    );
  if (unpacked > MAX_XLSX_UNPACKED_BYTES) {
    refuse(
      `The workbook unpacks to ${megabytes(unpacked)}, far more than a schedule needs (limit ${megabytes(MAX_XLSX_UNPACKED_BYTES)}).`,
    );
  }
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  } catch (err) {
    refuse(`The workbook could not be read (${(err as Error).message}). Save it again as .xlsx.`);
  }
  const sheet = workbook.worksheets[0];
  if (!sheet) refuse('The workbook has no worksheet.');
  const records: { row: number; cells: string[] }[] = [];
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: string[] = [];
    row.eachCell({ includeEmpty: true }, (cell, col) => {
      cells[col - 1] = cellText(cell.value);
    });
    records.push({ row: rowNumber, cells: Array.from(cells, (c) => c ?? '') });
  });
  // The header is the first row that holds anything (usually row 1).
  return cellsToTable('xlsx', records);
}

/** Checks and reads an upload into a table of cell texts. */
export async function readScheduleFile(name: string, bytes: Uint8Array): Promise<ScheduleTable> {
  const kind = checkScheduleFile(name, bytes);
  if (kind === 'xlsx') return readXlsx(bytes);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    refuse(`"${name}" is not UTF-8 text. Export the sheet as "CSV UTF-8".`);
  }
  return readCsv(text);
}
