/**
 * Derivation of stored or uploaded genset-days from raw values, on read: validation of raw values against the fuel
 * lot (so the optimizer never sees input it would throw on), lot resolution, and series derivation with the
 * previous day's readings and recorded meter replacements (optimizer/logs).
 */
import {
  CF_TABLE,
  TABLE_54B_BANDS,
  TABLE_54B_MIN_TEMP_C,
  cfFuelTypeForGrade,
  checkLogSeries,
  dayNumber,
  dateOfDayNumber,
  deriveGensetSeries,
  estimateLcvMjPerKg,
  table54BMaxTempC,
  type DailyRowContext,
  type FuelGrade,
  type FuelLot,
  type MeterReplacement,
  type RawDailyLog,
} from '../../optimizer/index';
import type { DerivedLog, Issue, LogFlag, RawLogValues } from '../../shared/schemas/logs';

/** A fuel lot as the derivation needs it. */
export interface LotInfo {
  id: string;
  reference: string;
  grade: string;
  density15KgPerM3: number;
  lcvMjPerKg: number;
  lcvEstimated: boolean;
  sulphurPct: number | null;
  deliveredOn: string;
}

export interface SetInfo {
  id: string;
  designation: string;
  ratedKw: number;
  minLoadPct: number;
}

export interface SetDayInput {
  logDate: string;
  values: RawLogValues;
}

export interface SetDayDerived {
  derived: DerivedLog;
  flags: LogFlag[];
}

const EMPTY_DERIVED: DerivedLog = {
  hoursRun: null,
  kwh: null,
  avgLoadKw: null,
  avgLoadPct: null,
  fuelKgAt15: null,
  fuelKgIso: null,
  lcvKjPerKg: null,
  lcvBasis: null,
  sfocObservedGPerKwh: null,
  sfocIsoGPerKwh: null,
  co2Kg: null,
  fuelLotReference: null,
  usable: false,
};

/** Family of the ISO 8217 LCV formula for a grade: distillate or residual; null for gases and alcohols. */
export function lcvFamilyOf(grade: FuelGrade) {
  return CF_TABLE[cfFuelTypeForGrade(grade).fuelType].iso8217Family;
}

/**
 * The LCV of a new lot, MJ/kg: as given (measured), else the ISO 8217 annex estimate from density and sulphur, else
 * (gases, alcohols) the MEPC.364(79) default. Returns an issue instead of throwing when the density is outside the
 * annex formula's range.
 */
export function lotLcv(grade: FuelGrade, density15KgPerM3: number, sulphurPct: number | null, given: number | null):
  | { ok: true; lcvMjPerKg: number; estimated: boolean }
  | { ok: false; issue: Issue } {
  if (given !== null) return { ok: true, lcvMjPerKg: given, estimated: false };
  const family = lcvFamilyOf(grade);
  if (family === null) return { ok: true, lcvMjPerKg: CF_TABLE[cfFuelTypeForGrade(grade).fuelType].lcvKjPerKg / 1000, estimated: true };
  if (density15KgPerM3 < 700 || density15KgPerM3 > 1100) {
    return { ok: false, issue: { path: 'density15KgPerM3', message: 'The ISO 8217 LCV estimate needs a density of 700 to 1100 kg/m³; enter the LCV' } };
  }
  return { ok: true, lcvMjPerKg: estimateLcvMjPerKg({ density15KgPerM3, sulphurPct: sulphurPct ?? 0, family }), estimated: true };
}

const NON_NEGATIVE_FIELDS = ['runningHoursMeter', 'kwhMeter', 'kwh', 'fuelMassKg', 'fuelVolumeL'] as const;

/**
 * Problems of one day's raw values that the derivation cannot take (they would make the optimizer throw or mean
 * nothing): missing hours or energy, fuel as both mass and volume, a volume without temperature, negative amounts,
 * a temperature outside Table 54B for the lot's density. Each names the field.
 */
