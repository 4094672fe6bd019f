import { describe, expect, it } from 'vitest';
import { AppError } from '../../server/errors';
import { decodeCsv, detectDelimiter, neutraliseCell, parseCsv, writeCsv, type CsvRecord, type Delimiter } from '../../server/lib/csv';
import { guessMapping, interpretRecords, planMapping, TEMPLATE_HEADERS } from '../../server/lib/csv-mapping';
import { detectDateFormat, detectDecimalSeparator, parseDateCell, parseNumberCell, toStoredUnit } from '../../server/lib/csv-values';

const enc = (s: string) => new TextEncoder().encode(s);

function parseAll(text: string, chunkSize?: number) {
  const d = detectDelimiter(text);
  const records: CsvRecord[] = [];
  const { headers } = parseCsv(text, d, (b) => records.push(...b), chunkSize);
  return { delimiter: d, headers, records };
}

// Quoting rules: RFC 4180 section 2 (fields with delimiters, quotes or line breaks are enclosed in double quotes;
// a quote inside is doubled).
describe('CSV structure (RFC 4180 quoting), delimiters, BOM', () => {
  const rows = [
    ['date', 'genset', 'remarks'],
    ['2026-01-01', 'DG1', 'plain'],
    ['2026-01-02', 'DG2', 'with "quotes", a delimiter; and a tab\tinside'],
    ['2026-01-03', 'DG1', 'two\nlines'],
  ];
  const quote = (c: string, d: string) => (c.includes(d) || c.includes('"') || c.includes('\n') || c.includes('\t') || c.includes(',') || c.includes(';') ? `"${c.replace(/"/g, '""')}"` : c);
  for (const d of [',', ';', '\t'] as Delimiter[]) {
    it(`detects ${JSON.stringify(d)} and reads quoted fields back exactly`, () => {
      const text = rows.map((r) => r.map((c) => quote(c, d)).join(d)).join('\r\n');
      const out = parseAll(text);
      expect(out.delimiter).toBe(d);
      expect(out.headers).toEqual(rows[0]);
      expect(out.records.map((r) => r.cells)).toEqual(rows.slice(1));
      // Row numbers as a spreadsheet counts records: header 1, then 2, 3, 4.
      expect(out.records.map((r) => r.row)).toEqual([2, 3, 4]);
    });
  }

  it('gives the same records when papaparse streams the text in small chunks', () => {
    const lines = ['date;genset;fuel_mass_kg'];
    for (let i = 0; i < 500; i++) lines.push(`2026-01-${String((i % 28) + 1).padStart(2, '0')};DG${i % 3};"${i},5"`);
    const text = lines.join('\n');
    const whole = parseAll(text).records;
    const chunked = parseAll(text, 97).records;
    expect(chunked).toEqual(whole);
    expect(whole).toHaveLength(500);
  });

  it('strips a UTF-8 byte order mark (U+FEFF) and keeps non-ASCII text', () => {
    const withBom = new Uint8Array([0xef, 0xbb, 0xbf, ...enc('date,remarks\n2026-01-01,Kühler gereinigt °C')]);
    const text = decodeCsv(withBom);
    expect(text.startsWith('date')).toBe(true);
    expect(parseAll(text).records[0].cells[1]).toBe('Kühler gereinigt °C');
    expect(decodeCsv(enc('date\n2026-01-01'))).toBe('date\n2026-01-01');
  });

  it('refuses binary content, invalid UTF-8 and empty files', () => {
    const code = (buf: Uint8Array) => {
      try {
        decodeCsv(buf);
        return 'accepted';
      } catch (e) {
        return (e as AppError).code;
      }
    };
    expect(code(new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x2d, 0x31]))).toBe('unsupported_media_type'); // %PDF-
    expect(code(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2]))).toBe('unsupported_media_type'); // ZIP / xlsx
    expect(code(enc('date,x\n2026-01-01,\u0000\u0001'))).toBe('unsupported_media_type');
    expect(code(new Uint8Array([0x64, 0x61, 0xff, 0xfe, 0x0a]))).toBe('unsupported_media_type'); // not UTF-8
    expect(code(new Uint8Array([]))).toBe('bad_request');
    expect(code(enc(' \n \n'))).toBe('bad_request');
  });

  it('refuses a file with only blank lines after the header as header-only (no records)', () => {
    expect(parseAll('date,genset\n\n\n').records).toEqual([]);
  });
});

