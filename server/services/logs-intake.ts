/**
 * CSV log intake: parse and check an upload (stateless: preview and commit each parse the file), classify each row
 * against stored rows (new / changed / unchanged / error), preview with derived values, and commit in one
 * transaction with bulk upserts and the before values undo needs.
 */
import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { and, eq, sql } from 'drizzle-orm';
import { dayNumber, dateOfDayNumber } from '../../optimizer/index';
import {
  MODE_FIELDS,
  type ColumnMapping,
  type CommitOptions,
  type DateFormat,
  type Issue,
  type ModeField,
  type Preview,
  type PreviewRow,
  type RawLogValues,
  type RowStatus,
} from '../../shared/schemas/logs';
import { INTAKE_LIMITS } from '../../shared/schemas/logs';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { columnMappings, logImports, vesselModeHours, vessels } from '../db/schema';
import { AppError } from '../errors';
import { decodeCsv, detectDelimiter, parseCsv, type CsvRecord, type Delimiter } from '../lib/csv';
import { guessMapping, interpretRecords, planMapping, type FileModeDay, type FileSetDay, type MappingPlan } from '../lib/csv-mapping';
import { detectDateFormat, detectDecimalSeparator, type DecimalSeparator } from '../lib/csv-values';
import { vesselForActor } from './access';
import { recordAudit } from './audit';
import { loadStoredLogs, loadVesselLogContext, rawOf, sameValue, type StoredLog, type VesselLogContext } from './logs-data';
import { deriveSetDays, rawValueIssues, resolveLot, type SetDayInput } from './logs-derive';

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
  size: number;
}

/** Earliest log date accepted (older logs are almost surely a typing error in the year). */
export const MIN_LOG_DATE = '2000-01-01';

interface ParsedUpload {
  fileName: string;
  fileSha256: string;
  delimiter: Delimiter;
  decimal: DecimalSeparator;
  dateFormat: DateFormat;
  headers: string[];
  mapping: ColumnMapping;
  mappingSource: 'given' | 'saved' | 'guessed';
  plan: MappingPlan;
  setDays: (FileSetDay & { gensetId: string | null })[];
  modeDays: FileModeDay[];
  context: VesselLogContext;
}

function checkFileName(name: string): void {
  if (!/\.(csv|tsv|txt)$/i.test(name)) {
    throw new AppError('unsupported_media_type', `"${name}" is not a CSV file (.csv); save the sheet as CSV and upload that`, [{ path: 'file', message: 'Not a .csv file' }]);
  }
}

async function savedMapping(db: DbOrTx, vesselId: string, headers: string[]): Promise<ColumnMapping | null> {
  const saved = await db.select().from(columnMappings).where(eq(columnMappings.vesselId, vesselId));
  const set = new Set(headers);
  // The most recently saved mapping made for these very columns (same header set).
  const fit = saved
    .sort((a, b) => b.updatedAt.getTime() - a.updatedAt.getTime())
    .find((m) => {
      const keys = Object.keys((m.mapping as ColumnMapping).columns ?? {});
      return keys.length === set.size && keys.every((h) => set.has(h));
    });
  return fit ? (fit.mapping as ColumnMapping) : null;
}

/**
 * Parses and interprets an upload: file checks (extension, binary content, UTF-8, empty, header only), delimiter,
 * mapping (given, saved for the vessel, or guessed), decimal separator and date format (an ambiguous date column
 * is a 422 asking for a choice), then every record into set-days and mode days with row issues.
 */
