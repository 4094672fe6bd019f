/**
 * Seeded random voyage-plan problems for tests, benchmarks and demonstrations.
 */
import { chordCurve, type GensetUnit, type ReserveRule } from '../plant';
import { createRng } from '../random';
import type { InitialUnitState, PlanPeriod, PlanProblem } from './types';

export interface RandomPlanOptions {
  units: number;
  periods: number;
  /** 0: quadratic curves; 4 to 6: quadratics replaced by that many chord segments. Default 0. */
  chordSegments?: number;
  /** Load random walk bounds as fractions of the total maximum continuous capacity. Default 0.3 to 0.8. */
  loadFromFraction?: number;
  loadToFraction?: number;
  /** Probabilities of features, each in [0, 1]. */
  nMinus1?: number;
  openTie?: number;
  budgets?: number;
  /** Most units with a running-hour budget (sets approaching overhaul, common practice). Default 2. */
  maxBudgetedUnits?: number;
  /** Largest minimum up / down time, h. Default 4. */
  maxMinUpH?: number;
  /** Period durations are 1 h, or drawn from 1 to this many hours. Default 1. */
  maxDurationH?: number;
  /** Probability that a unit is unavailable / must run. Default 0.05 / 0.03. */
  unavailable?: number;
  mustRun?: number;
}

const RATINGS_KW = [450, 600, 800, 1000, 1250, 1600];

/**
 * A seeded random plan: sets with SFOC-like quadratic fuel curves (best SFOC near 80 % load, common
 * practice), a load random walk, reserve rules by period, optional N-1, open bus tie, hour budgets,
 * start fuel, minimum up/down times and a random initial state.
 *
 * Cost: O(units + periods). Throws when units < 1 or periods < 1.
 *
 * @example randomPlanProblem(7, { units: 4, periods: 24 }).periods.length // 24
 */
export function randomPlanProblem(seed: number, o: RandomPlanOptions): PlanProblem {
  if (!(o.units >= 1) || !(o.periods >= 1)) throw new Error('randomPlanProblem requires at least 1 unit and 1 period');
  const rng = createRng(seed);
  const pick = <T,>(xs: readonly T[]): T => xs[rng.int(0, xs.length - 1)];
  const units: GensetUnit[] = [];
  const twoSections = o.units >= 2 && rng.uniform() < (o.openTie ?? 0.2);
  for (let i = 0; i < o.units; i++) {
    const ratedKw = pick(RATINGS_KW);
    const minLoadPct = rng.int(20, 40);
    const maxLoadPct = rng.int(90, 100);
    const a = ratedKw * 0.03 * (0.85 + 0.3 * rng.uniform());
    const b = 0.155 * (0.95 + 0.1 * rng.uniform());
    const c = (0.045 / ratedKw) * (0.8 + 0.4 * rng.uniform());
    const quad = { kind: 'quadratic' as const, a, b, c };
    const minKw = (ratedKw * minLoadPct) / 100;
    const maxKw = (ratedKw * maxLoadPct) / 100;
    units.push({
      id: `dg${i + 1}`,
      name: `DG${i + 1}`,
      ratedKw,
      minLoadPct,
      maxLoadPct,
      curve: o.chordSegments ? chordCurve(quad, minKw, maxKw, o.chordSegments) : quad,
      busSection: twoSections ? (i % 2 === 0 ? 'A' : 'B') : 'A',
      available: rng.uniform() >= (o.unavailable ?? 0.05),
      mustRun: false,
      startCostKg: Math.round(rng.uniform() * 150) / 10,
      minUpH: rng.int(0, o.maxMinUpH ?? 4),
      minDownH: rng.int(0, Math.max(0, (o.maxMinUpH ?? 4) - 1)),
    });
  }
  for (const u of units) if (u.available && rng.uniform() < (o.mustRun ?? 0.03)) u.mustRun = true;
  const capKw = units.filter((u) => u.available).reduce((s, u) => s + (u.ratedKw * u.maxLoadPct) / 100, 0);
  const lo = (o.loadFromFraction ?? 0.3) * capKw;
  const hi = (o.loadToFraction ?? 0.8) * capKw;
  const rules: ReserveRule[] = [0, 1, 2].map(() => ({
    marginKw: rng.int(0, 4) * 50,
    marginPct: rng.int(0, 4) * 5,
    minSets: rng.int(1, Math.min(2, o.units)),
    nMinus1: o.units >= 2 && rng.uniform() < (o.nMinus1 ?? 0.3),
    busTieClosed: !twoSections || rng.uniform() < 0.5,
  }));
  const periods: PlanPeriod[] = [];
  let load = lo + (hi - lo) * rng.uniform();
  let rule = rules[0];
  for (let t = 0; t < o.periods; t++) {
    load = Math.min(hi, Math.max(lo, load + (hi - lo) * 0.12 * rng.normal()));
    if (rng.uniform() < 0.08) rule = pick(rules);
    const loadKw = Math.round(load);
    const p: PlanPeriod = { durationH: o.maxDurationH ? rng.int(1, o.maxDurationH) : 1, rule, loadKw };
    if (!rule.busTieClosed) {
      const share = 0.35 + 0.3 * rng.uniform();
      p.sectionLoadsKw = { A: Math.round(loadKw * share), B: loadKw - Math.round(loadKw * share) };
    }
    periods.push(p);
  }
  const initialState: Record<string, InitialUnitState> = {};
  for (const u of units) initialState[u.id] = { on: u.mustRun || (u.available && rng.uniform() < 0.5), hoursInState: rng.int(0, 8) };
  const horizonH = periods.reduce((s, p) => s + p.durationH, 0);
  const maxRunningHours: Record<string, number> = {};
  for (const u of units) {
    if (Object.keys(maxRunningHours).length >= (o.maxBudgetedUnits ?? 2)) break;
    if (rng.uniform() < (o.budgets ?? 0.3)) maxRunningHours[u.id] = Math.round(horizonH * (0.4 + 0.5 * rng.uniform()));
  }
  return { units, periods, initialState, maxRunningHours };
}