describe('numbers with decimal point or decimal comma', () => {
  // Reference values: JavaScript's Number() on the same digits written with a point (ECMA-262 StringToNumber).
  const cases: [string, '.' | ',', number][] = [
    ['1234.5', '.', Number('1234.5')],
    ['1234,5', ',', Number('1234.5')],
    ['1.234,5', ',', Number('1234.5')],
    ['1 234,5', ',', Number('1234.5')],
    ['1\u00a0234.5', '.', Number('1234.5')],
    ['-0,25', ',', Number('-0.25')],
    ['12', ',', 12],
    ['1e3', '.', 1000],
  ];
  for (const [raw, dec, expected] of cases) {
    it(`reads "${raw}" with decimal ${dec} as ${expected}`, () => {
      expect(parseNumberCell(raw, dec)).toEqual({ ok: true, value: expected });
    });
  }
  it('refuses text, a comma under decimal point, and a point under decimal comma', () => {
    expect(parseNumberCell('abc', '.').ok).toBe(false);
    expect(parseNumberCell('12 kg', '.').ok).toBe(false);
    expect(parseNumberCell('1,5', '.').ok).toBe(false);
    expect(parseNumberCell('1.5', ',').ok).toBe(false);
    expect(parseNumberCell('=1+2', '.').ok).toBe(false);
    expect(parseNumberCell('  ', '.')).toEqual({ ok: true, value: null });
  });
  it('detects the decimal separator from the cells', () => {
    expect(detectDecimalSeparator(['12,5', '13,25', '100'])).toBe(',');
    expect(detectDecimalSeparator(['12.5', '13.25', '100'])).toBe('.');
    expect(detectDecimalSeparator(['100', '200'])).toBe('.');
  });
});

describe('dates: yyyy-mm-dd (ISO 8601 calendar date), dd/mm/yyyy, mm/dd/yyyy, dd.mm.yyyy', () => {
  it('reads each format to the same calendar date', () => {
    expect(parseDateCell('2026-03-07', 'yyyy-mm-dd')).toEqual({ ok: true, value: '2026-03-07' });
    expect(parseDateCell('07/03/2026', 'dd/mm/yyyy')).toEqual({ ok: true, value: '2026-03-07' });
    expect(parseDateCell('03/07/2026', 'mm/dd/yyyy')).toEqual({ ok: true, value: '2026-03-07' });
    expect(parseDateCell('7.3.2026', 'dd.mm.yyyy')).toEqual({ ok: true, value: '2026-03-07' });
  });
  it('refuses impossible dates (checked against Date.UTC round trip) and wrong formats', () => {
    // 2026 is not a leap year; 2024 is (Gregorian rule).
    expect(parseDateCell('2026-02-29', 'yyyy-mm-dd').ok).toBe(false);
    expect(parseDateCell('29.02.2024', 'dd.mm.yyyy')).toEqual({ ok: true, value: '2024-02-29' });
    expect(parseDateCell('31/04/2026', 'dd/mm/yyyy').ok).toBe(false);
    expect(parseDateCell('2026-03-07', 'dd/mm/yyyy').ok).toBe(false);
    expect(parseDateCell('yesterday', 'yyyy-mm-dd').ok).toBe(false);
  });
  it('detects formats and flags ambiguous slash dates', () => {
    expect(detectDateFormat(['2026-01-01', '2026-01-02'])).toEqual({ kind: 'format', format: 'yyyy-mm-dd' });
    expect(detectDateFormat(['01.02.2026', '13.02.2026'])).toEqual({ kind: 'format', format: 'dd.mm.yyyy' });
    expect(detectDateFormat(['01/02/2026', '13/02/2026'])).toEqual({ kind: 'format', format: 'dd/mm/yyyy' });
    expect(detectDateFormat(['02/01/2026', '02/13/2026'])).toEqual({ kind: 'format', format: 'mm/dd/yyyy' });
    expect(detectDateFormat(['01/02/2026', '03/04/2026'])).toMatchObject({ kind: 'ambiguous', candidates: ['dd/mm/yyyy', 'mm/dd/yyyy'] });
    expect(detectDateFormat(['2026-01-01', '01.02.2026']).kind).toBe('ambiguous');
    expect(detectDateFormat(['Monday']).kind).toBe('unknown');
  });
});

// Unit factors: SI Brochure (BIPM, 9th ed.) prefixes and the tonne (1 t = 10^3 kg), litre (1 L = 10^-3 m3),
// megawatt-hour (1 MWh = 10^3 kWh).
describe('units to stored units', () => {
  it.each([
    [2.5, 't', 2500],
    [2500, 'kg', 2500],
    [1.2, 'm3', 1200],
    [1200, 'L', 1200],
    [3.4, 'MWh', 3400],
    [3400, 'kWh', 3400],
    [20, 'h', 20],
    [45, 'C', 45],
  ] as const)('%d %s → %d', (v, unit, stored) => {
    expect(toStoredUnit(v, unit)).toBeCloseTo(stored, 9);
  });
});