export async function parseUpload(deps: AppDeps, actor: Actor, vesselId: string, file: UploadedFile | undefined, given: ColumnMapping | undefined): Promise<ParsedUpload> {
  await vesselForActor(deps.db, actor, vesselId);
  if (!file) throw new AppError('bad_request', 'Choose a CSV file to upload', [{ path: 'file', message: 'No file' }]);
  checkFileName(file.originalname);
  if (file.size > INTAKE_LIMITS.csvMaxBytes) throw new AppError('payload_too_large', 'The file is larger than the upload limit');
  const text = decodeCsv(file.buffer);
  const fileSha256 = createHash('sha256').update(file.buffer).digest('hex');
  const delimiter = detectDelimiter(text);
  const records: CsvRecord[] = [];
  const { headers } = parseCsv(text, delimiter, (batch) => {
    for (const r of batch) records.push(r);
  });
  if (new Set(headers).size !== headers.length) {
    const dup = headers.find((h, i) => headers.indexOf(h) !== i);
    throw new AppError('validation_failed', `Column "${dup}" appears twice in the header`, [{ path: String(dup), row: 1, message: 'Duplicate column name' }]);
  }
  if (records.length === 0) throw new AppError('validation_failed', 'The file has a header but no data rows', [{ path: 'file', row: 2, message: 'No data rows' }]);
  const context = await loadVesselLogContext(deps.db, vesselId);
  const designations = context.sets.map((s) => s.designation);
  let mapping: ColumnMapping;
  let mappingSource: ParsedUpload['mappingSource'];
  if (given) {
    mapping = given;
    mappingSource = 'given';
  } else {
    const saved = await savedMapping(deps.db, vesselId, headers);
    mapping = saved ?? { columns: guessMapping(headers, designations) };
    mappingSource = saved ? 'saved' : 'guessed';
  }
  const plan = planMapping(headers, mapping, designations);
  const numberCols = [...plan.groups.values()].flat().filter((p) => p.field !== 'remarks' && p.field !== 'fuelLot').concat(plan.modeColumns);
  const sample = records.slice(0, 5000);
  const decimal = mapping.decimalSeparator ?? detectDecimalSeparator((function* () {
    for (const r of sample) for (const p of numberCols) yield r.cells[p.index] ?? '';
  })());
  let dateFormat = mapping.dateFormat;
  if (!dateFormat) {
    const detection = detectDateFormat(records.map((r) => r.cells[plan.dateColumn.index] ?? ''));
    if (detection.kind === 'ambiguous') {
      throw new AppError('validation_failed', `The dates are ambiguous (e.g. "${detection.example}"): choose the date format (${detection.candidates.join(' or ')})`, [
        { path: 'dateFormat', message: `Ambiguous dates in column "${plan.dateColumn.header}": choose ${detection.candidates.join(' or ')}` },
      ]);
    }
    if (detection.kind === 'unknown') {
      throw new AppError('validation_failed', `Column "${plan.dateColumn.header}" holds no dates as yyyy-mm-dd, dd/mm/yyyy or dd.mm.yyyy (e.g. "${detection.example}")`, [
        { path: plan.dateColumn.header, row: 2, message: 'Not a date column' },
      ]);
    }
    dateFormat = detection.format;
  }
  const lotIdByReference = new Map([...context.lotsById.values()].map((l) => [l.reference.toLowerCase(), l.id]));
  const maxDate = dateOfDayNumber(dayNumber(deps.now().toISOString().slice(0, 10)) + 1);
  const { setDays, modeDays } = interpretRecords(records, plan, { dateFormat, decimal, lotIdByReference, minDate: MIN_LOG_DATE, maxDate });
  const byDesignation = new Map(context.sets.map((s) => [s.designation.toLowerCase(), s.id]));
  const resolved = setDays as ParsedUpload['setDays'];
  // Duplicate dates in the file: every copy is refused.
  const keys: (string | null)[] = new Array(resolved.length);
  const seen = new Map<string, number[]>();
  for (let i = 0; i < resolved.length; i++) {
    const d = resolved[i];
    const gensetId = d.designation ? (byDesignation.get(d.designation.toLowerCase()) ?? null) : null;
    d.gensetId = gensetId;
    if (d.designation && !gensetId) {
      d.errors.push({ row: d.row, path: plan.gensetColumn?.header ?? 'genset', message: `Set "${d.designation}" is not in this vessel's genset register (${designations.join(', ') || 'none registered'})` });
    }
    const key = gensetId && d.logDate ? `${gensetId}|${d.logDate}` : null;
    keys[i] = key;
    if (key === null) continue;
    const rows = seen.get(key);
    if (rows) rows.push(d.row);
    else seen.set(key, [d.row]);
  }
  for (let i = 0; i < resolved.length; i++) {
    const key = keys[i];
    const rows = key === null ? undefined : seen.get(key);
    if (rows && rows.length > 1) {
      const d = resolved[i];
      d.errors.push({ row: d.row, path: plan.dateColumn.header, message: `${d.designation} ${d.logDate} appears ${rows.length} times in the file (rows ${rows.join(', ')}); keep one (DUPLICATE_DATE)` });
    }
  }
  const modeByDate = new Map<string, FileModeDay>();
  for (const m of modeDays) {
    const other = modeByDate.get(m.logDate);
    if (!other) {
      modeByDate.set(m.logDate, m);
      continue;
    }
    const differs = MODE_FIELDS.some((f) => !sameValue(other.values[f], m.values[f]));
    if (differs) m.errors.push({ row: m.row, path: plan.modeColumns[0]?.header ?? 'mode', message: `Mode hours of ${m.logDate} differ from row ${other.row}` });
  }
  return {
    fileName: file.originalname.slice(0, 200),
    fileSha256,
    delimiter,
    decimal,
    dateFormat,
    headers,
    mapping: { ...mapping, dateFormat, decimalSeparator: decimal },
    mappingSource,
    plan,
    setDays: resolved,
    modeDays,
    context,
  };
}

