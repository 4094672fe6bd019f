/**
 * Savings totals of a vessel by day, month and chosen period: fuel, CO2 (MEPC.364(79) Cf of the grade burned),
 * cost (company prices per grade with validity dates), low-load hours, with delta-method intervals.
 */
import { co2Kg, FUEL_GRADES, type FuelGrade } from '../fuel/index';
import { costDay, unitsWithFittedCurves, type DaySavingsOptions } from './daily-savings';
import type { DaySavings, FuelSensitivity, SavingsInput, SavingsInterval } from './types';
import { addScaledSensitivity, deltaInterval } from './uncertainty';

/** A company fuel price of one grade, valid from `validFrom` to `validTo` (both inclusive; open-ended when absent). */
export interface FuelPrice {
  grade: FuelGrade;
  pricePerT: number;
  currency: string;
  validFrom: string;
  validTo?: string | null;
}

export interface SavingsOptions extends DaySavingsOptions {
  /** Confidence level of the intervals; default 0.95. */
  level?: number;
  prices?: FuelPrice[];
  /** First and last date of the chosen period (inclusive); default all days given. */
  from?: string;
  to?: string;
}

/** An amount with its delta-method interval, in the unit of the field name. */
export interface IntervalAmount {
  value: number;
  lower: number;
  upper: number;
  sd: number;
}

export interface SavingsTotals {
  /** The date, the month YYYY-MM, or 'period'. */
  label: string;
  from: string;
  to: string;
  days: number;
  energyMwh: number;
  modelledActualFuelT: number;
  /** null when any day lacks measured fuel. */
  measuredFuelT: number | null;
  residualT: number | null;
  residualPct: number | null;
  /** Dates without a feasible recommendation: left out of the recommended and avoidable figures. */
  daysWithoutRecommendation: string[];
  recommendedFuelT: number;
  avoidableFuelT: IntervalAmount;
  /** 100 · avoidable / modelled actual of the days with a recommendation. */
  avoidablePct: number | null;
  /** Effective dof of the fuel interval (Welch–Satterthwaite). */
  effectiveDof: number;
  co2: { modelledActualT: number; measuredT: number | null; avoidableT: IntervalAmount };
  /** null without prices. Covers the priced days only (`daysWithoutPrice` lists the others). */
  cost: { currency: string; measured: number | null; modelledActual: number; avoidable: IntervalAmount; daysWithoutPrice: string[] } | null;
  lowLoadHours: number;
  /** Equal split − optimal split with the recommended sets, t (days where both exist). */
  splitSavingRecommendedSetsT: number;
  /** Equal split − optimal split with the sets actually run, t, over the days where it is defined. */
  splitSavingActualSetsT: number;
  daysWithoutActualSplit: string[];
  daysFollowingRecommendation: number;
}

export interface VesselSavings {
  days: DaySavings[];
  byDay: SavingsTotals[];
  byMonth: SavingsTotals[];
  period: SavingsTotals;
  warnings: string[];
}

function checkDate(value: string, what: string, caller: string): void {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value) || Number.isNaN(Date.parse(value))) {
    throw new Error(`${caller} requires ${what} as an ISO date YYYY-MM-DD (got ${String(value)})`);
  }
}

function checkPrices(prices: FuelPrice[], caller: string): void {
  const currencies = new Set<string>();
  for (const p of prices) {
    if (!(FUEL_GRADES as readonly string[]).includes(p.grade)) throw new Error(`${caller} requires prices of known grades (got ${String(p.grade)})`);
    if (!(p.pricePerT >= 0) || !Number.isFinite(p.pricePerT)) throw new Error(`${caller} requires pricePerT ≥ 0 (${p.grade} from ${p.validFrom})`);
    checkDate(p.validFrom, 'validFrom', caller);
    if (p.validTo != null) {
      checkDate(p.validTo, 'validTo', caller);
      if (p.validTo < p.validFrom) throw new Error(`${caller} requires validTo ≥ validFrom (${p.grade} from ${p.validFrom})`);
    }
    currencies.add(p.currency);
  }
  if (currencies.size > 1) throw new Error(`${caller} requires prices in one currency (got ${[...currencies].join(', ')})`);
}

/**
 * Price per tonne of a grade on a date: among the prices of that grade valid on the date (validFrom ≤ date ≤
 * validTo), the one with the latest validFrom; null when none is valid.
 *
 * Cost: O(number of prices). Throws on a bad date.
 *
 * @example fuelPriceOn([{ grade: 'MGO', pricePerT: 700, currency: 'USD', validFrom: '2024-01-01' }], 'MGO', '2024-02-01') // 700
 */
