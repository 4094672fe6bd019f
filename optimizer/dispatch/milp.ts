/**
 * The single-operating-point commitment as a mixed-integer linear programme in CPLEX LP format, for a
 * general-purpose solver (HiGHS). Used as an independent check of the enumeration and as its benchmark
 * reference. This is the only file of optimizer/dispatch that touches `highs`, and only through a dynamic import
 * or an instance passed in, so the rest stays loadable in a browser without the WebAssembly module.
 */
import type { GensetUnit, ReserveRule } from '../plant';
import { buildSections, requiredMarginKw, type Demand } from './combinations';
import { prepareUnits } from './economic-dispatch';

/** The part of a HiGHS instance this file uses (`(await import('highs')).default()` satisfies it). */
export interface LpSolver {
  solve(
    lp: string,
    options?: Record<string, unknown>,
  ): { Status: string; ObjectiveValue: number; Columns: Record<string, { Primal: number }> };
}

export interface SinglePointMilp {
  /** CPLEX LP text; null when the model is infeasible on its face (a loaded section without sets). With no
   * set at all the text has an empty objective and the caller need not solve it. */
  lp: string | null;
  /** Column names per unit: on/off binary and the segment loads above the minimum. */
  columns: { id: string; on: string; segments: string[]; minKw: number }[];
}

export type MilpResult =
  | { feasible: true; fuelKgPerH: number; onIds: string[]; loadsKw: Record<string, number> }
  | { feasible: false; status: string };

/** Strict solver settings so the optimum is exact to the LP tolerances, not to a default 1e-4 MIP gap. */
const EXACT_OPTIONS = {
  output_flag: false,
  mip_rel_gap: 0,
  mip_abs_gap: 0,
  mip_feasibility_tolerance: 1e-9,
  primal_feasibility_tolerance: 1e-9,
};

function term(coefficient: number, column: string): string {
  return `${coefficient < 0 ? '-' : '+'} ${Math.abs(coefficient)} ${column}`;
}

function row(terms: string[], fallbackColumn: string): string {
  return terms.length > 0 ? terms.join(' ') : `+ 0 ${fallbackColumn}`;
}

/**
 * Builds the single-period commitment MILP: binary u (set online), segment loads s above the minimum
 * (s ≤ width·u, convex slopes so segments fill in order), load balance per section, online capacity ≥ load +
 * margin, at least minSets online, and N-1 as Σ_{i≠k} maxKw_i·u_i ≥ load for every set k of the section (for a
 * set that is off this row is implied by the balance, so no big-M is needed). Sections with zero load get only
 * the balance row, like the enumeration. Formulation: Wood & Wollenberg, 2nd ed., §5.2 (unit commitment),
 * with the piecewise-linear fuel curves of §3.1; LP syntax: CPLEX LP format as read by HiGHS.
 *
 * Cost: O(N·k) text for N sets of k segments, plus N² terms for N-1. Throws for smooth quadratic curves
 * (convert with chordCurve first) and on the bad input `rankCombinations` rejects.
 *
 * @example buildSinglePointMilp(units, 1200, rule).lp?.startsWith('Minimize') // true
 */