interface ClassifiedRow {
  file: ParsedUpload['setDays'][number];
  status: RowStatus;
  values: RawLogValues | null;
  before: StoredLog | null;
  errors: Issue[];
}

interface ClassifiedModeDay {
  file: FileModeDay;
  status: RowStatus;
  values: Record<ModeField, number>;
  before: Record<ModeField, number> | null;
}

const EMPTY_RAW: RawLogValues = {
  runningHoursMeter: null,
  hoursRun: null,
  kwhMeter: null,
  kwh: null,
  fuelMassKg: null,
  fuelVolumeL: null,
  fuelTempC: null,
  fuelLotId: null,
  remarks: null,
};

/** Classifies file rows against stored ones: a file row overlays only its mapped fields on a stored row. */
async function classify(db: DbOrTx, vesselId: string, parsed: ParsedUpload): Promise<{ rows: ClassifiedRow[]; modes: ClassifiedModeDay[]; stored: StoredLog[] }> {
  const dated = parsed.setDays.filter((d) => d.logDate && d.gensetId);
  const dates = dated.map((d) => d.logDate as string).sort();
  const ids = [...new Set(dated.map((d) => d.gensetId as string))];
  const stored = dates.length ? await loadStoredLogs(db, ids, dateOfDayNumber(dayNumber(dates[0]) - 1), dates[dates.length - 1]) : [];
  const storedByKey = new Map(stored.map((s) => [`${s.gensetId}|${s.logDate}`, s]));
  const mapped = parsed.plan.mappedRawFields;
  const rows: ClassifiedRow[] = parsed.setDays.map((file) => {
    const before = file.gensetId && file.logDate ? (storedByKey.get(`${file.gensetId}|${file.logDate}`) ?? null) : null;
    const base = before ? rawOf(before) : EMPTY_RAW;
    const values: RawLogValues = { ...base };
    for (const f of mapped) (values as Record<string, unknown>)[f] = (file.values as Record<string, unknown>)[f] ?? null;
    const errors = [...file.errors];
    if (!errors.length && file.logDate) {
      const { lot } = resolveLot(values, file.logDate, parsed.context.lotsById, parsed.context.lotsByDate);
      for (const i of rawValueIssues(values, lot)) errors.push({ row: file.row, path: i.path, message: i.message });
    }
    let status: RowStatus;
    if (errors.length) status = 'error';
    else if (!before) status = 'new';
    else status = mapped.every((f) => sameValue(values[f], base[f])) ? 'unchanged' : 'changed';
    return { file, status, values: errors.length ? null : values, before, errors };
  });
  const modeDates = parsed.modeDays.filter((m) => m.logDate).map((m) => m.logDate);
  const storedModes = modeDates.length
    ? await db
        .select()
        .from(vesselModeHours)
        .where(and(eq(vesselModeHours.vesselId, vesselId), sql`${vesselModeHours.logDate} = any(${`{${[...new Set(modeDates)].join(',')}}`}::date[])`))
    : [];
  const modeByDate = new Map(storedModes.map((m) => [m.logDate, m]));
  const seenModeDate = new Set<string>();
  const modes: ClassifiedModeDay[] = parsed.modeDays.map((file) => {
    const stored = modeByDate.get(file.logDate);
    const before = stored ? { seaH: stored.seaH, manoeuvringH: stored.manoeuvringH, portH: stored.portH, anchorageH: stored.anchorageH, shorePowerH: stored.shorePowerH } : null;
    const values = { ...(before ?? { seaH: 0, manoeuvringH: 0, portH: 0, anchorageH: 0, shorePowerH: 0 }) };
    for (const p of parsed.plan.modeColumns) values[p.field as ModeField] = file.values[p.field as ModeField] ?? 0;
    const repeat = seenModeDate.has(file.logDate);
    seenModeDate.add(file.logDate);
    const status: RowStatus = file.errors.length ? 'error' : repeat ? 'unchanged' : !before ? 'new' : MODE_FIELDS.every((f) => sameValue(values[f], before[f])) ? 'unchanged' : 'changed';
    return { file, status, values, before };
  });
  return { rows, modes, stored };
}

