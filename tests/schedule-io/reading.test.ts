/**
 * Reading an upload: the type and size checks, the column-mapping suggestion, and row-by-row
 * errors with the row numbers a spreadsheet shows (header = row 1).
 */
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { ValidationError } from '@/lib/errors';
import {
  checkMapping,
  checkScheduleFile,
  MAX_IMPORT_BYTES,
  parseMappingField,
  readCsv,
  readRows,
  readScheduleFile,
  suggestMapping,
  toExportRows,
  writeCsv,
  writeXlsx,
  zipUnpackedSize,
} from '@/lib/schedule-io';

const text = (s: string) => new TextEncoder().encode(s);

function messageOf(fn: () => unknown): string {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(ValidationError);
    return (err as ValidationError).message;
  }
  throw new Error('expected a refusal');
}

describe('upload checks: extension and content must agree', () => {
  it('accepts a CSV and an XLSX that are what they say', async () => {
    expect(checkScheduleFile('x.csv', text('strip,position\n'))).toBe('csv');
    const workbook = new ExcelJS.Workbook();
    workbook.addWorksheet('S').addRow(['strip']);
    const bytes = new Uint8Array((await workbook.xlsx.writeBuffer()) as ArrayBuffer);
    // An .xlsx is a zip archive: it starts with the local file header "PK\x03\x04" (ECMA-376 Part 2, zip container).
    expect([...bytes.subarray(0, 4)]).toEqual([0x50, 0x4b, 0x03, 0x04]);
    expect(checkScheduleFile('Schedule.XLSX', bytes)).toBe('xlsx');
  });

  it('refuses each mismatch with a message that says what to do', () => {
    expect(messageOf(() => checkScheduleFile('s.xlsx', text('strip,position\n')))).toMatch(
      /named \.xlsx but is not an Excel workbook/,
    );
    expect(
      messageOf(() => checkScheduleFile('s.csv', new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2]))),
    ).toMatch(/named \.csv but holds a workbook/);
    expect(
      messageOf(() => checkScheduleFile('s.xls', new Uint8Array([0xd0, 0xcf, 0x11, 0xe0]))),
    ).toMatch(/Only \.csv and \.xlsx.*Save the workbook as \.xlsx/);
    expect(messageOf(() => checkScheduleFile('s.pdf', text('%PDF-1.7')))).toMatch(
      /Only \.csv and \.xlsx files can be imported; "s.pdf" is \.pdf/,
    );
    expect(messageOf(() => checkScheduleFile('s.csv', new Uint8Array([0x73, 0x00, 0x74])))).toMatch(
      /not text/,
    );
    expect(messageOf(() => checkScheduleFile('s.csv', new Uint8Array(0)))).toMatch(/empty/);
  });

  it('refuses more than 5 MB, saying how big the file is', () => {
    const big = new Uint8Array(MAX_IMPORT_BYTES + 1).fill(0x61);
    expect(messageOf(() => checkScheduleFile('big.csv', big))).toMatch(
      /"big.csv" is 5\.0 MB; the import limit is 5 MB/,
    );
    // Exactly at the limit passes the size check.
    expect(checkScheduleFile('edge.csv', new Uint8Array(MAX_IMPORT_BYTES).fill(0x61))).toBe('csv');
  });

  it('refuses a workbook that would unpack to more than 100 MB, before unpacking it', async () => {
    const workbook = new ExcelJS.Workbook();
    workbook.addWorksheet('S').addRow(['strip', 'position', 'label', 'circuit_class']);
    const bytes = new Uint8Array((await workbook.xlsx.writeBuffer()) as ArrayBuffer);
    const honest = zipUnpackedSize(bytes)!;
    expect(honest).toBeGreaterThan(0);
    expect(honest).toBeLessThan(1024 * 1024);
    // Claim 200 MB for the first entry in the central directory (PKWARE APPNOTE 4.3.12: signature
    // 0x02014b50, uncompressed size at offset 24), as a zip bomb's directory would.
    const view = new DataView(bytes.buffer);
    let at = bytes.length - 22;
    while (view.getUint32(at, true) !== 0x06054b50) at -= 1;
    const firstEntry = view.getUint32(at + 16, true);
    expect(view.getUint32(firstEntry, true)).toBe(0x02014b50);
    view.setUint32(firstEntry + 24, 200 * 1024 * 1024, true);
    expect(zipUnpackedSize(bytes)).toBeGreaterThan(200 * 1024 * 1024);
    await expect(readScheduleFile('bomb.xlsx', bytes)).rejects.toThrow(/unpacks to 200\.\d MB/);
  });

  it('refuses a CSV that is not UTF-8', async () => {
    await expect(
      readScheduleFile(
        'latin.csv',
        new Uint8Array([0x73, 0x74, 0x72, 0x69, 0x70, 0x0a, 0xe9, 0x0a]),
      ),
    ).rejects.toThrow(/not UTF-8/);
  });
});