export function fuelPriceOn(prices: FuelPrice[], grade: FuelGrade, date: string): number | null {
  checkDate(date, 'date', 'fuelPriceOn');
  let best: FuelPrice | null = null;
  for (const p of prices) {
    if (p.grade !== grade || p.validFrom > date || (p.validTo != null && p.validTo < date)) continue;
    if (!best || p.validFrom > best.validFrom) best = p;
  }
  return best ? best.pricePerT : null;
}

function amount(interval: SavingsInterval, perKg: number): IntervalAmount {
  return { value: interval.estimateKg * perKg, lower: interval.lowerKg * perKg, upper: interval.upperKg * perKg, sd: interval.sdKg * perKg };
}

/**
 * Totals of a group of costed days with delta-method intervals. The sensitivities are summed over the days
 * before the variance is formed, so the same curve error counts on every day (full correlation across days).
 *
 * Cost: O(days · units). Throws as `vesselSavings` on bad options.
 *
 * @example summarizeDays('2024-03', monthDays, fits).avoidableFuelT.value
 */
export function summarizeDays(
  label: string,
  days: DaySavings[],
  fits: SavingsInput['fits'] = {},
  options: Pick<SavingsOptions, 'level' | 'prices'> = {},
): SavingsTotals {
  const level = options.level ?? 0.95;
  const prices = options.prices;
  const fuelSens: FuelSensitivity = {};
  const co2Sens: FuelSensitivity = {};
  const costSens: FuelSensitivity = {};
  let energyKwh = 0;
  let modelledKg = 0;
  let measuredKg: number | null = 0;
  let recommendedKg = 0;
  let avoidableKg = 0;
  let modelledWithRecKg = 0;
  let co2ModelledKg = 0;
  let co2MeasuredKg: number | null = 0;
  let co2AvoidableKg = 0;
  let costMeasured: number | null = 0;
  let costModelled = 0;
  let costAvoidable = 0;
  let lowLoadHours = 0;
  let splitRecKg = 0;
  let splitActKg = 0;
  let followed = 0;
  const noRec: string[] = [];
  const noSplit: string[] = [];
  const noPrice: string[] = [];
  for (const d of days) {
    const cfPerKg = co2Kg(1, d.fuel.grade, d.fuel.lot ?? {});
    const pricePerT = prices ? fuelPriceOn(prices, d.fuel.grade, d.date) : null;
    const pricePerKg = pricePerT === null ? null : pricePerT / 1000;
    if (prices && pricePerKg === null) noPrice.push(d.date);
    energyKwh += d.energyKwh;
    modelledKg += d.modelledActualFuelKg;
    co2ModelledKg += cfPerKg * d.modelledActualFuelKg;
    measuredKg = measuredKg === null || d.measuredFuelKg === null ? null : measuredKg + d.measuredFuelKg;
    co2MeasuredKg = co2MeasuredKg === null || d.measuredFuelKg === null ? null : co2MeasuredKg + cfPerKg * d.measuredFuelKg;
    if (pricePerKg !== null) {
      costModelled += pricePerKg * d.modelledActualFuelKg;
      costMeasured = costMeasured === null || d.measuredFuelKg === null ? null : costMeasured + pricePerKg * d.measuredFuelKg;
    }
    lowLoadHours += d.lowLoadHours;
    if (d.followedRecommendation) followed++;
    if (d.splitSavingActualSetsKg === null) noSplit.push(d.date);
    else splitActKg += d.splitSavingActualSetsKg;
    if (d.avoidableFuelKg === null || d.recommendedFuelKg === null || d.avoidableSensitivity === null) {
      noRec.push(d.date);
      continue;
    }
    splitRecKg += d.splitSavingRecommendedSetsKg ?? 0;
    recommendedKg += d.recommendedFuelKg;
    avoidableKg += d.avoidableFuelKg;
    modelledWithRecKg += d.modelledActualFuelKg;
    co2AvoidableKg += cfPerKg * d.avoidableFuelKg;
    addScaledSensitivity(fuelSens, d.avoidableSensitivity, 1);
    addScaledSensitivity(co2Sens, d.avoidableSensitivity, cfPerKg);
    if (pricePerKg !== null) {
      costAvoidable += pricePerKg * d.avoidableFuelKg;
      addScaledSensitivity(costSens, d.avoidableSensitivity, pricePerKg);
    }
  }
  const fuelInterval = deltaInterval(avoidableKg, fuelSens, fits, level);
  const co2Interval = deltaInterval(co2AvoidableKg, co2Sens, fits, level);
  const costInterval = deltaInterval(costAvoidable, costSens, fits, level);
  const dates = days.map((d) => d.date).sort();
  return {
    label,
    from: dates[0] ?? '',
    to: dates[dates.length - 1] ?? '',
    days: days.length,
    energyMwh: energyKwh / 1000,
    modelledActualFuelT: modelledKg / 1000,
    measuredFuelT: measuredKg === null ? null : measuredKg / 1000,
    residualT: measuredKg === null ? null : (measuredKg - modelledKg) / 1000,
    residualPct: measuredKg === null || modelledKg <= 0 ? null : (100 * (measuredKg - modelledKg)) / modelledKg,
    daysWithoutRecommendation: noRec,
    recommendedFuelT: recommendedKg / 1000,
    avoidableFuelT: amount(fuelInterval, 1 / 1000),
    avoidablePct: modelledWithRecKg > 0 ? (100 * avoidableKg) / modelledWithRecKg : null,
    effectiveDof: fuelInterval.effectiveDof,
    co2: {
      modelledActualT: co2ModelledKg / 1000,
      measuredT: co2MeasuredKg === null ? null : co2MeasuredKg / 1000,
      avoidableT: amount(co2Interval, 1 / 1000),
    },
    cost: prices
      ? { currency: prices[0]?.currency ?? '', measured: costMeasured, modelledActual: costModelled, avoidable: amount(costInterval, 1), daysWithoutPrice: noPrice }
      : null,
    lowLoadHours,
    splitSavingRecommendedSetsT: splitRecKg / 1000,
    splitSavingActualSetsT: splitActKg / 1000,
    daysWithoutActualSplit: noSplit,
    daysFollowingRecommendation: followed,
  };
}