function countsOf(rows: { status: RowStatus }[]) {
  const c = { total: rows.length, new: 0, changed: 0, unchanged: 0, rejected: 0 };
  for (const r of rows) {
    if (r.status === 'error') c.rejected++;
    else c[r.status]++;
  }
  return c;
}

/**
 * Preview of an upload: every row with its values, the stored values it would change, derived figures (the file's
 * rows laid over the stored ones, derived per set with the day before's readings), errors and flags. Stores nothing.
 */
export async function previewUpload(deps: AppDeps, actor: Actor, vesselId: string, file: UploadedFile | undefined, mapping: ColumnMapping | undefined): Promise<Preview> {
  const parsed = await parseUpload(deps, actor, vesselId, file, mapping);
  const { rows, modes, stored } = await classify(deps.db, vesselId, parsed);
  const { context } = parsed;
  const derivedBy = new Map<string, ReturnType<typeof deriveSetDays>['byDate']>();
  for (const set of context.sets) {
    const days = new Map<string, SetDayInput>();
    for (const s of stored) if (s.gensetId === set.id) days.set(s.logDate, { logDate: s.logDate, values: rawOf(s) });
    let any = false;
    for (const r of rows) {
      if (r.file.gensetId === set.id && r.values && r.file.logDate) {
        days.set(r.file.logDate, { logDate: r.file.logDate, values: r.values });
        any = true;
      }
    }
    if (any) derivedBy.set(set.id, deriveSetDays(set, [...days.values()], context.lotsById, context.lotsByDate, context.replacements.get(set.id) ?? new Map(), { dayLengthsH: context.dayLengthsH }).byDate);
  }
  const previewRows: PreviewRow[] = rows.map((r) => {
    const d = r.file.gensetId && r.file.logDate && r.values ? derivedBy.get(r.file.gensetId)?.get(r.file.logDate) : undefined;
    return {
      row: r.file.row,
      gensetId: r.file.gensetId,
      designation: r.file.gensetId ? (context.setsById.get(r.file.gensetId)?.designation ?? r.file.designation) : r.file.designation,
      logDate: r.file.logDate,
      status: r.status,
      values: r.values,
      before: r.before ? rawOf(r.before) : null,
      derived: d?.derived ?? null,
      errors: r.errors,
      flags: d?.flags ?? [],
    };
  });
  return {
    fileName: parsed.fileName,
    fileSha256: parsed.fileSha256,
    delimiter: parsed.delimiter,
    decimalSeparator: parsed.decimal,
    dateFormat: parsed.dateFormat,
    headers: parsed.headers,
    mapping: parsed.mapping,
    mappingSource: parsed.mappingSource,
    rows: previewRows,
    modeDays: modes.map((m) => ({ row: m.file.row, logDate: m.file.logDate, status: m.status, values: m.values })),
    counts: countsOf(rows),
  };
}

