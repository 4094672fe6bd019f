/**
 * Cell values of engine-room CSV files: numbers with a decimal point or comma, dates in the accepted formats, and
 * units converted to the stored ones (h, kWh, kg, L, °C).
 */
import type { DateFormat, Unit } from '../../shared/schemas/logs';

export type DecimalSeparator = '.' | ',';

/** Spaces people put between thousands: space, no-break space, narrow no-break space, thin space. */
const GROUP_SPACES = /[ \u00a0\u202f\u2009]/g;

const CH_0 = 48;
const CH_9 = 57;
const CH_PLUS = 43;
const CH_MINUS = 45;

/**
 * The value of a cell that is a plain decimal numeral (optional sign, digits, at most one decimal separator of the
 * file's kind, digits on both sides of it, nothing else), else null: the common case, read without regular
 * expressions. Every other cell goes through the full rules of parseNumberCell, which give the same value here.
 */
function plainNumber(s: string, decimal: DecimalSeparator): number | null {
  const n = s.length;
  let i = 0;
  if (n === 0) return null;
  const first = s.charCodeAt(0);
  if (first === CH_PLUS || first === CH_MINUS) i = 1;
  const sep = decimal === ',' ? 44 : 46;
  let digits = 0;
  let sepAt = -1;
  for (; i < n; i++) {
    const c = s.charCodeAt(i);
    if (c >= CH_0 && c <= CH_9) digits++;
    else if (c === sep && sepAt < 0 && digits > 0) sepAt = i;
    else return null;
  }
  if (digits === 0 || sepAt === n - 1) return null;
  const value = Number(sepAt >= 0 && decimal === ',' ? `${s.slice(0, sepAt)}.${s.slice(sepAt + 1)}` : s);
  return Number.isFinite(value) ? value : null;
}

/**
 * Parses a number cell. Blank → null. With '.' decimals, a comma is refused (it would be a thousands separator or a
 * decimal comma; the file must say which). With ',' decimals, '.' is accepted only as a thousands separator in
 * groups of three (1.234,5). Spaces between digit groups are accepted. Anything else → an error message.
 */
export function parseNumberCell(raw: string, decimal: DecimalSeparator): { ok: true; value: number | null } | { ok: false; message: string } {
  const plain = plainNumber(raw, decimal);
  if (plain !== null) return { ok: true, value: plain };
  let s = raw.trim();
  if (s === '') return { ok: true, value: null };
  s = s.replace(GROUP_SPACES, '');
  if (decimal === ',') {
    if (/^[+-]?\d{1,3}(\.\d{3})+(,\d+)?$/.test(s)) s = s.replace(/\./g, '');
    else if (s.includes('.')) return { ok: false, message: `"${raw}" is not a number with a decimal comma` };
    s = s.replace(',', '.');
  } else if (s.includes(',')) {
    return { ok: false, message: `"${raw}" has a comma; this file uses a decimal point (choose decimal comma if the file uses it)` };
  }
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(s)) return { ok: false, message: `"${raw}" is not a number` };
  const value = Number(s);
  if (!Number.isFinite(value)) return { ok: false, message: `"${raw}" is not a finite number` };
  return { ok: true, value };
}

/**
 * Guesses the decimal separator from number-like cells: ',' when more cells look like 12,5 than like 12.5.
 * A delimiter of ',' always means '.' decimals unless the cells were quoted with commas.
 */
export function detectDecimalSeparator(cells: Iterable<string>): DecimalSeparator {
  let commas = 0;
  let points = 0;
  for (const c of cells) {
    const s = c.trim();
    if (/^[+-]?\d+,\d+$/.test(s) || /^[+-]?\d{1,3}(\.\d{3})+,\d+$/.test(s)) commas++;
    else if (/^[+-]?\d+\.\d+$/.test(s)) points++;
  }
  return commas > points ? ',' : '.';
}

const DATE_PATTERNS: Record<DateFormat, RegExp> = {
  'yyyy-mm-dd': /^(\d{4})-(\d{1,2})-(\d{1,2})$/,
  'dd/mm/yyyy': /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/,
  'mm/dd/yyyy': /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/,
  'dd.mm.yyyy': /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/,
};

