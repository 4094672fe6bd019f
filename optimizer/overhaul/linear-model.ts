/**
 * A small mixed-integer linear model held as plain data, written out for two solvers: javascript-lp-solver's JSON
 * model (the default solve, exact on small models) and CPLEX LP text for HiGHS (the server's solve, whose time limit
 * holds inside the solver; also the independent check in tests).
 */
import type { Highs } from 'highs';
import solver, { type SolveResult } from 'javascript-lp-solver';

export interface LinearColumn {
  name: string;
  /** Objective coefficient (minimised). */
  cost: number;
  lower: number;
  upper: number;
  binary: boolean;
}

export interface LinearRow {
  name: string;
  terms: [column: string, coefficient: number][];
  sense: '<=' | '>=' | '=';
  rhs: number;
}

export interface LinearModel {
  columns: LinearColumn[];
  rows: LinearRow[];
}

/** timedOut: the time limit ended the search, so a solution is the best found, not proven optimal (or none found). */
export type LinearSolution =
  | { feasible: true; objective: number; values: Record<string, number>; timedOut?: boolean }
  | { feasible: false; timedOut?: boolean };

/**
 * The model in CPLEX LP format (as HiGHS reads it): Minimize, Subject To, Bounds, Binary, End.
 *
 * Cost O(size of the model).
 *
 * @example linearModelToLp({ columns: [{ name: 'x', cost: 1, lower: 2, upper: 5, binary: false }], rows: [] })
 *   // 'Minimize\n obj: + 1 x\nSubject To\nBounds\n 2 <= x <= 5\nEnd\n'
 */
export function linearModelToLp(model: LinearModel): string {
  const term = (coefficient: number, column: string): string => `${coefficient < 0 ? '-' : '+'} ${Math.abs(coefficient)} ${column}`;
  const objective = model.columns.filter((c) => c.cost !== 0).map((c) => term(c.cost, c.name));
  const lines = ['Minimize', ` obj: ${objective.length > 0 ? objective.join(' ') : `+ 0 ${model.columns[0]?.name ?? 'x'}`}`, 'Subject To'];
  for (const r of model.rows) {
    if (r.terms.length === 0) continue;
    lines.push(` ${r.name}: ${r.terms.map(([c, a]) => term(a, c)).join(' ')} ${r.sense} ${r.rhs}`);
  }
  lines.push('Bounds');
  for (const c of model.columns) lines.push(` ${c.lower} <= ${c.name} <= ${c.upper}`);
  const binaries = model.columns.filter((c) => c.binary).map((c) => c.name);
  if (binaries.length > 0) lines.push('Binary', ...binaries.map((b) => ` ${b}`));
  lines.push('End', '');
  return lines.join('\n');
}

/**
 * Solves the model with javascript-lp-solver (simplex with branch and bound; relative MIP gap 0, so the optimum is
 * exact to the solver's feasibility tolerance). Bounds other than [0, 1] of binaries become rows.
 *
 * Cost: exponential in the number of binaries in the worst case; timeLimitMs (javascript-lp-solver's timeout)
 * bounds it, and a search it cuts short says timedOut. Never throws for an infeasible model (feasible: false).
 *
 * @example solveLinearModel({ columns: [{ name: 'x', cost: 1, lower: 2, upper: 5, binary: false }], rows: [] })
 *   // { feasible: true, objective: 2, values: { x: 2 } }
 */
export function solveLinearModel(model: LinearModel, options: { timeLimitMs?: number } = {}): LinearSolution {
  const variables: Record<string, Record<string, number>> = {};
  const constraints: Record<string, { min?: number; max?: number; equal?: number }> = {};
  const binaries: Record<string, 1> = {};
  for (const c of model.columns) {
    variables[c.name] = { objective: c.cost };
    if (c.binary) binaries[c.name] = 1;
    else {
      constraints[`bound_${c.name}`] = c.upper === Infinity ? { min: c.lower } : { min: c.lower, max: c.upper };
      variables[c.name][`bound_${c.name}`] = 1;
    }
  }
  for (const r of model.rows) {
    if (r.terms.length === 0) continue;
    constraints[r.name] = r.sense === '=' ? { equal: r.rhs } : r.sense === '<=' ? { max: r.rhs } : { min: r.rhs };
    for (const [column, coefficient] of r.terms) variables[column][r.name] = (variables[column][r.name] ?? 0) + coefficient;
  }
  const started = Date.now();
  const limit = options.timeLimitMs;
  const result = solver.Solve({ optimize: 'objective', opType: 'min', constraints, variables, binaries, options: { tolerance: 0, ...(limit ? { timeout: limit } : {}) } }) as SolveResult;
  const timedOut = limit !== undefined && Date.now() - started >= limit;
  if (!result.feasible) return { feasible: false, timedOut };
  const values: Record<string, number> = {};
  for (const c of model.columns) {
    const v = result[c.name];
    values[c.name] = typeof v === 'number' ? v : 0;
  }
  const objective = model.columns.reduce((s, c) => s + c.cost * values[c.name], 0);
  return { feasible: true, objective, values, timedOut };
}

/** What highsSolver needs of a HiGHS instance (npm `highs`, loaded by optimizer/highs.ts). */
export interface HighsLike {
  solve(lp: string, options?: Record<string, unknown>): { Status: string; ObjectiveValue?: number; Columns?: Record<string, { Primal?: number }> };
}

/**
 * A solve function for proposeHourBudgets backed by HiGHS, whose time limit is enforced inside the solver (the
 * javascript-lp-solver search checks its limit only between steps and can run far past it on long horizons).
 * A search cut short by the limit returns its best plan with `timedOut: true`, or infeasible with `timedOut: true`.
 *
 * Cost: one MILP solve, at most about `timeLimitMs`. Never throws for an infeasible model.
 *
 * @example proposeHourBudgets(input, { solve: highsSolver(await loadHighs(), 5000) })
 */
export function highsSolver(highs: HighsLike | Highs, timeLimitMs = 10_000): (model: LinearModel) => LinearSolution {
  return (model) => {
    // HiGHS's own result type is a union over statuses; the narrow view reads what every status has.
    const result = (highs as HighsLike).solve(linearModelToLp(model), {
      output_flag: false,
      time_limit: timeLimitMs / 1000,
      mip_rel_gap: 1e-9,
      primal_feasibility_tolerance: 1e-9,
      mip_feasibility_tolerance: 1e-9,
    });
    const timedOut = result.Status === 'Time limit reached';
    const columns = result.Columns ?? {};
    const hasSolution = Number.isFinite(result.ObjectiveValue) && Object.keys(columns).length > 0;
    if (result.Status === 'Optimal' || (timedOut && hasSolution)) {
      const values: Record<string, number> = {};
      for (const c of model.columns) values[c.name] = columns[c.name]?.Primal ?? 0;
      return { feasible: true, objective: result.ObjectiveValue as number, values, ...(timedOut ? { timedOut } : {}) };
    }
    return timedOut ? { feasible: false, timedOut } : { feasible: false };
  };
}