describe('column mapping', () => {
  it('matches our names regardless of case, spaces and punctuation, and a few synonyms', () => {
    const headers = [
      'Strip',
      'POS',
      'Level',
      'Terminal Label',
      'Wire No.',
      'Circuit-Class',
      'Colour',
      'Voltage (V)',
      'AC/DC',
      'Frequency',
      'Remarks',
      'Something else',
    ];
    expect(suggestMapping(headers)).toEqual({
      strip: 'Strip',
      position: 'POS',
      level: 'Level',
      label: 'Terminal Label',
      wire_no: 'Wire No.',
      circuit_class: 'Circuit-Class',
      colour: 'Colour',
      voltage: 'Voltage (V)',
      ac_dc: 'AC/DC',
      frequency_hz: 'Frequency',
      notes: 'Remarks',
    });
  });

  it('prefers an exact name over a synonym, and uses each header once', () => {
    // "wire" is a synonym of wire_no, but "wire_no" names it exactly.
    expect(suggestMapping(['wire', 'wire_no'])).toEqual({ wire_no: 'wire_no' });
    expect(suggestMapping(['Colour', 'Color'])).toEqual({ colour: 'Colour' });
  });

  it('names every problem in a mapping', () => {
    const problems = checkMapping({ strip: 'Rail', position: 'Pos', label: 'Pos' }, [
      'Rail',
      'Pos',
    ]);
    expect(problems).toEqual([
      { column: 'label', message: '"Pos" is already mapped to position; map each header once.' },
      {
        column: 'circuit_class',
        message: "circuit_class is required: map one of the file's columns to it.",
      },
    ]);
    expect(
      checkMapping({ strip: 'Missing', position: 'a', label: 'b', circuit_class: 'c' }, [
        'a',
        'b',
        'c',
      ]),
    ).toEqual([{ column: 'strip', message: 'the file has no column headed "Missing".' }]);
    expect(parseMappingField('{"stripp": "Rail"}').problems[0].message).toMatch(
      /not one of our columns/,
    );
    expect(parseMappingField('not json').problems[0].message).toMatch(/must be JSON/);
  });
});