const BATCH = 10_000;

/** A number or null in COPY text format (\N for null). */
function copyNumber(v: number | null): string {
  return v === null ? '\\N' : String(v);
}

const COPY_SPECIAL = /[\\\t\n\r]/g;
const COPY_ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r' };

/** A text or null in COPY text format: \N for null; backslash, tab, newline and carriage return escaped. */
function copyText(v: string | null): string {
  if (v === null) return '\\N';
  COPY_SPECIAL.lastIndex = 0;
  return COPY_SPECIAL.test(v) ? v.replace(COPY_SPECIAL, (c) => COPY_ESCAPES[c]) : v;
}

/** The before value of an overwritten row, as undo restores it. */
export interface RowBefore extends RawLogValues {
  source: string;
  importId: string | null;
}

interface RowToWrite {
  gensetId: string;
  logDate: string;
  values: RawLogValues;
  /** The stored row it overwrites (kept in log_import_changes for undo); null for a new row. */
  before: RowBefore | null;
}

/** COPY text lines of the rows, in chunks of BATCH lines (uuids and dates need no escaping). */
function* copyLines(rows: RowToWrite[]): Generator<string> {
  const lines: string[] = [];
  for (let i = 0; i < rows.length; i += BATCH) {
    lines.length = 0;
    for (let k = i; k < Math.min(rows.length, i + BATCH); k++) {
      const { gensetId, logDate, values: v, before } = rows[k];
      lines.push(
        `${gensetId}\t${logDate}\t${copyNumber(v.runningHoursMeter)}\t${copyNumber(v.hoursRun)}\t${copyNumber(v.kwhMeter)}\t${copyNumber(v.kwh)}\t` +
          `${copyNumber(v.fuelMassKg)}\t${copyNumber(v.fuelVolumeL)}\t${copyNumber(v.fuelTempC)}\t${v.fuelLotId ?? '\\N'}\t${copyText(v.remarks)}\t` +
          `${before ? copyText(JSON.stringify(before)) : '\\N'}\n`,
      );
    }
    yield lines.join('');
  }
}

/** The pg client a drizzle node-postgres transaction runs on (COPY needs the client itself). */
function clientOf(tx: DbOrTx): pg.PoolClient {
  const client = (tx as unknown as { session?: { client?: pg.PoolClient } }).session?.client;
  if (!client || typeof client.query !== 'function' || typeof (client as { release?: unknown }).release !== 'function') {
    throw new Error('writeLogs requires a transaction on a pooled node-postgres client');
  }
  return client;
}

/**
 * Writes the rows of an import in its transaction: COPY into a temporary table (dropped at commit), then one
 * INSERT ... SELECT ... ON CONFLICT into genset_daily_logs and one INSERT of the before values of overwritten rows
 * into log_import_changes (rows the import created carry its import_id instead).
 */
