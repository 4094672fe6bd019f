/**
 * One genset's day: from the raw engine-room log entry to hours, energy, load, fuel mass (corrected and ISO-LCV
 * referred), SFOC and CO2, with quality flags.
 */

import { massAt15Kg } from '../fuel/volume-correction';
import { estimateLcvMjPerKg, fuelCorrectedToIsoLcvKg } from '../fuel/calorific-value';
import { CF_TABLE, cfFuelTypeForGrade } from '../fuel/carbon-factors';
import type { CfFuelType, FuelGrade } from '../fuel/carbon-factors';
import { meterDelta } from './meter-delta';
import type { MeterDeltaResult, MeterReplacement } from './meter-delta';
import { DEFAULT_SFOC_BAND_G_PER_KWH, qualityFlag } from './quality-flags';
import type { QualityFlag } from './quality-flags';

/** Running hours as logged: the hour-meter reading (cumulative) or the hours run that day. */
export type RunningHoursEntry =
  | { kind: 'cumulative'; readingH: number; replacement?: MeterReplacement }
  | { kind: 'run'; hoursRun: number };

/** Energy as logged: the kWh-meter reading (cumulative) or the kWh produced that day. */
export type EnergyEntry =
  | { kind: 'cumulative'; readingKwh: number; replacement?: MeterReplacement }
  | { kind: 'produced'; kwh: number };

/** Fuel burned that day: a mass (kg or t) or an observed volume (L or m³) at a temperature. */
export type FuelEntry =
  | { kind: 'mass'; value: number; unit: 'kg' | 't' }
  | { kind: 'volume'; value: number; unit: 'L' | 'm3'; tempC: number };

/** One day's raw log of one genset. */
export interface RawDailyLog {
  /** Ship's date, YYYY-MM-DD. */
  date: string;
  gensetId: string;
  runningHours: RunningHoursEntry;
  energy: EnergyEntry;
  fuel: FuelEntry;
  /** Length of this ship's day when it is not 24 h (clocks advanced or retarded: 23 or 25 h); overrides the context's. */
  dayLengthH?: number;
}

/** The fuel lot (bunker delivery) the set burned that day. */
export interface FuelLot {
  grade: FuelGrade;
  /** Density at 15 °C, kg/m³ (from the bunker delivery note or the lab report). */
  density15KgPerM3: number;
  /** Lower calorific value, kJ/kg, when known. */
  lcvKjPerKg?: number;
  /** true when lcvKjPerKg is itself an estimate (e.g. a supplier's calculated value), false when measured. */
  lcvIsEstimated?: boolean;
  /** Kinematic viscosity at 50 °C, mm²/s; decides LFO/HFO for VLSFO-type grades. */
  viscosity50Cst?: number;
  waterPct?: number;
  ashPct?: number;
  sulphurPct?: number;
}

/** Everything deriveDailyRow needs besides the day's log. */
export interface DailyRowContext {
  ratedKw: number;
  /** The set's minimum load, % of rating. */
  minLoadPct: number;
  lot: FuelLot;
  /** Yesterday's meter readings (needed for cumulative entries). */
  previous?: { runningHoursReadingH?: number | null; energyReadingKwh?: number | null };
  /** Plausible observed SFOC band, g/kWh; default 150 to 450 (common practice). */
  sfocBandGPerKwh?: { min: number; max: number };
  /** Length of the ship's day, h; 23 or 25 on days the clocks are advanced or retarded. Default 24. */
  dayLengthH?: number;
}

/** Where the LCV used came from. */
export type LcvBasis = 'measured' | 'lot-estimate' | 'iso-8217-estimate' | 'mepc-default';

/** The derived day. null marks a figure that cannot be computed (see flags). */
export interface DerivedDailyRow {
  date: string;
  gensetId: string;
  hoursRun: number | null;
  kwh: number | null;
  avgLoadKw: number | null;
  avgLoadPct: number | null;
  /** Fuel mass in vacuum, kg, from the volume corrected to 15 °C (Table 54B) or from the logged mass. */
  fuelKgAt15: number;
  /** Fuel mass referred to the ISO 3046-1 LCV of 42 700 kJ/kg. */
  fuelKgIso: number;
  lcvKjPerKg: number;
  lcvBasis: LcvBasis;
  cfFuelType: CfFuelType;
  sfocObservedGPerKwh: number | null;
  sfocIsoGPerKwh: number | null;
  co2Kg: number;
  /**
   * Today's cumulative readings (after a replacement: the new meter's), to pass as tomorrow's previous; null when
   * the day was logged as hours run / kWh produced rather than as a reading.
   */
  readings: { runningHoursH: number | null; energyKwh: number | null };
  flags: QualityFlag[];
  /** true when no flag has severity 'error'. */
  usable: boolean;
}