/** Days of the input inside the chosen period, sorted by date; throws on duplicates or bad bounds. */
export function periodDays<T extends { date: string }>(days: T[], from: string | undefined, to: string | undefined, caller: string): T[] {
  if (from !== undefined) checkDate(from, 'from', caller);
  if (to !== undefined) checkDate(to, 'to', caller);
  const kept = days.filter((d) => (from === undefined || d.date >= from) && (to === undefined || d.date <= to));
  kept.sort((x, y) => (x.date < y.date ? -1 : x.date > y.date ? 1 : 0));
  for (let i = 1; i < kept.length; i++) {
    if (kept[i].date === kept[i - 1].date) throw new Error(`${caller} requires one entry per date (${kept[i].date} twice)`);
  }
  return kept;
}

/** Group by a key in first-seen order. */
function groupBy<T>(items: T[], key: (item: T) => string): [string, T[]][] {
  const groups = new Map<string, T[]>();
  for (const item of items) {
    const k = key(item);
    const list = groups.get(k);
    if (list) list.push(item);
    else groups.set(k, [item]);
  }
  return [...groups.entries()];
}

/**
 * Savings of a vessel over a chosen period: each logged day costed (`daySavings`), with totals by day, month and
 * period of fuel (t), CO2 (t, MEPC.364(79) Cf of the day's grade via `co2Kg`), cost (price per t of the grade
 * valid on the day), low-load running hours and the split savings, each avoidable figure with a delta-method
 * interval (`deltaInterval`) in which the same curve error counts on every day.
 *
 * Cost: O(days · modes · 2^N) for the recommendations (N switchable sets), O(days · N) for the totals.
 *
 * Throws on bad input (see `daySavings`), bad dates, prices of unknown grades or in several currencies, or
 * duplicate dates. Days without a feasible recommendation are results, listed in each total.
 *
 * @example
 * const s = vesselSavings({ units, fits, rules, days }, { prices, from: '2024-03-01', to: '2024-03-31' });
 * s.period.avoidableFuelT; // { value, lower, upper, sd }
 */
export function vesselSavings(input: SavingsInput, options: SavingsOptions = {}): VesselSavings {
  const caller = 'vesselSavings';
  const level = options.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new Error(`${caller} requires 0 < level < 1`);
  if (options.prices) checkPrices(options.prices, caller);
  const units = unitsWithFittedCurves(input.units, input.fits, caller);
  const days = periodDays(input.days, options.from, options.to, caller).map((d) => costDay(units, input, d, options));
  const fits = input.fits ?? {};
  const summaryOptions = { level, prices: options.prices };
  const warnings: string[] = [];
  const unfitted = input.units.filter((u) => !fits[u.id]).map((u) => u.name || u.id);
  if (unfitted.length > 0) warnings.push(`no fit covariance for ${unfitted.join(', ')}: their curves count as exact in the intervals`);
  const noRec = days.filter((d) => !d.recommendationFeasible).length;
  if (noRec > 0) warnings.push(`${noRec} day(s) without a feasible recommendation are left out of the avoidable fuel`);
  return {
    days,
    byDay: days.map((d) => summarizeDays(d.date, [d], fits, summaryOptions)),
    byMonth: groupBy(days, (d) => d.month).map(([month, list]) => summarizeDays(month, list, fits, summaryOptions)),
    period: summarizeDays('period', days, fits, summaryOptions),
    warnings,
  };
}