export function rawValueIssues(v: RawLogValues, lot: LotInfo | null): Issue[] {
  const issues: Issue[] = [];
  if (v.runningHoursMeter === null && v.hoursRun === null) issues.push({ path: 'hoursRun', message: 'A running-hour meter reading or the hours run is required' });
  if (v.kwhMeter === null && v.kwh === null) issues.push({ path: 'kwh', message: 'An energy meter reading or the kWh produced is required' });
  for (const f of NON_NEGATIVE_FIELDS) {
    const n = v[f];
    if (n !== null && (!Number.isFinite(n) || n < 0)) issues.push({ path: f, message: `${f} cannot be negative (got ${n})` });
  }
  if (v.hoursRun !== null && !Number.isFinite(v.hoursRun)) issues.push({ path: 'hoursRun', message: 'Hours run is not a number' });
  if (v.fuelMassKg !== null && v.fuelVolumeL !== null) issues.push({ path: 'fuelVolumeL', message: 'Fuel is given as both a mass and a volume; keep one' });
  // A zero volume (set stopped) needs no temperature: there is nothing to correct.
  if (v.fuelVolumeL !== null && v.fuelVolumeL > 0) {
    if (v.fuelTempC === null) issues.push({ path: 'fuelTempC', message: 'A fuel volume needs its temperature for the correction to 15 °C' });
    else if (lot) {
      const lo = TABLE_54B_BANDS[0].fromKgPerM3;
      const hi = TABLE_54B_BANDS[TABLE_54B_BANDS.length - 1].toKgPerM3;
      if (lot.density15KgPerM3 < lo || lot.density15KgPerM3 > hi) {
        issues.push({ path: 'fuelVolumeL', message: `Lot ${lot.reference} has a density of ${lot.density15KgPerM3} kg/m³, outside Table 54B (${lo} to ${hi}); log this fuel as a mass` });
      } else {
        const max = table54BMaxTempC(lot.density15KgPerM3);
        if (v.fuelTempC < TABLE_54B_MIN_TEMP_C || v.fuelTempC > max) {
          issues.push({ path: 'fuelTempC', message: `Fuel temperature ${v.fuelTempC} °C is outside Table 54B for ${lot.density15KgPerM3} kg/m³ (${TABLE_54B_MIN_TEMP_C} to ${max} °C)` });
        }
      }
    }
  }
  return issues;
}

/** The lot of a day: the named lot, else the latest delivered on or before the day (assumed, flagged). */
export function resolveLot(v: RawLogValues, logDate: string, lotsById: Map<string, LotInfo>, lotsByDate: LotInfo[]): { lot: LotInfo | null; assumed: boolean } {
  if (v.fuelLotId) return { lot: lotsById.get(v.fuelLotId) ?? null, assumed: false };
  let found: LotInfo | null = null;
  for (const l of lotsByDate) if (l.deliveredOn <= logDate) found = l;
  return { lot: found, assumed: found !== null };
}

const PLACEHOLDER_LOT: FuelLot = { grade: 'MGO', density15KgPerM3: 850, lcvKjPerKg: 42_700 };

function toOptimizerLot(lot: LotInfo): FuelLot {
  return {
    grade: lot.grade as FuelGrade,
    density15KgPerM3: lot.density15KgPerM3,
    lcvKjPerKg: lot.lcvMjPerKg * 1000,
    lcvIsEstimated: lot.lcvEstimated,
    sulphurPct: lot.sulphurPct ?? undefined,
  };
}

const flag = (code: LogFlag['code'], field: string, message: string): LogFlag => ({ code, field, severity: 'warning', message });

/**
 * Derives one set's days. Days are split into runs of the same lot; each run goes through deriveGensetSeries
 * (optimizer/logs) with the previous run's last readings when it ended the day before, so meter readings carry
 * across lot changes. A cumulative reading is used when the day before has one, else the hours run / kWh produced
 * when logged. Days whose raw values fail rawValueIssues get no figures. Returns figures by date and the set's
 * missing days.
 *
 * Cost O(n log n) for n days.
 */