const FN = 'deriveDailyRow';

function requireFinite(field: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new Error(`${FN} requires ${field} to be a finite number (got ${String(v)})`);
  return v;
}

function requireNonNegative(field: string, v: unknown): number {
  const n = requireFinite(field, v);
  if (n < 0) throw new Error(`${FN} requires ${field} ≥ 0 (got ${n})`);
  return n;
}

/** Today's amount from a cumulative reading: the meter delta, or null with a flag. */
function fromCumulative(
  field: 'runningHours' | 'energy',
  readingField: string,
  unit: string,
  currentReading: number,
  previousReading: number | null | undefined,
  replacement: MeterReplacement | undefined,
  flags: QualityFlag[],
): { amount: number | null; reading: number } {
  const reading = requireFinite(`${field}.${readingField}`, currentReading);
  const result = meterDelta({ previousReading, currentReading: reading, replacement });
  return { amount: fromMeter(result, field, unit, flags), reading };
}

/** Turns a meter result into a value or a flag. */
function fromMeter(result: MeterDeltaResult, field: string, unit: string, flags: QualityFlag[]): number | null {
  if (result.ok) return result.delta;
  if (result.reason === 'previous-missing') {
    flags.push(qualityFlag('METER_PREVIOUS_MISSING', field, `The ${field} meter reading has no reading of the day before to subtract.`));
  } else if (result.reason === 'negative-delta') {
    flags.push(
      qualityFlag(
        'METER_NEGATIVE_DELTA',
        field,
        `The ${field} meter reads ${-result.rawDelta} ${unit} less than the day before: record the meter replacement or rollover (old final and new start readings), or correct the reading.`,
      ),
    );
  } else {
    flags.push(qualityFlag('METER_REPLACEMENT_INCONSISTENT', field, `The recorded ${field} meter replacement does not fit the readings: ${result.detail}.`));
  }
  return null;
}

function lcvFor(lot: FuelLot, fuelType: CfFuelType): { lcvKjPerKg: number; lcvBasis: LcvBasis } {
  if (lot.lcvKjPerKg !== undefined) {
    requireFinite('lot.lcvKjPerKg', lot.lcvKjPerKg);
    return { lcvKjPerKg: lot.lcvKjPerKg, lcvBasis: lot.lcvIsEstimated ? 'lot-estimate' : 'measured' };
  }
  const family = CF_TABLE[fuelType].iso8217Family;
  if (family === null) return { lcvKjPerKg: CF_TABLE[fuelType].lcvKjPerKg, lcvBasis: 'mepc-default' };
  const mj = estimateLcvMjPerKg({
    density15KgPerM3: lot.density15KgPerM3,
    waterPct: lot.waterPct,
    ashPct: lot.ashPct,
    sulphurPct: lot.sulphurPct,
    family,
  });
  return { lcvKjPerKg: mj * 1000, lcvBasis: 'iso-8217-estimate' };
}

function fuelMassKg(fuel: FuelEntry, density15KgPerM3: number): number {
  if (fuel.kind === 'mass') {
    const v = requireNonNegative('fuel.value', fuel.value);
    if (fuel.unit !== 'kg' && fuel.unit !== 't') throw new Error(`${FN} requires fuel.unit 'kg' or 't' for a mass (got ${String(fuel.unit)})`);
    return fuel.unit === 't' ? v * 1000 : v;
  }
  if (fuel.kind === 'volume') {
    const v = requireNonNegative('fuel.value', fuel.value);
    if (fuel.unit !== 'L' && fuel.unit !== 'm3') throw new Error(`${FN} requires fuel.unit 'L' or 'm3' for a volume (got ${String(fuel.unit)})`);
    const volume = fuel.unit === 'L' ? { volumeL: v } : { volumeM3: v };
    return massAt15Kg({ ...volume, tempC: fuel.tempC, density15KgPerM3 });
  }
  throw new Error(`${FN} requires fuel.kind 'mass' or 'volume'`);
}