async function writeLogs(tx: DbOrTx, importId: string, rows: RowToWrite[]): Promise<void> {
  if (!rows.length) return;
  const client = clientOf(tx);
  await client.query(`create temp table intake_rows (
    genset_id uuid, log_date date, running_hours_meter float8, hours_run float8, kwh_meter float8, kwh float8,
    fuel_mass_kg float8, fuel_volume_l float8, fuel_temp_c float8, fuel_lot_id uuid, remarks text, before jsonb) on commit drop`);
  await pipeline(Readable.from(copyLines(rows)), client.query(copyFrom('copy intake_rows from stdin')));
  await client.query(
    `insert into genset_daily_logs (genset_id, log_date, running_hours_meter, hours_run, kwh_meter, kwh, fuel_mass_kg, fuel_volume_l, fuel_temp_c, fuel_lot_id, remarks, source, import_id, updated_at)
    select genset_id, log_date, running_hours_meter, hours_run, kwh_meter, kwh, fuel_mass_kg, fuel_volume_l, fuel_temp_c, fuel_lot_id, remarks, 'import', $1::uuid, now()
    from intake_rows
    on conflict (genset_id, log_date) do update set
      running_hours_meter = excluded.running_hours_meter, hours_run = excluded.hours_run, kwh_meter = excluded.kwh_meter,
      kwh = excluded.kwh, fuel_mass_kg = excluded.fuel_mass_kg, fuel_volume_l = excluded.fuel_volume_l,
      fuel_temp_c = excluded.fuel_temp_c, fuel_lot_id = excluded.fuel_lot_id, remarks = excluded.remarks,
      source = 'import', import_id = excluded.import_id, updated_at = now()`,
    [importId],
  );
  await client.query(
    `insert into log_import_changes (import_id, genset_id, log_date, before)
    select $1::uuid, genset_id, log_date, before from intake_rows where before is not null`,
    [importId],
  );
  await client.query('drop table intake_rows');
}

/** Upserts vessel mode-hour days in one statement per batch. */
export async function upsertModeHours(tx: DbOrTx, vesselId: string, days: ({ logDate: string } & Record<ModeField, number>)[]): Promise<void> {
  for (let i = 0; i < days.length; i += BATCH) {
    const json = JSON.stringify(days.slice(i, i + BATCH));
    await tx.execute(sql`
      insert into vessel_mode_hours (vessel_id, log_date, sea_h, manoeuvring_h, port_h, anchorage_h, shore_power_h)
      select ${vesselId}::uuid, x."logDate", x."seaH", x."manoeuvringH", x."portH", x."anchorageH", x."shorePowerH"
      from json_to_recordset(${json}::json) as x("logDate" date, "seaH" float8, "manoeuvringH" float8, "portH" float8, "anchorageH" float8, "shorePowerH" float8)
      on conflict (vessel_id, log_date) do update set sea_h = excluded.sea_h, manoeuvring_h = excluded.manoeuvring_h,
        port_h = excluded.port_h, anchorage_h = excluded.anchorage_h, shore_power_h = excluded.shore_power_h`);
  }
}

export interface CommitResult {
  importId: string;
  rowsNew: number;
  rowsChanged: number;
  rowsUnchanged: number;
  rowsRejected: number;
  /** Changed rows left as stored because overwriteChanged was false. */
  rowsChangedSkipped: number;
  modeDaysWritten: number;
}

/**
 * Commits an upload: parses it again, refuses a file whose SHA-256 differs from the previewed one, and in ONE
 * transaction (the vessel row locked against a concurrent import) writes the new rows, the changed ones when
 * overwriteChanged, the mode hours, log_imports and log_import_changes, the saved mapping and the audit entry.
 * Rows with errors are never written. Nothing to write is a 422 listing the errors.
 */