describe('column mapping', () => {
  it('maps every template header to its field and unit', () => {
    const m = guessMapping(TEMPLATE_HEADERS, ['DG1']);
    expect(Object.fromEntries(Object.entries(m).map(([h, e]) => [h, `${e.field}${e.unit ? ` ${e.unit}` : ''}`]))).toEqual({
      date: 'date',
      genset: 'genset',
      running_hours_meter_h: 'runningHoursMeter h',
      hours_run_h: 'hoursRun h',
      kwh_meter_kwh: 'kwhMeter kWh',
      kwh_produced_kwh: 'kwh kWh',
      fuel_mass_kg: 'fuelMass kg',
      fuel_volume_l: 'fuelVolume L',
      fuel_temp_c: 'fuelTemp C',
      fuel_lot: 'fuelLot',
      remarks: 'remarks',
      sea_h: 'seaH h',
      manoeuvring_h: 'manoeuvringH h',
      port_h: 'portH h',
      anchorage_h: 'anchorageH h',
      shore_power_h: 'shorePowerH h',
    });
  });

  it('guesses units and wide-file sets from header words', () => {
    const m = guessMapping(['Date', 'DG1 Running hours', 'DG1 Energy (MWh)', 'DG2 Fuel (t)', 'DG2 Fuel volume [m³]', 'Weather'], ['DG1', 'DG2']);
    expect(m['DG1 Running hours']).toEqual({ field: 'runningHoursMeter', unit: 'h', genset: 'DG1' });
    expect(m['DG1 Energy (MWh)']).toEqual({ field: 'kwh', unit: 'MWh', genset: 'DG1' });
    expect(m['DG2 Fuel (t)']).toEqual({ field: 'fuelMass', unit: 't', genset: 'DG2' });
    expect(m['DG2 Fuel volume [m³]']).toEqual({ field: 'fuelVolume', unit: 'm3', genset: 'DG2' });
    expect(m.Weather.field).toBe('ignore');
  });

  it('refuses a mapping without a date or naming a missing column, naming the column', () => {
    expect(() => planMapping(['a', 'b'], { columns: guessMapping(['a', 'b'], []) }, [])).toThrow(/No column is mapped to the date/);
    expect(() => planMapping(['date'], { columns: { date: { field: 'date' }, nope: { field: 'kwh' } } }, [])).toThrow(/"nope"/);
  });

  it('interprets a wide file into one day per set, in stored units, with cell problems as row issues', () => {
    const headers = ['Date', 'DG1 hours run', 'DG1 kWh', 'DG1 fuel (t)', 'DG2 hours run', 'DG2 kWh', 'DG2 fuel (t)', 'Sea h'];
    const plan = planMapping(headers, { columns: guessMapping(headers, ['DG1', 'DG2']) }, ['DG1', 'DG2']);
    const records: CsvRecord[] = [
      { row: 2, cells: ['01.03.2026', '20', '10000', '2,2', '', '', '', '24'] },
      { row: 3, cells: ['02.03.2026', 'x', '9000', '2,0', '4', '2000', '-0,5', '12'] },
    ];
    const out = interpretRecords(records, plan, { dateFormat: 'dd.mm.yyyy', decimal: ',', lotIdByReference: new Map(), minDate: '2000-01-01', maxDate: '2030-01-01' });
    expect(out.setDays.map((d) => [d.row, d.designation, d.logDate])).toEqual([
      [2, 'DG1', '2026-03-01'],
      [3, 'DG1', '2026-03-02'],
      [3, 'DG2', '2026-03-02'],
    ]);
    expect(out.setDays[0].values).toEqual({ hoursRun: 20, kwh: 10000, fuelMassKg: 2200 });
    expect(out.setDays[0].errors).toEqual([]);
    expect(out.setDays[1].errors).toEqual([{ row: 3, path: 'DG1 hours run', message: 'Hours run: "x" is not a number' }]);
    expect(out.setDays[2].errors[0]).toMatchObject({ row: 3, path: 'DG2 fuel (t)' });
    expect(out.modeDays.map((m) => [m.logDate, m.values.seaH])).toEqual([
      ['2026-03-01', 24],
      ['2026-03-02', 12],
    ]);
  });
});

// Formula neutralisation: OWASP "CSV Injection" guidance (prefix cells starting with = + - @ tab CR by a quote).
describe('export neutralises formula-like cells', () => {
  it.each(['=HYPERLINK("http://x")', '+1+2', '-2+3', '@SUM(A1)', '\tx', '\rx'])('prefixes %j', (cell) => {
    expect(neutraliseCell(cell)).toBe(`'${cell}`);
  });
  it('leaves ordinary text and numbers alone, and writes parseable CSV', () => {
    expect(neutraliseCell('DG1 ok')).toBe('DG1 ok');
    const csv = writeCsv(['a', 'b'], [['=1+1', -5], ['x,y', null]]);
    const back = parseAll(csv).records.map((r) => r.cells);
    expect(back).toEqual([
      ["'=1+1", '-5'],
      ['x,y', ''],
    ]);
  });
});
