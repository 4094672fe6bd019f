/**
 * CSV text handling for log intake: refusing binary files, UTF-8 decoding (with or without BOM), delimiter
 * detection, streaming parse with papaparse, and writing CSV with spreadsheet-formula neutralisation.
 */
import Papa from 'papaparse';
import { AppError } from '../errors';

/** Leading bytes of file types people upload by mistake. */
const MAGIC: { name: string; bytes: number[] }[] = [
  { name: 'PDF', bytes: [0x25, 0x50, 0x44, 0x46] },
  { name: 'PNG image', bytes: [0x89, 0x50, 0x4e, 0x47] },
  { name: 'JPEG image', bytes: [0xff, 0xd8, 0xff] },
  { name: 'ZIP archive (an .xlsx workbook is one)', bytes: [0x50, 0x4b, 0x03, 0x04] },
  { name: 'gzip archive', bytes: [0x1f, 0x8b] },
  { name: 'legacy Excel workbook', bytes: [0xd0, 0xcf, 0x11, 0xe0] },
];

function startsWith(buf: Uint8Array, bytes: number[]): boolean {
  return buf.length >= bytes.length && bytes.every((b, i) => buf[i] === b);
}

/**
 * Decodes an uploaded CSV: refuses known binary formats and any file with NUL bytes or invalid UTF-8; strips a BOM.
 * Throws AppError 'unsupported_media_type' for binary input, 'bad_request' for an empty file.
 */
export function decodeCsv(buf: Uint8Array): string {
  if (buf.length === 0) throw new AppError('bad_request', 'The file is empty', [{ path: 'file', message: 'Empty file' }]);
  for (const m of MAGIC) {
    if (startsWith(buf, m.bytes)) {
      throw new AppError('unsupported_media_type', `The file is a ${m.name}, not CSV text; save the sheet as CSV (UTF-8) and upload that`, [
        { path: 'file', message: `Binary content (${m.name})` },
      ]);
    }
  }
  const probe = buf.subarray(0, Math.min(buf.length, 65_536));
  if (probe.includes(0)) {
    throw new AppError('unsupported_media_type', 'The file contains binary data (NUL bytes), not CSV text', [{ path: 'file', message: 'Binary content' }]);
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buf);
  } catch {
    throw new AppError('unsupported_media_type', 'The file is not UTF-8 text; save it as "CSV UTF-8" and upload again', [{ path: 'file', message: 'Not UTF-8' }]);
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === '') throw new AppError('bad_request', 'The file is empty', [{ path: 'file', message: 'Empty file' }]);
  return text;
}

export const DELIMITERS = [',', ';', '\t'] as const;
export type Delimiter = (typeof DELIMITERS)[number];

/** Counts of each candidate delimiter outside double quotes in one line. */
function countOutsideQuotes(line: string): Record<Delimiter, number> {
  const counts: Record<Delimiter, number> = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of line) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++;
  }
  return counts;
}

/**
 * The delimiter of a CSV text, from its header line (headers carry no decimal commas): the candidate (comma,
 * semicolon, tab) that occurs most often outside quotes; ties go to tab, then semicolon. A header with none of them
 * is a one-column file: comma.
 */
export function detectDelimiter(text: string): Delimiter {
  const end = text.search(/\r?\n/);
  const header = end < 0 ? text : text.slice(0, end);
  const counts = countOutsideQuotes(header);
  let best: Delimiter = ',';
  for (const d of ['\t', ';', ','] as const) if (counts[d] > counts[best]) best = d;
  return best;
}

export interface CsvRecord {
  /** Row number as a spreadsheet shows it (header = 1). */
  row: number;
  cells: string[];
}

/**
 * Parses CSV text with papaparse in chunks (its string streamer), calling onRecords with each batch of data records
 * (the header excluded; blank lines skipped but counted). Returns the header cells.
 * Throws AppError when the text has no header or a quoted field is never closed.
 */
export function parseCsv(text: string, delimiter: Delimiter, onRecords: (records: CsvRecord[]) => void, chunkSize = 1 << 20): { headers: string[] } {
  let headers: string[] | null = null;
  let row = 0;
  const problems: { row: number; message: string }[] = [];
  // papaparse's string streamer honours chunkSize and calls chunk synchronously (its typings list chunk for files only).
  const parseChunked = Papa.parse as unknown as (input: string, config: Papa.ParseConfig<string[]> & { chunkSize: number; chunk: (results: Papa.ParseResult<string[]>) => void }) => void;
  parseChunked(text, {
    delimiter,
    quoteChar: '"',
    skipEmptyLines: false,
    chunkSize,
    chunk: (results) => {
      for (const e of results.errors) {
        if (e.code === 'MissingQuotes' || e.code === 'InvalidQuotes') problems.push({ row: row + (e.row ?? 0) + 1, message: e.message });
      }
      const batch: CsvRecord[] = [];
      for (const cells of results.data) {
        row++;
        if (cells.length === 1 && cells[0].trim() === '') continue;
        if (headers === null) {
          headers = cells.map((h: string) => h.trim());
          continue;
        }
        batch.push({ row, cells });
      }
      if (batch.length) onRecords(batch);
    },
  });
  if (problems.length) {
    throw new AppError('validation_failed', `The file has an unclosed or misplaced quote near row ${problems[0].row}`, problems.map((p) => ({ path: 'file', row: p.row, message: p.message })));
  }
  if (headers === null) throw new AppError('bad_request', 'The file has no header row', [{ path: 'file', message: 'No header' }]);
  return { headers };
}

/** Cells a spreadsheet would run as a formula start with one of these. */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Neutralises a text cell for export: a leading apostrophe before = + - @ tab or CR, so a spreadsheet shows it as
 * text instead of running it (OWASP "CSV injection" guidance). Apply to text fields; numbers written by the
 * server are plain numerals.
 */
export function neutraliseCell(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}

/** Writes rows as CSV (comma, CRLF, quoted where needed), neutralising every string cell. */
export function writeCsv(headers: string[], rows: (string | number | null)[][]): string {
  const data = rows.map((r) => r.map((v) => (v === null ? '' : typeof v === 'number' ? String(v) : neutraliseCell(v))));
  return Papa.unparse({ fields: headers.map(neutraliseCell), data }, { newline: '\r\n', quotes: false });
}
