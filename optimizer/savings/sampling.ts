/**
 * Seeded sampling of the avoidable fuel: draw every fitted curve's coefficients from its covariance, re-run the
 * actual costing and the recommendation with the drawn curves, and read the spread of the result.
 */
import { quantileSorted } from 'simple-statistics';
import type { GensetUnit } from '../plant';
import { createRng } from '../random';
import { costDay, unitsWithFittedCurves, type DaySavingsOptions } from './daily-savings';
import { periodDays } from './totals';
import type { SavingsInput, SavingsInterval } from './types';
import { multivariateNormalSampler } from './uncertainty';

export interface SamplingOptions extends DaySavingsOptions {
  /** Number of curve draws; default 500. */
  samples?: number;
  /** Seed of the draws (mulberry32); default 1. */
  seed?: number;
  level?: number;
  from?: string;
  to?: string;
}

export interface SampledSavings {
  samples: number;
  seed: number;
  /** Per date: percentile interval of the day's avoidable fuel; null when the day has no feasible recommendation. */
  byDay: Record<string, SavingsInterval | null>;
  byMonth: Record<string, SavingsInterval>;
  period: SavingsInterval;
  /** Draws in which a curve's c came out negative and was set to 0 (a convex curve is needed for the dispatch). */
  clampedDraws: number;
}

function percentileInterval(values: number[], level: number, pointKg: number): SavingsInterval {
  const sorted = [...values].sort((x, y) => x - y);
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / Math.max(1, values.length - 1));
  return {
    level,
    estimateKg: pointKg,
    sdKg: sd,
    lowerKg: quantileSorted(sorted, (1 - level) / 2),
    upperKg: quantileSorted(sorted, (1 + level) / 2),
    effectiveDof: Infinity,
    method: 'sampling',
  };
}

/**
 * Percentile intervals of each day's, month's and the period's avoidable fuel by seeded sampling of the curves.
 *
 * Method: in each draw every fitted unit's (a, b, c) is drawn from N(fit, covariance) (`multivariateNormalSampler`,
 * Cholesky by ml-matrix); a drawn c < 0 is set to 0 so the dispatch stays convex (counted in `clampedDraws`).
 * With the drawn curves every day is costed again, the recommendation re-optimised: one draw serves the actual
 * and the recommended operation of every day, so the correlation between them and across days is kept. The
 * interval is the (1 − level)/2 and (1 + level)/2 sample quantiles (simple-statistics `quantileSorted`) around
 * the point estimate of the fitted curves. Draws are normal: with few fit degrees of freedom the interval is a
 * little narrow (the delta method's Student t allows for this). Reference: Gentle, Random Number Generation and
 * Monte Carlo Methods, 2nd ed., §5.3.1.
 *
 * Cost: samples × the cost of costing all days (one `rankCombinations` per mode and day).
 *
 * Throws on bad input as `vesselSavings`, or when samples < 10.
 *
 * @example sampleSavings({ units, fits, rules, days }, { samples: 400, seed: 7 }).period // { lowerKg, upperKg, … }
 */
export function sampleSavings(input: SavingsInput, options: SamplingOptions = {}): SampledSavings {
  const caller = 'sampleSavings';
  const samples = options.samples ?? 500;
  const seed = options.seed ?? 1;
  const level = options.level ?? 0.95;
  if (!Number.isInteger(samples) || samples < 10) throw new Error(`${caller} requires a whole number of samples ≥ 10`);
  if (!(level > 0 && level < 1)) throw new Error(`${caller} requires 0 < level < 1`);
  const fits = input.fits ?? {};
  const units = unitsWithFittedCurves(input.units, fits, caller);
  const days = periodDays(input.days, options.from, options.to, caller);
  const point = days.map((d) => costDay(units, input, d, options));
  const months = [...new Set(point.map((d) => d.month))];
  const samplers = new Map(
    Object.entries(fits).map(([id, f]) => [id, multivariateNormalSampler([f.curve.a, f.curve.b, f.curve.c], f.covariance)] as const),
  );
  const rng = createRng(seed);
  const dayDraws = point.map(() => [] as number[]);
  const monthDraws = new Map(months.map((m) => [m, [] as number[]]));
  const periodDraws: number[] = [];
  let clampedDraws = 0;
  for (let s = 0; s < samples; s++) {
    const drawn: GensetUnit[] = units.map((u) => {
      const sampler = samplers.get(u.id);
      if (!sampler) return u;
      const [a, b, c] = sampler(rng);
      if (c < 0) clampedDraws++;
      return { ...u, curve: { kind: 'quadratic', a, b, c: Math.max(0, c) } };
    });
    const monthSums = new Map(months.map((m) => [m, 0]));
    let periodSum = 0;
    days.forEach((d, i) => {
      if (point[i].avoidableFuelKg === null) return;
      const kg = costDay(drawn, input, d, options).avoidableFuelKg ?? NaN;
      dayDraws[i].push(kg);
      monthSums.set(point[i].month, monthSums.get(point[i].month)! + kg);
      periodSum += kg;
    });
    for (const m of months) monthDraws.get(m)!.push(monthSums.get(m)!);
    periodDraws.push(periodSum);
  }
  const byDay: Record<string, SavingsInterval | null> = {};
  point.forEach((d, i) => {
    byDay[d.date] = d.avoidableFuelKg === null ? null : percentileInterval(dayDraws[i], level, d.avoidableFuelKg);
  });
  const byMonth: Record<string, SavingsInterval> = {};
  for (const m of months) {
    const pointKg = point.filter((d) => d.month === m).reduce((s, d) => s + (d.avoidableFuelKg ?? 0), 0);
    byMonth[m] = percentileInterval(monthDraws.get(m)!, level, pointKg);
  }
  const periodKg = point.reduce((s, d) => s + (d.avoidableFuelKg ?? 0), 0);
  return { samples, seed, byDay, byMonth, period: percentileInterval(periodDraws, level, periodKg), clampedDraws };
}