/**
 * Derives one genset-day from its raw log.
 *
 * hoursRun and kwh come from the logged amounts or from cumulative meter deltas (meterDelta: negative deltas are
 * flagged, never accepted; a recorded replacement gives the right delta). avgLoadKw = kwh / hoursRun,
 * avgLoadPct = 100·avgLoadKw / ratedKw. Fuel mass is mass in vacuum (volume × Table 54B VCF × density at 15 °C,
 * or the logged kg / t). fuelKgIso = fuel × LCV / 42 700 (ISO 3046-1), with the lot's LCV, else the ISO 8217
 * annex estimate from density (distillate or residual formula by grade), else the MEPC.364(79) default LCV for
 * gases and alcohols. SFOC = 1000 · fuel / kwh (g/kWh). co2Kg = fuel × Cf (MEPC.364(79)).
 * Flags: HOURS_OVER_24 (above the day length), HOURS_NEGATIVE, METER_*, KWH_OVER_RATED, SFOC_OUT_OF_BAND, LOW_LOAD,
 * FUEL_WITHOUT_HOURS.
 *
 * Cost O(1). Throws on malformed input (non-finite numbers, negative fuel or produced kWh, unknown units or grade,
 * density or fuel temperature outside Table 54B, ratedKw ≤ 0, minLoadPct outside 0 to 100, an empty band).
 *
 * @example
 * deriveDailyRow(
 *   { date: '2026-03-02', gensetId: 'DG1', runningHours: { kind: 'run', hoursRun: 20 },
 *     energy: { kind: 'produced', kwh: 10_000 }, fuel: { kind: 'mass', value: 2.2, unit: 't' } },
 *   { ratedKw: 1000, minLoadPct: 30, lot: { grade: 'MGO', density15KgPerM3: 850, lcvKjPerKg: 42_700 } },
 * ).sfocObservedGPerKwh // 220
 */
