/**
 * Operating guideline of one mode: which combination of sets to run in which load band.
 */
import { maxLoadKw, type GensetUnit, type ReserveRule } from '../plant';
import { rankCombinations, type Demand, type RankedCombination } from './combinations';

export interface GuidelineOptions {
  /** Load step of the sweep, kW. Overrides stepPct. */
  stepKw?: number;
  /** Load step as % of the maximum continuous capacity of available sets. Default 1. */
  stepPct?: number;
  /** Bus tie open with several sections: share of the plant load on each section, %; must sum to 100. */
  sectionSharePct?: Record<string, number>;
  /** Passed to the economic dispatch. Default 1e-9. */
  lambdaRelTol?: number;
}

export interface GuidelineAlternative {
  unitIds: string[];
  unitNames: string[];
  fuelKgPerDay: number;
}

export interface GuidelineBand {
  /** Lowest and highest swept load at which this combination is best, kW. */
  fromKw: number;
  toKw: number;
  unitIds: string[];
  unitNames: string[];
  /** Middle of the band, kW, where the fuel figures below are taken. */
  midKw: number;
  fuelKgPerDay: number;
  sfocGPerKwh: number | null;
  /** Cheapest other feasible combination at the band's middle; null when there is none. */
  nextBest: GuidelineAlternative | null;
  /** nextBest − this band's combination at the middle, kg/day; null without a next best. */
  extraFuelNextBestKgPerDay: number | null;
}

export interface GuidelineGap {
  fromKw: number;
  toKw: number;
  /** Reasons given at the first load of the gap. */
  reasons: string[];
}

export interface OperatingGuideline {
  stepKw: number;
  /** Smallest and largest swept load with a feasible combination; null when none. */
  minFeasibleKw: number | null;
  maxFeasibleKw: number | null;
  bands: GuidelineBand[];
  /** Swept loads with no feasible combination (below the first band, between bands, above the last). */
  gaps: GuidelineGap[];
}

const HOURS_PER_DAY = 24;
const MAX_POINTS = 100_000;

function key(ids: string[]): string {
  return ids.join('\u0000');
}

function demandFor(loadKw: number, shares: Record<string, number> | undefined): Demand {
  if (!shares) return loadKw;
  const demand: Record<string, number> = {};
  for (const [section, pct] of Object.entries(shares)) demand[section] = (loadKw * pct) / 100;
  return demand;
}

function checkShares(units: GensetUnit[], rule: ReserveRule, shares: Record<string, number> | undefined): void {
  const sections = new Set(units.map((u) => u.busSection));
  if (!rule.busTieClosed && sections.size > 1 && !shares) {
    throw new Error('operatingGuideline requires sectionSharePct when the bus tie is open with several sections');
  }
  if (!shares) return;
  const values = Object.values(shares);
  const total = values.reduce((s, x) => s + x, 0);
  if (values.some((x) => !(x >= 0)) || Math.abs(total - 100) > 1e-9) {
    throw new Error('operatingGuideline requires sectionSharePct values ≥ 0 that sum to 100');
  }
}

/**
 * Sweeps the plant load over the range of the available sets under one mode's rule and derives the load bands
 * (kW) in which each combination is the cheapest, with the fuel per day at each band's middle against the
 * next-best combination there. Consecutive loads with the same best combination form one band (adjacent equal
 * bands merged); loads with no feasible combination are reported as gaps.
 *
 * Method: `rankCombinations` at every step (exact enumeration and dispatch), so band edges are exact to one
 * step. A combination's feasible loads form one interval (all its limits are linear in the load), so the middle
 * of a band is always feasible for it.
 *
 * Cost: (capacity / step) enumerations, e.g. 100 × O(2^N · D) at the default 1 % step. Throws on a step ≤ 0,
 * more than 100 000 sweep points, missing or inconsistent section shares, and what `rankCombinations` rejects.
 *
 * @example
 * operatingGuideline(units, seaRule, { stepPct: 1 }).bands.map((b) => [b.fromKw, b.toKw, b.unitNames.join('+')])
 * // e.g. [[48, 960, 'DG1'], [1008, 1872, 'DG1+DG2'], ...]
 */
export function operatingGuideline(units: GensetUnit[], rule: ReserveRule, options: GuidelineOptions = {}): OperatingGuideline {
  checkShares(units, rule, options.sectionSharePct);
  const capacityKw = units.filter((u) => u.available).reduce((s, u) => s + maxLoadKw(u), 0);
  const stepKw = options.stepKw ?? (capacityKw * (options.stepPct ?? 1)) / 100;
  if (!(stepKw > 0) || !Number.isFinite(stepKw)) throw new Error('operatingGuideline requires a step > 0 kW');
  const points = Math.floor(capacityKw / stepKw + 1e-9);
  if (points > MAX_POINTS) throw new Error(`operatingGuideline sweeps at most ${MAX_POINTS} loads; use a larger step`);
  const rankOptions = { lambdaRelTol: options.lambdaRelTol };
  const rank = (loadKw: number) => rankCombinations(units, demandFor(loadKw, options.sectionSharePct), rule, rankOptions);

  const loads: number[] = [];
  for (let k = 1; k <= points; k++) loads.push(k * stepKw);
  if (capacityKw > 0 && (loads.length === 0 || capacityKw - loads[loads.length - 1] > 1e-9 * capacityKw)) loads.push(capacityKw);

  const raw: { fromKw: number; toKw: number; best: RankedCombination }[] = [];
  const gaps: GuidelineGap[] = [];
  let previous: 'band' | 'gap' | null = null;
  for (const loadKw of loads) {
    const result = rank(loadKw);
    if (!result.feasible) {
      if (previous === 'gap') gaps[gaps.length - 1].toKw = loadKw;
      else gaps.push({ fromKw: loadKw, toKw: loadKw, reasons: result.reasons });
      previous = 'gap';
      continue;
    }
    const last = raw[raw.length - 1];
    if (previous === 'band' && key(last.best.unitIds) === key(result.best.unitIds)) last.toKw = loadKw;
    else raw.push({ fromKw: loadKw, toKw: loadKw, best: result.best });
    previous = 'band';
  }

  const bands = raw.map(({ fromKw, toKw, best }): GuidelineBand => {
    const midKw = 0.5 * (fromKw + toKw);
    const atMid = rank(midKw);
    const combos = atMid.feasible ? atMid.combinations : [];
    const own = combos.find((c) => key(c.unitIds) === key(best.unitIds)) ?? best;
    const other = combos.find((c) => key(c.unitIds) !== key(best.unitIds)) ?? null;
    const fuelKgPerDay = own.fuelKgPerH * HOURS_PER_DAY;
    return {
      fromKw,
      toKw,
      unitIds: best.unitIds,
      unitNames: best.unitNames,
      midKw,
      fuelKgPerDay,
      sfocGPerKwh: own.sfocGPerKwh,
      nextBest: other ? { unitIds: other.unitIds, unitNames: other.unitNames, fuelKgPerDay: other.fuelKgPerH * HOURS_PER_DAY } : null,
      extraFuelNextBestKgPerDay: other ? other.fuelKgPerH * HOURS_PER_DAY - fuelKgPerDay : null,
    };
  });
  return {
    stepKw,
    minFeasibleKw: raw.length > 0 ? raw[0].fromKw : null,
    maxFeasibleKw: raw.length > 0 ? raw[raw.length - 1].toKw : null,
    bands,
    gaps,
  };
}