/** Days in a month of the proleptic Gregorian calendar. */
function daysInMonth(y: number, m: number): number {
  if (m === 2) return (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0 ? 29 : 28;
  return m === 4 || m === 6 || m === 9 || m === 11 ? 30 : 31;
}

function isoOf(y: number, m: number, d: number): string | null {
  // Years 0 to 99 are refused (Date.UTC reads them as 1900 to 1999; no engine-room log is that old).
  if (y < 100 || m < 1 || m > 12 || d < 1 || d > daysInMonth(y, m)) return null;
  return `${String(y).padStart(4, '0')}-${m < 10 ? '0' : ''}${m}-${d < 10 ? '0' : ''}${d}`;
}

/** Parses a date cell in the given format into YYYY-MM-DD; a malformed or impossible date gives a message. */
export function parseDateCell(raw: string, format: DateFormat): { ok: true; value: string } | { ok: false; message: string } {
  const s = raw.trim();
  const m = DATE_PATTERNS[format].exec(s);
  if (!m) return { ok: false, message: `"${raw}" is not a date as ${format}` };
  const [a, b, c] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const iso = format === 'yyyy-mm-dd' ? isoOf(a, b, c) : format === 'mm/dd/yyyy' ? isoOf(c, a, b) : isoOf(c, b, a);
  if (!iso) return { ok: false, message: `"${raw}" is not a calendar date (${format})` };
  return { ok: true, value: iso };
}

export type DateDetection =
  | { kind: 'format'; format: DateFormat }
  | { kind: 'ambiguous'; candidates: DateFormat[]; example: string }
  | { kind: 'unknown'; example: string | null };

/**
 * Detects the date format of a column. ISO and dotted dates are recognised by their separators. Slash dates are
 * day-first when some first number exceeds 12, month-first when some second number does, and ambiguous when
 * neither (the user must choose) or both (mixed; reported as ambiguous too).
 */
export function detectDateFormat(cells: Iterable<string>): DateDetection {
  let iso = 0;
  let dotted = 0;
  let slash = 0;
  let firstOver12 = false;
  let secondOver12 = false;
  let example: string | null = null;
  let other: string | null = null;
  for (const c of cells) {
    const s = c.trim();
    if (s === '') continue;
    example ??= s;
    if (DATE_PATTERNS['yyyy-mm-dd'].test(s)) iso++;
    else if (DATE_PATTERNS['dd.mm.yyyy'].test(s)) dotted++;
    else {
      const m = DATE_PATTERNS['dd/mm/yyyy'].exec(s);
      if (m) {
        slash++;
        if (Number(m[1]) > 12) firstOver12 = true;
        if (Number(m[2]) > 12) secondOver12 = true;
      } else other ??= s;
    }
  }
  const kinds = [iso > 0, dotted > 0, slash > 0].filter(Boolean).length;
  if (kinds === 0) return { kind: 'unknown', example: other ?? example };
  if (kinds > 1) return { kind: 'ambiguous', candidates: [...(iso ? ['yyyy-mm-dd' as const] : []), ...(dotted ? ['dd.mm.yyyy' as const] : []), ...(slash ? ['dd/mm/yyyy' as const, 'mm/dd/yyyy' as const] : [])], example: example ?? '' };
  if (iso) return { kind: 'format', format: 'yyyy-mm-dd' };
  if (dotted) return { kind: 'format', format: 'dd.mm.yyyy' };
  if (firstOver12 && !secondOver12) return { kind: 'format', format: 'dd/mm/yyyy' };
  if (secondOver12 && !firstOver12) return { kind: 'format', format: 'mm/dd/yyyy' };
  return { kind: 'ambiguous', candidates: ['dd/mm/yyyy', 'mm/dd/yyyy'], example: example ?? '' };
}

/** Factor from a column's unit to the stored unit (h, kWh, kg, L, °C). */
export const UNIT_TO_STORED: Record<Unit, number> = { h: 1, kWh: 1, MWh: 1000, kg: 1, t: 1000, L: 1, m3: 1000, C: 1 };

/** A value in a column's unit converted to the stored unit. */
export function toStoredUnit(value: number, unit: Unit): number {
  return value * UNIT_TO_STORED[unit];
}