describe('row-by-row reading', () => {
  it('reports { row, column, message } with spreadsheet row numbers, blank lines counted', () => {
    const table = readCsv(
      [
        'strip,position,level,label,circuit_class,voltage,ac_dc',
        'X1,1,,X1:1,spare,,',
        '',
        'X1,two,1,X1:2,spare,,',
        'X1,3,9,X1:3,mains,,',
        'X1,4,1,,hazard,24 V,dc',
        'X1,1,1,X1:1b,spare,,',
        'X1,5,1,X1:5,hazard,tall,dc',
      ].join('\n'),
    );
    const rows = readRows(table, suggestMapping(table.headers));
    expect(rows.map((r) => r.row)).toEqual([2, 4, 5, 6, 7, 8]);
    expect(rows[0].errors).toEqual([]);
    expect(rows[0].parsed?.fields).toMatchObject({
      position: 1,
      level: 1,
      label: 'X1:1',
      circuitClass: 'spare',
      nominalVoltage: null,
    });
    expect(rows[1].errors).toEqual([
      {
        column: 'position',
        message: 'position must be a whole number of 1 or more; "two" is not.',
      },
    ]);
    expect(rows[2].errors).toEqual([
      { column: 'level', message: 'level must be a whole number from 1 to 6; got 9.' },
      {
        column: 'circuit_class',
        message:
          'circuit_class "mains" is not one of: hazard, sensitive, return, earth, spare, barrier.',
      },
    ]);
    expect(rows[3].errors).toEqual([{ column: 'label', message: 'label is required.' }]);
    expect(rows[4].errors).toEqual([
      {
        column: 'position',
        message: 'strip X1 position 1 level 1 is also on row 2; each place may appear once.',
      },
    ]);
    expect(rows[5].errors[0]).toMatchObject({ column: 'voltage' });
    expect(rows[5].errors[0].message).toMatch(/must be a number in volts.*"tall" is not/);
  });

  it('reads units and engineering notation in measured columns', () => {
    const table = readCsv(
      'strip,position,label,circuit_class,hazard_kind,voltage,ac_dc,frequency_hz,source_ohms\nX1,1,X1:1,hazard,mains-line,230 V,AC,50Hz,1k\n',
    );
    const [row] = readRows(table, suggestMapping(table.headers));
    expect(row.errors).toEqual([]);
    expect(row.parsed?.fields).toMatchObject({
      nominalVoltage: 230,
      currentKind: 'ac',
      frequency: 50,
      sourceImpedance: 1000,
      hazardKind: 'mains-line',
    });
  });

  it('guesses a semicolon delimiter (spreadsheets in many locales write one)', () => {
    const table = readCsv('strip;position;label;circuit_class\nX1;1;X1:1;spare\n');
    expect(table.headers).toEqual(['strip', 'position', 'label', 'circuit_class']);
    expect(table.rows).toEqual([{ row: 2, cells: ['X1', '1', 'X1:1', 'spare'] }]);
  });
});

describe('export writes what import reads', () => {
  const source = [
    {
      stripTag: 'X1',
      position: 1,
      level: 1,
      label: 'X1:1',
      circuitClass: 'hazard',
      hazardKind: 'mains-line',
      nominalVoltage: 230,
      currentKind: 'ac',
      frequency: 50,
      channelTag: null,
      notes: 'Feed, "main" — 230 V',
    },
    {
      stripTag: 'X1',
      position: 2,
      level: 2,
      label: 'X1:2.2',
      circuitClass: 'sensitive',
      channelTag: 'TT-1',
      wireColour: 'BU',
      blockId: 'X1-B2',
    },
  ];

  it('CSV and XLSX both read back to the same cells', async () => {
    const rows = toExportRows(source);
    const csv = await readScheduleFile('out.csv', new TextEncoder().encode(writeCsv(rows)));
    const xlsx = await readScheduleFile('out.xlsx', await writeXlsx(rows));
    expect(csv.headers).toEqual(xlsx.headers);
    expect(csv.rows).toEqual(xlsx.rows);
    const read = readRows(csv, suggestMapping(csv.headers));
    expect(read.map((r) => r.errors)).toEqual([[], []]);
    expect(read[0].parsed).toMatchObject({
      stripTag: 'X1',
      channelTag: null,
      fields: { nominalVoltage: 230, notes: 'Feed, "main" — 230 V' },
    });
    expect(read[1].parsed).toMatchObject({
      stripTag: 'X1',
      channelTag: 'TT-1',
      fields: { level: 2, blockId: 'X1-B2', wireColour: 'BU' },
    });
  });
});