export function deriveDailyRow(raw: RawDailyLog, context: DailyRowContext): DerivedDailyRow {
  const ratedKw = requireFinite('context.ratedKw', context.ratedKw);
  if (ratedKw <= 0) throw new Error(`${FN} requires context.ratedKw > 0 (got ${ratedKw})`);
  const minLoadPct = requireFinite('context.minLoadPct', context.minLoadPct);
  if (minLoadPct < 0 || minLoadPct > 100) throw new Error(`${FN} requires context.minLoadPct between 0 and 100 (got ${minLoadPct})`);
  const band = context.sfocBandGPerKwh ?? DEFAULT_SFOC_BAND_G_PER_KWH;
  if (!(requireFinite('sfocBandGPerKwh.min', band.min) < requireFinite('sfocBandGPerKwh.max', band.max))) {
    throw new Error(`${FN} requires sfocBandGPerKwh.min < sfocBandGPerKwh.max`);
  }
  const dayLengthH = requireFinite('dayLengthH', raw.dayLengthH ?? context.dayLengthH ?? 24);
  if (dayLengthH < 20 || dayLengthH > 28) throw new Error(`${FN} requires context.dayLengthH between 20 and 28 h (got ${dayLengthH})`);
  const { lot } = context;
  const flags: QualityFlag[] = [];

  // Hours run.
  let hoursRun: number | null;
  let hoursReading: number | null = null;
  if (raw.runningHours.kind === 'cumulative') {
    const { readingH, replacement } = raw.runningHours;
    ({ amount: hoursRun, reading: hoursReading } = fromCumulative('runningHours', 'readingH', 'h', readingH, context.previous?.runningHoursReadingH, replacement, flags));
  } else if (raw.runningHours.kind === 'run') {
    hoursRun = requireFinite('runningHours.hoursRun', raw.runningHours.hoursRun);
  } else {
    throw new Error(`${FN} requires runningHours.kind 'cumulative' or 'run'`);
  }
  if (hoursRun !== null && hoursRun < 0) {
    flags.push(qualityFlag('HOURS_NEGATIVE', 'hoursRun', `Hours run is negative (${hoursRun} h).`));
    hoursRun = null;
  } else if (hoursRun !== null && hoursRun > dayLengthH) {
    flags.push(qualityFlag('HOURS_OVER_24', 'hoursRun', `Hours run (${hoursRun} h) exceed the length of the day (${dayLengthH} h).`));
  }

  // Energy.
  let kwh: number | null;
  let energyReading: number | null = null;
  if (raw.energy.kind === 'cumulative') {
    const { readingKwh, replacement } = raw.energy;
    ({ amount: kwh, reading: energyReading } = fromCumulative('energy', 'readingKwh', 'kWh', readingKwh, context.previous?.energyReadingKwh, replacement, flags));
  } else if (raw.energy.kind === 'produced') {
    kwh = requireNonNegative('energy.kwh', raw.energy.kwh);
  } else {
    throw new Error(`${FN} requires energy.kind 'cumulative' or 'produced'`);
  }

  // Fuel, LCV, CO2.
  const { fuelType } = cfFuelTypeForGrade(lot.grade, { viscosity50Cst: lot.viscosity50Cst, density15KgPerM3: lot.density15KgPerM3 });
  const fuelKgAt15 = fuelMassKg(raw.fuel, requireFinite('lot.density15KgPerM3', lot.density15KgPerM3));
  const { lcvKjPerKg, lcvBasis } = lcvFor(lot, fuelType);
  const fuelKgIso = fuelCorrectedToIsoLcvKg(fuelKgAt15, lcvKjPerKg);
  const co2 = fuelKgAt15 * CF_TABLE[fuelType].cfTCo2PerTFuel;

  // Load.
  let avgLoadKw: number | null = null;
  let avgLoadPct: number | null = null;
  if (hoursRun !== null && kwh !== null) {
    if (kwh > ratedKw * hoursRun) {
      flags.push(
        qualityFlag('KWH_OVER_RATED', 'kwh', `Energy ${kwh} kWh exceeds rated power × hours run (${ratedKw} kW × ${hoursRun} h = ${ratedKw * hoursRun} kWh).`),
      );
    }
    if (hoursRun > 0) {
      avgLoadKw = kwh / hoursRun;
      avgLoadPct = (100 * avgLoadKw) / ratedKw;
      if (avgLoadPct < minLoadPct) {
        flags.push(
          qualityFlag('LOW_LOAD', 'avgLoadPct', `Average load ${avgLoadPct.toFixed(1)} % is below the set's minimum load of ${minLoadPct} % (low-load running).`),
        );
      }
    }
  }
  if (hoursRun === 0 && fuelKgAt15 > 0) {
    flags.push(qualityFlag('FUEL_WITHOUT_HOURS', 'fuel', `Fuel (${fuelKgAt15.toFixed(1)} kg) is logged on a day with zero hours run.`));
  }

  // SFOC.
  let sfocObservedGPerKwh: number | null = null;
  let sfocIsoGPerKwh: number | null = null;
  if (kwh !== null && kwh > 0) {
    sfocObservedGPerKwh = (1000 * fuelKgAt15) / kwh;
    sfocIsoGPerKwh = (1000 * fuelKgIso) / kwh;
    if (sfocObservedGPerKwh < band.min || sfocObservedGPerKwh > band.max) {
      flags.push(
        qualityFlag(
          'SFOC_OUT_OF_BAND',
          'sfocObservedGPerKwh',
          `Observed SFOC ${sfocObservedGPerKwh.toFixed(1)} g/kWh lies outside the plausible band ${band.min} to ${band.max} g/kWh.`,
        ),
      );
    }
  }

  return {
    date: raw.date,
    gensetId: raw.gensetId,
    hoursRun,
    kwh,
    avgLoadKw,
    avgLoadPct,
    fuelKgAt15,
    fuelKgIso,
    lcvKjPerKg,
    lcvBasis,
    cfFuelType: fuelType,
    sfocObservedGPerKwh,
    sfocIsoGPerKwh,
    co2Kg: co2,
    readings: { runningHoursH: hoursReading, energyKwh: energyReading },
    flags,
    usable: !flags.some((f) => f.severity === 'error'),
  };
}