export async function commitUpload(deps: AppDeps, actor: Actor, vesselId: string, file: UploadedFile | undefined, options: CommitOptions): Promise<CommitResult> {
  const parsed = await parseUpload(deps, actor, vesselId, file, options.mapping);
  if (parsed.fileSha256 !== options.fileSha256) {
    throw new AppError('conflict', 'This file differs from the one previewed; preview it again before importing', [{ path: 'fileSha256', message: 'File hash mismatch' }]);
  }
  const committed = await deps.db.transaction(async (tx) => {
    await tx.select({ id: vessels.id }).from(vessels).where(eq(vessels.id, vesselId)).for('update');
    const { rows, modes } = await classify(tx, vesselId, parsed);
    const write = rows.filter((r) => r.status === 'new' || (r.status === 'changed' && options.overwriteChanged));
    const writeModes = modes.filter((m) => m.status === 'new' || (m.status === 'changed' && options.overwriteChanged));
    const counts = countsOf(rows);
    if (write.length === 0 && writeModes.length === 0) {
      const errors = rows.flatMap((r) => r.errors).concat(modes.flatMap((m) => m.file.errors));
      if (errors.length) throw new AppError('validation_failed', `Nothing to import: ${counts.rejected} of ${counts.total} rows have errors (first: row ${errors[0].row}, ${errors[0].path}: ${errors[0].message})`, errors.slice(0, 200));
      throw new AppError('validation_failed', 'Nothing to import: every row is already stored as it is in the file' + (counts.changed ? ' or is a changed row you chose not to overwrite' : ''), []);
    }
    const [imp] = await tx
      .insert(logImports)
      .values({
        vesselId,
        userId: actor.userId,
        fileName: parsed.fileName,
        fileSha256: parsed.fileSha256,
        rowsNew: counts.new,
        rowsChanged: options.overwriteChanged ? counts.changed : 0,
        rowsUnchanged: counts.unchanged,
        rowsRejected: counts.rejected,
      })
      .returning();
    await writeLogs(
      tx,
      imp.id,
      write.map((r) => {
        const b = r.before;
        return {
          gensetId: r.file.gensetId as string,
          logDate: r.file.logDate as string,
          values: r.values as RawLogValues,
          before: b ? { ...rawOf(b), source: b.source, importId: b.importId } : null,
        };
      }),
    );
    if (writeModes.length) {
      await upsertModeHours(tx, vesselId, writeModes.map((m) => ({ logDate: m.file.logDate, ...m.values })));
      await recordAudit(
        tx,
        actor,
        'vessel_mode_hours_import',
        imp.id,
        'import',
        writeModes.map((m) => ({ logDate: m.file.logDate, before: m.before })),
        writeModes.map((m) => ({ logDate: m.file.logDate, ...m.values })),
      );
    }
    const name = options.saveMappingAs ?? 'default';
    await tx
      .insert(columnMappings)
      .values({ vesselId, name, mapping: parsed.mapping })
      .onConflictDoUpdate({ target: [columnMappings.vesselId, columnMappings.name], set: { mapping: parsed.mapping, updatedAt: deps.now() } });
    const result: CommitResult = {
      importId: imp.id,
      rowsNew: counts.new,
      rowsChanged: options.overwriteChanged ? counts.changed : 0,
      rowsUnchanged: counts.unchanged,
      rowsRejected: counts.rejected,
      rowsChangedSkipped: options.overwriteChanged ? 0 : counts.changed,
      modeDaysWritten: writeModes.length,
    };
    await recordAudit(tx, actor, 'log_import', imp.id, 'create', null, { fileName: parsed.fileName, fileSha256: parsed.fileSha256, ...result });
    return result;
  });
  // The curves behind this vessel's recommendations are refitted in the background (job queue), not on this request.
  await deps.jobs?.enqueueRefit({ companyId: actor.companyId, vesselId });
  return committed;
}

/** Saved mappings of a vessel, newest first. */
export async function listMappings(deps: AppDeps, actor: Actor, vesselId: string) {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db.select().from(columnMappings).where(eq(columnMappings.vesselId, vesselId));
  return rows
    .sort((a, b) => b.updatedAt.getTime() - a.updatedAt.getTime())
    .map((m) => ({ id: m.id, name: m.name, mapping: m.mapping as ColumnMapping, updatedAt: m.updatedAt.toISOString() }));
}