export function deriveSetDays(
  set: SetInfo,
  days: SetDayInput[],
  lotsById: Map<string, LotInfo>,
  lotsByDate: LotInfo[],
  replacements: Map<string, MeterReplacement>,
  options: { from?: string; to?: string; dayLengthsH?: Map<string, number> } = {},
): { byDate: Map<string, SetDayDerived>; missingDays: string[] } {
  const sorted = [...days].sort((a, b) => (a.logDate < b.logDate ? -1 : a.logDate > b.logDate ? 1 : 0));
  const byDate = new Map<string, SetDayDerived>();
  const prepared: { day: SetDayInput; lot: LotInfo | null; raw: RawDailyLog; extra: LogFlag[]; fuelLogged: boolean }[] = [];
  const hasMeter = new Map(sorted.map((d) => [d.logDate, d.values]));
  for (const day of sorted) {
    const v = day.values;
    const { lot, assumed } = resolveLot(v, day.logDate, lotsById, lotsByDate);
    if (rawValueIssues(v, lot).length) {
      byDate.set(day.logDate, { derived: { ...EMPTY_DERIVED }, flags: [] });
      continue;
    }
    const yesterday = hasMeter.get(dateOfDayNumber(dayNumber(day.logDate) - 1));
    const useHoursMeter = v.runningHoursMeter !== null && (v.hoursRun === null || (yesterday?.runningHoursMeter ?? null) !== null);
    const useKwhMeter = v.kwhMeter !== null && (v.kwh === null || (yesterday?.kwhMeter ?? null) !== null);
    const hoursRep = replacements.get(`running_hours|${day.logDate}`);
    const kwhRep = replacements.get(`kwh|${day.logDate}`);
    const fuelLogged = v.fuelMassKg !== null || v.fuelVolumeL !== null;
    const extra: LogFlag[] = [];
    if (assumed && lot) extra.push(flag('FUEL_LOT_ASSUMED', 'fuelLotId', `No lot logged; lot ${lot.reference} (delivered ${lot.deliveredOn}) is assumed.`));
    if (!lot && fuelLogged) extra.push(flag('FUEL_LOT_MISSING', 'fuelLotId', 'No fuel lot is registered for this day; fuel mass, SFOC and CO2 need one.'));
    const dayLengthH = options.dayLengthsH?.get(day.logDate);
    const raw: RawDailyLog = {
      date: day.logDate,
      gensetId: set.id,
      ...(dayLengthH !== undefined ? { dayLengthH } : {}),
      runningHours: useHoursMeter
        ? { kind: 'cumulative', readingH: v.runningHoursMeter as number, ...(hoursRep ? { replacement: hoursRep } : {}) }
        : { kind: 'run', hoursRun: v.hoursRun as number },
      energy: useKwhMeter ? { kind: 'cumulative', readingKwh: v.kwhMeter as number, ...(kwhRep ? { replacement: kwhRep } : {}) } : { kind: 'produced', kwh: v.kwh as number },
      fuel:
        lot && v.fuelVolumeL !== null && v.fuelVolumeL > 0
          ? { kind: 'volume', value: v.fuelVolumeL, unit: 'L', tempC: v.fuelTempC as number }
          : { kind: 'mass', value: lot && v.fuelMassKg !== null ? v.fuelMassKg : 0, unit: 'kg' },
    };
    prepared.push({ day, lot, raw, extra, fuelLogged: fuelLogged && lot !== null });
  }
  // Runs of the same lot, chained by the day before.
  let i = 0;
  let carried: { date: string; previous: DailyRowContext['previous'] } | null = null;
  while (i < prepared.length) {
    const lotKey = prepared[i].lot?.id ?? '';
    let j = i;
    while (j < prepared.length && (prepared[j].lot?.id ?? '') === lotKey) j++;
    const run = prepared.slice(i, j);
    const first = run[0].day.logDate;
    const previous = carried && dayNumber(carried.date) === dayNumber(first) - 1 ? carried.previous : undefined;
    const lot = run[0].lot;
    const { rows } = deriveGensetSeries(
      run.map((r) => r.raw),
      { ratedKw: set.ratedKw, minLoadPct: set.minLoadPct, lot: lot ? toOptimizerLot(lot) : PLACEHOLDER_LOT, previous },
    );
    rows.forEach((row, k) => {
      const p = run[k];
      const fuelOk = p.fuelLogged;
      const hoursRun = row.hoursRun;
      const extra = [...p.extra];
      if (!(p.day.values.fuelMassKg !== null || p.day.values.fuelVolumeL !== null) && hoursRun !== null && hoursRun > 0) {
        extra.push(flag('FUEL_NOT_LOGGED', 'fuel', 'The set ran but no fuel is logged; SFOC cannot be computed.'));
      }
      const flags = row.flags.filter((f) => fuelOk || (f.code !== 'SFOC_OUT_OF_BAND' && f.code !== 'FUEL_WITHOUT_HOURS')) as LogFlag[];
      byDate.set(p.day.logDate, {
        derived: {
          hoursRun: row.hoursRun,
          kwh: row.kwh,
          avgLoadKw: row.avgLoadKw,
          avgLoadPct: row.avgLoadPct,
          fuelKgAt15: fuelOk ? row.fuelKgAt15 : null,
          fuelKgIso: fuelOk ? row.fuelKgIso : null,
          lcvKjPerKg: lot ? row.lcvKjPerKg : null,
          lcvBasis: lot ? row.lcvBasis : null,
          sfocObservedGPerKwh: fuelOk ? row.sfocObservedGPerKwh : null,
          sfocIsoGPerKwh: fuelOk ? row.sfocIsoGPerKwh : null,
          co2Kg: fuelOk ? row.co2Kg : null,
          fuelLotReference: lot?.reference ?? null,
          usable: !flags.some((f) => f.severity === 'error') && fuelOk,
        },
        flags: [...flags, ...extra],
      });
    });
    const last = rows[rows.length - 1];
    carried = { date: run[run.length - 1].day.logDate, previous: { runningHoursReadingH: last.readings.runningHoursH, energyReadingKwh: last.readings.energyKwh } };
    i = j;
  }
  const missingDays = sorted.length
    ? checkLogSeries(
        sorted.map((d) => ({ gensetId: set.id, date: d.logDate })),
        options,
      )
        .filter((s) => s.flag.code === 'MISSING_DAY')
        .map((s) => s.date)
    : [];
  return { byDate, missingDays };
}
