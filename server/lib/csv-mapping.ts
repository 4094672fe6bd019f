/**
 * Column mapping of engine-room CSV files: a guess from header names, checks of a mapping against the file, and the
 * interpretation of records into genset-days and vessel mode-hour days (in stored units).
 */
import {
  FIELD_LABELS,
  FIELD_UNITS,
  MODE_FIELDS,
  type ColumnMapping,
  type ColumnMappingEntry,
  type DateFormat,
  type Issue,
  type LogField,
  type ModeField,
  type RawLogValues,
  type Unit,
} from '../../shared/schemas/logs';
import { AppError } from '../errors';
import type { CsvRecord } from './csv';
import { UNIT_TO_STORED, parseDateCell, parseNumberCell, type DecimalSeparator } from './csv-values';

function norm(header: string): string {
  return header
    .toLowerCase()
    .replace(/m³/g, 'm3')
    .replace(/[_\-/()[\]{}.:#]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

function guessUnit(h: string, field: LogField): Unit | undefined {
  const allowed = (FIELD_UNITS as Record<string, readonly Unit[]>)[field];
  if (!allowed) return undefined;
  const words = new Set(h.split(' '));
  const has = (...w: string[]) => w.some((x) => words.has(x));
  let unit: Unit | undefined;
  if (has('mwh')) unit = 'MWh';
  else if (has('kwh')) unit = 'kWh';
  else if (has('t', 'mt', 'tonnes', 'tons', 'tonne')) unit = 't';
  else if (has('kg')) unit = 'kg';
  else if (has('m3', 'cbm')) unit = 'm3';
  else if (has('l', 'litre', 'litres', 'liter', 'liters', 'ltr')) unit = 'L';
  return unit && allowed.includes(unit) ? unit : allowed[0];
}

function guessField(h: string): LogField {
  const w = ` ${h} `;
  const meter = /\b(meter|counter|reading|total|cumulative|cum)\b/.test(h);
  if (/\b(date|day|datum)\b/.test(h) && !/\bhours?\b/.test(h)) return 'date';
  if (/^(genset|generator|gen|set|dg|engine|unit|aux engine|auxiliary engine)( (no|id|name|designation))?$/.test(h)) return 'genset';
  if (/\btemp|temperature\b/.test(h)) return 'fuelTemp';
  if (/\b(lot|bunker|bdn)\b/.test(h)) return 'fuelLot';
  if (/\b(remark|remarks|comment|comments|note|notes)\b/.test(h)) return 'remarks';
  if (/manoeuv|maneuv/.test(h)) return 'manoeuvringH';
  if (/\banchor/.test(h)) return 'anchorageH';
  if (/\bshore\b/.test(h)) return 'shorePowerH';
  if (/\b(sea|passage|sea passage|at sea)\b/.test(h)) return 'seaH';
  if (/\b(port|harbour|harbor|berth)\b/.test(h)) return 'portH';
  if (/\b(kwh|mwh|energy|produced|generated)\b/.test(h)) return meter ? 'kwhMeter' : 'kwh';
  if (/\b(fuel|fo|do|mgo|consumption|cons)\b/.test(h)) {
    if (/\b(volume|vol|l|litre|litres|liter|liters|ltr|m3|cbm)\b/.test(h)) return 'fuelVolume';
    return 'fuelMass';
  }
  if (/\b(hours run|run hours|hrs run|hours|hrs)\b/.test(w) || /\brunning\b/.test(h) || /\brh\b/.test(h)) {
    if (/\b(hours run|run hours|hrs run|run hrs)\b/.test(h)) return 'hoursRun';
    if (meter || /\brunning\b/.test(h) || /\brh\b/.test(h)) return 'runningHoursMeter';
    return 'hoursRun';
  }
  return 'ignore';
}

/**
 * Guesses each column's field and unit from its header. A header starting with a set's designation (DG1 hours run)
 * is a wide-file column of that set. Unrecognised columns are 'ignore'; the user confirms or changes every guess.
 */
export function guessMapping(headers: string[], designations: string[]): ColumnMapping['columns'] {
  const out: ColumnMapping['columns'] = {};
  const byLength = [...designations].sort((a, b) => b.length - a.length);
  for (const header of headers) {
    let h = norm(header);
    let genset: string | undefined;
    for (const d of byLength) {
      const nd = norm(d);
      if (h.startsWith(`${nd} `)) {
        genset = d;
        h = h.slice(nd.length + 1);
        break;
      }
    }
    const field = guessField(h);
    const unit = guessUnit(h, field);
    const entry: ColumnMappingEntry = { field };
    if (unit) entry.unit = unit;
    if (genset && field !== 'date' && field !== 'genset' && !(MODE_FIELDS as readonly string[]).includes(field)) entry.genset = genset;
    out[header] = entry;
  }
  return out;
}

/** The header row of the downloadable template (long format: one row per set and day). */
export const TEMPLATE_HEADERS = [
  'date',
  'genset',
  'running_hours_meter_h',
  'hours_run_h',
  'kwh_meter_kwh',
  'kwh_produced_kwh',
  'fuel_mass_kg',
  'fuel_volume_l',
  'fuel_temp_c',
  'fuel_lot',
  'remarks',
  'sea_h',
  'manoeuvring_h',
  'port_h',
  'anchorage_h',
  'shore_power_h',
];

const SET_FIELD_TO_RAW: Partial<Record<LogField, keyof RawLogValues>> = {
  runningHoursMeter: 'runningHoursMeter',
  hoursRun: 'hoursRun',
  kwhMeter: 'kwhMeter',
  kwh: 'kwh',
  fuelMass: 'fuelMassKg',
  fuelVolume: 'fuelVolumeL',
  fuelTemp: 'fuelTempC',
  fuelLot: 'fuelLotId',
  remarks: 'remarks',
};

interface ColumnPlan {
  index: number;
  header: string;
  field: LogField;
  unit: Unit | undefined;
  genset: string | undefined;
}

/** The mapping checked against the file's headers; file-level problems throw a 422 naming the column. */
export interface MappingPlan {
  dateColumn: ColumnPlan;
  gensetColumn: ColumnPlan | null;
  /** Set columns by group: '' is the row's own genset (long files), else the designation (wide files). */
  groups: Map<string, ColumnPlan[]>;
  modeColumns: ColumnPlan[];
  mappedRawFields: (keyof RawLogValues)[];
}

/**
 * Checks a mapping against the file's headers. Throws AppError 422 when a mapped header is not in the file, no
 * column is the date, set columns have no genset, a field is mapped twice for one set, or a wide-file designation is
 * not a set of the vessel.
 */
export function planMapping(headers: string[], mapping: ColumnMapping, designations: string[]): MappingPlan {
  const issues: Issue[] = [];
  const index = new Map(headers.map((h, i) => [h, i]));
  for (const h of Object.keys(mapping.columns)) {
    if (!index.has(h)) issues.push({ path: h, message: `The mapping names column "${h}", which is not in the file` });
  }
  const plans: ColumnPlan[] = [];
  headers.forEach((header, i) => {
    const entry = mapping.columns[header];
    if (!entry || entry.field === 'ignore') return;
    const allowed = (FIELD_UNITS as Record<string, readonly Unit[]>)[entry.field];
    plans.push({ index: i, header, field: entry.field, unit: allowed ? (entry.unit ?? allowed[0]) : undefined, genset: entry.genset });
  });
  const dates = plans.filter((p) => p.field === 'date');
  const gensetCols = plans.filter((p) => p.field === 'genset');
  if (dates.length !== 1) {
    issues.push({ path: 'date', message: dates.length ? 'Map exactly one column to the date' : `No column is mapped to the date (columns: ${headers.join(', ')})` });
  }
  if (gensetCols.length > 1) issues.push({ path: 'genset', message: 'Map at most one column to the genset' });
  const groups = new Map<string, ColumnPlan[]>();
  const known = new Set(designations.map((d) => d.toLowerCase()));
  for (const p of plans) {
    if (!SET_FIELD_TO_RAW[p.field]) continue;
    const key = p.genset ?? '';
    if (key === '' && gensetCols.length === 0) {
      issues.push({ path: p.header, message: `Column "${p.header}" is a set's value, but no column is the genset and the column names no set` });
    }
    if (key !== '' && !known.has(key.toLowerCase())) issues.push({ path: p.header, message: `Column "${p.header}" names set ${key}, which this vessel does not have` });
    const list = groups.get(key) ?? [];
    const twice = list.find((q) => q.field === p.field);
    if (twice) issues.push({ path: p.header, message: `${FIELD_LABELS[p.field]} is mapped twice${key ? ` for ${key}` : ''} ("${twice.header}" and "${p.header}")` });
    list.push(p);
    groups.set(key, list);
  }
  const modeColumns = plans.filter((p) => (MODE_FIELDS as readonly string[]).includes(p.field));
  const modeFields = modeColumns.map((p) => p.field);
  if (new Set(modeFields).size !== modeFields.length) issues.push({ path: 'mode', message: 'An operating mode is mapped twice' });
  if (groups.size === 0 && modeColumns.length === 0) issues.push({ path: 'mapping', message: 'No column is mapped to a log value (hours, energy, fuel or mode hours)' });
  if (issues.length) throw new AppError('validation_failed', issues[0].message, issues);
  const mappedRawFields = [...new Set(plans.map((p) => SET_FIELD_TO_RAW[p.field]).filter((f): f is keyof RawLogValues => f !== undefined))];
  return { dateColumn: dates[0], gensetColumn: gensetCols[0] ?? null, groups, modeColumns, mappedRawFields };
}

/** One set's day read from the file (only the mapped fields are present in values). */
export interface FileSetDay {
  row: number;
  designation: string | null;
  logDate: string | null;
  values: Partial<RawLogValues>;
  /** The lot reference as written, resolved to values.fuelLotId by the caller's lookup. */
  errors: Issue[];
}

export interface FileModeDay {
  row: number;
  logDate: string;
  values: Partial<Record<ModeField, number>>;
  errors: Issue[];
}

export interface InterpretContext {
  dateFormat: DateFormat;
  decimal: DecimalSeparator;
  /** Lot id by reference (case-insensitive key: lower case). */
  lotIdByReference: Map<string, string>;
  /** Earliest and latest acceptable log dates (YYYY-MM-DD). */
  minDate: string;
  maxDate: string;
}

const NON_NEGATIVE: (keyof RawLogValues)[] = ['runningHoursMeter', 'kwhMeter', 'kwh', 'fuelMassKg', 'fuelVolumeL'];

/** A mapped column ready for the row loop: its raw field, unit factor and label looked up once per file. */
interface ColumnReader {
  plan: ColumnPlan;
  raw: keyof RawLogValues | undefined;
  factor: number;
  nonNegative: boolean;
  label: string;
}

function readerOf(p: ColumnPlan): ColumnReader {
  const raw = SET_FIELD_TO_RAW[p.field];
  return { plan: p, raw, factor: UNIT_TO_STORED[p.unit ?? 'h'], nonNegative: raw !== undefined && NON_NEGATIVE.includes(raw), label: FIELD_LABELS[p.field] };
}

/** A number cell in stored units, or null (blank); a bad cell adds an issue naming the column and gives null. */
function numberOf(text: string, c: ColumnReader, row: number, decimal: DecimalSeparator, issues: Issue[]): number | null {
  const n = parseNumberCell(text, decimal);
  if (!n.ok) {
    issues.push({ row, path: c.plan.header, message: `${c.label}: ${n.message}` });
    return null;
  }
  return n.value === null ? null : n.value * c.factor;
}

type DateOutcome = { logDate: string; message: null } | { logDate: null; message: string };

/** A date cell checked against the format and the accepted range. */
function dateOutcome(raw: string, ctx: InterpretContext): DateOutcome {
  if (raw.trim() === '') return { logDate: null, message: 'The date is missing' };
  const d = parseDateCell(raw, ctx.dateFormat);
  if (!d.ok) return { logDate: null, message: d.message };
  if (d.value < ctx.minDate || d.value > ctx.maxDate) return { logDate: null, message: `${d.value} is outside the accepted range ${ctx.minDate} to ${ctx.maxDate}` };
  return { logDate: d.value, message: null };
}

/**
 * Turns records into set-days and mode days. Cell problems (text in a number, a bad date, an unknown lot, a
 * negative reading) become issues of the row naming the column; they never throw.
 *
 * Cost O(rows x mapped columns); each distinct date text and lot reference is read once per file.
 */
export function interpretRecords(records: CsvRecord[], plan: MappingPlan, ctx: InterpretContext): { setDays: FileSetDay[]; modeDays: FileModeDay[] } {
  const setDays: FileSetDay[] = [];
  const modeDays: FileModeDay[] = [];
  const dateIndex = plan.dateColumn.index;
  const dateHeader = plan.dateColumn.header;
  const gensetIndex = plan.gensetColumn ? plan.gensetColumn.index : -1;
  const modeReaders = plan.modeColumns.map(readerOf);
  const groups = [...plan.groups].map(([key, cols]) => ({ key, readers: cols.map(readerOf) }));
  // Long files repeat each date once per set: read each distinct text once.
  const dates = new Map<string, DateOutcome>();
  const lotIds = new Map<string, string | undefined>();
  const { decimal } = ctx;
  for (const rec of records) {
    const { row, cells } = rec;
    const rowIssues: Issue[] = [];
    const dateRaw = cells[dateIndex] ?? '';
    let date = dates.get(dateRaw);
    if (!date) dates.set(dateRaw, (date = dateOutcome(dateRaw, ctx)));
    const logDate = date.logDate;
    if (date.message !== null) rowIssues.push({ row, path: dateHeader, message: date.message });
    // Mode hours.
    if (modeReaders.length) {
      const issues: Issue[] = [];
      const values: Partial<Record<ModeField, number>> = {};
      let any = false;
      for (const c of modeReaders) {
        const v = numberOf(cells[c.plan.index] ?? '', c, row, decimal, issues);
        if (v === null) continue;
        any = true;
        if (v < 0 || v > 25) issues.push({ row, path: c.plan.header, message: `${c.label} must be between 0 and 25 h (got ${v})` });
        values[c.plan.field as ModeField] = v;
      }
      const total = Object.values(values).reduce((s, v) => s + v, 0);
      if (total > 25) issues.push({ row, path: plan.modeColumns[0].header, message: `Mode hours add up to ${total} h, more than a day (25 h at most on a clock-change day)` });
      if (any && logDate) modeDays.push({ row, logDate, values, errors: [...rowIssues, ...issues] });
    }
    // Set days.
    for (const { key, readers } of groups) {
      const issues: Issue[] = rowIssues.length ? [...rowIssues] : [];
      let designation: string | null = key || null;
      if (!key && plan.gensetColumn) {
        designation = (cells[gensetIndex] ?? '').trim() || null;
        if (!designation) issues.push({ row, path: plan.gensetColumn.header, message: 'The genset is missing' });
      }
      const values: Partial<RawLogValues> = {};
      let anyValue = false;
      for (const c of readers) {
        const raw = c.raw as keyof RawLogValues;
        const cell = cells[c.plan.index] ?? '';
        if (raw === 'remarks') {
          const text = cell.trim();
          values.remarks = text === '' ? null : text.slice(0, 500);
          continue;
        }
        if (raw === 'fuelLotId') {
          const text = cell.trim();
          if (text === '') values.fuelLotId = null;
          else {
            anyValue = true;
            let id = lotIds.get(text);
            if (id === undefined && !lotIds.has(text)) lotIds.set(text, (id = ctx.lotIdByReference.get(text.toLowerCase())));
            if (!id) issues.push({ row, path: c.plan.header, message: `Fuel lot "${text}" is not in this vessel's fuel lot register` });
            values.fuelLotId = id ?? null;
          }
          continue;
        }
        const v = numberOf(cell, c, row, decimal, issues);
        if (v !== null) {
          anyValue = true;
          if (c.nonNegative && v < 0) issues.push({ row, path: c.plan.header, message: `${c.label} cannot be negative (got ${v})` });
        }
        (values as Record<string, number | null>)[raw] = v;
      }
      // A wide file's set with every cell blank was not logged that day.
      if (key && !anyValue) continue;
      setDays.push({ row, designation, logDate, values, errors: issues });
    }
    if (plan.groups.size === 0 && rowIssues.length && plan.modeColumns.length) {
      modeDays.push({ row, logDate: logDate ?? '', values: {}, errors: rowIssues });
    }
  }
  return { setDays, modeDays };
}