export function buildSinglePointMilp(units: GensetUnit[], demand: Demand, rule: ReserveRule): SinglePointMilp {
  const prepared = prepareUnits(units, 'buildSinglePointMilp');
  for (const p of prepared) {
    if (p.smooth) throw new Error('buildSinglePointMilp requires piecewise fuel curves (convert with chordCurve)');
  }
  const sections = buildSections(prepared, demand, rule);
  const columns: SinglePointMilp['columns'] = [];
  const objective: string[] = [];
  const constraints: string[] = [];
  const bounds: string[] = [];
  const binaries: string[] = [];
  let infeasible = false;
  sections.forEach((section, k) => {
    const members = [...section.fixed, ...section.free];
    if (section.loadKw > 0 && members.length === 0) infeasible = true;
    const balance: string[] = [];
    const capacity: string[] = [];
    const ons: string[] = [];
    for (const p of members) {
      const i = columns.length;
      const on = `u${i}`;
      const segments = p.segments.map((_, j) => `s${i}_${j}`);
      columns.push({ id: p.unit.id, on, segments, minKw: p.minKw });
      binaries.push(on);
      ons.push(on);
      if (p.unit.mustRun) bounds.push(` ${on} = 1`);
      objective.push(term(p.fuelAtMinKgPerH, on));
      if (p.minKw !== 0) balance.push(term(p.minKw, on));
      capacity.push(term(p.maxKw, on));
      p.segments.forEach((s, j) => {
        objective.push(term(s.slopeKgPerKwh, segments[j]));
        balance.push(term(1, segments[j]));
        constraints.push(` seg${i}_${j}: ${term(1, segments[j])} ${term(-s.widthKw, on)} <= 0`);
        bounds.push(` 0 <= ${segments[j]} <= ${s.widthKw}`);
      });
    }
    if (members.length === 0) return;
    constraints.push(` bal${k}: ${row(balance, ons[0])} = ${section.loadKw}`);
    if (section.loadKw <= 0) return;
    constraints.push(` res${k}: ${row(capacity, ons[0])} >= ${section.loadKw + requiredMarginKw(section.loadKw, rule)}`);
    if (rule.minSets > 0) {
      constraints.push(` cnt${k}: ${ons.map((on) => term(1, on)).join(' ')} >= ${rule.minSets}`);
    }
    if (rule.nMinus1) {
      ons.forEach((on, m) => {
        const rest = capacity.filter((_, q) => q !== m);
        constraints.push(` n1_${k}_${m}: ${row(rest, on)} >= ${section.loadKw}`);
      });
    }
  });
  if (infeasible) return { lp: null, columns };
  const lp = [
    'Minimize',
    ` obj: ${objective.join(' ')}`,
    'Subject To',
    ...constraints,
    'Bounds',
    ...bounds,
    'Binaries',
    ` ${binaries.join(' ')}`,
    'End',
    '',
  ].join('\n');
  return { lp, columns };
}

/**
 * Solves the single-period commitment with a HiGHS instance (or any solver with the same `solve`).
 *
 * Cost: one MILP solve (milliseconds for up to about 12 sets). Throws like `buildSinglePointMilp`; an
 * infeasible model is `{ feasible: false, status }`.
 *
 * @example
 * const highs = await loadHighs();
 * solveSinglePointMilp(highs, units, 1200, rule) // { feasible: true, fuelKgPerH: 262.4, onIds: ['DG1', 'DG2'], ... }
 */
export function solveSinglePointMilp(solver: LpSolver | Highs, units: GensetUnit[], demand: Demand, rule: ReserveRule): MilpResult {
  const model = buildSinglePointMilp(units, demand, rule);
  if (model.lp === null) return { feasible: false, status: 'Infeasible' };
  if (model.columns.length === 0) return { feasible: true, fuelKgPerH: 0, onIds: [], loadsKw: {} };
  // HiGHS's own result type is a union over statuses; only an optimal one is read, so the narrow view suffices.
  const solution = (solver as LpSolver).solve(model.lp, EXACT_OPTIONS);
  if (solution.Status !== 'Optimal') return { feasible: false, status: solution.Status };
  const value = (name: string): number => solution.Columns[name]?.Primal ?? 0;
  const onIds: string[] = [];
  const loadsKw: Record<string, number> = {};
  for (const c of model.columns) {
    const on = value(c.on) > 0.5;
    if (on) onIds.push(c.id);
    loadsKw[c.id] = on ? c.minKw + c.segments.reduce((s, name) => s + value(name), 0) : 0;
  }
  return { feasible: true, fuelKgPerH: solution.ObjectiveValue, onIds, loadsKw };
}

export { loadHighs } from '../highs';
import type { Highs } from 'highs';
