/**
 * The voyage plan as a mixed-integer linear programme for HiGHS (npm `highs`, WebAssembly), to certify plans
 * of the decomposition. The only file of the plan solver that solves with `highs` (loaded lazily by optimizer/highs.ts).
 *
 * Formulation (standard three-binary unit commitment; Wood & Wollenberg, Power Generation, Operation and
 * Control, 2nd ed., chapter 5, with the minimum up/down inequalities of Rajan & Takriti, IBM research report
 * RC23628, 2005 — from memory): on/off u binary, start s and stop d in [0, 1] with s − d = u − u(prev),
 * fuel as chord segments x_k ≤ width_k·u above the minimum load.
 */
import type { Highs } from 'highs';
import { unitCostModel, withChordCurves } from './load-sharing';
import { loadGroups, periodCommitments, reserveMarginKw } from './period-options';
import { buildPlan, infeasiblePlan } from './plan-output';
import { infeasiblePeriodsOf, validatePlanProblem } from './plan-voyage';
import type { PlanProblem, VoyagePlan } from './types';
import { loadHighs } from '../highs';
export { loadHighs };

export interface MilpOptions {
  /** HiGHS time limit, s. Default 60. */
  timeLimitS?: number;
  /** Chord segments replacing quadratic curves. Default 5. */
  segments?: number;
  /** HiGHS relative MIP gap. Default 1e-6. */
  mipRelGap?: number;
  /** Relative gap at or below which the plan is called optimal. Default 1e-6. */
  optimalityGap?: number;
  /** A loaded HiGHS instance (else loaded here with a dynamic import). */
  highs?: Highs;
  onProgress?: (fraction: number) => void;
}

export interface MilpModel {
  lp: string;
  /** uName[t][i]: name of the on/off binary of unit i in period t, or null when the unit is unavailable. */
  uName: (string | null)[][];
}

const EPS_H = 1e-9;


function num(x: number): string {
  return Number.isInteger(x) ? String(x) : x.toPrecision(15);
}

class Row {
  terms: string[] = [];
  add(coef: number, name: string): this {
    if (coef !== 0) this.terms.push(`${coef < 0 ? '-' : '+'} ${num(Math.abs(coef))} ${name}`);
    return this;
  }
  text(label: string, sense: string, rhs: number): string {
    const lines: string[] = [];
    for (let i = 0; i < this.terms.length; i += 12) lines.push(this.terms.slice(i, i + 12).join(' '));
    return ` ${label}: ${lines.join('\n   ')} ${sense} ${num(rhs)}`;
  }
}

/**
 * Writes the plan as CPLEX LP text. Curves must be piecewise (use withChordCurves first).
 *
 * Cost: O(T·n·(segments + window)) text. Throws when a curve is not convex or does not cover its range.
 *
 * @example buildPlanMilp(problem).lp.startsWith('Minimize') // true
 */
export function buildPlanMilp(problem: PlanProblem): MilpModel {
  const { units, periods } = problem;
  const n = units.length;
  const models = units.map(unitCostModel);
  const T = periods.length;
  const startH = [0];
  for (const p of periods) startH.push(startH[startH.length - 1] + p.durationH);
  const uName: (string | null)[][] = [];
  const obj = new Row();
  const rows: string[] = [];
  const bounds: string[] = [];
  const binaries: string[] = [];
  let r = 0;
  const push = (row: Row, sense: string, rhs: number) => {
    if (row.terms.length) rows.push(row.text(`r${r++}`, sense, rhs));
    else if ((sense === '>=' && rhs > 1e-9) || (sense === '<=' && rhs < -1e-9) || (sense === '=' && Math.abs(rhs) > 1e-9)) {
      rows.push(` r${r++}: 0 zero ${sense} ${num(rhs)}`);
      bounds.push(' zero = 0');
    }
  };
  for (let t = 0; t < T; t++) {
    const names: (string | null)[] = [];
    for (let i = 0; i < n; i++) names.push(units[i].available ? `u${i}_${t}` : null);
    uName.push(names);
  }
  const init = units.map((u) => problem.initialState?.[u.id] ?? { on: false, hoursInState: Infinity });
  for (let i = 0; i < n; i++) {
    const u = units[i];
    const m = models[i];
    for (let t = 0; t < T; t++) {
      const un = uName[t][i];
      const d = periods[t].durationH;
      if (!un) continue;
      binaries.push(un);
      obj.add(d * m.fuelAtMinKgPerH, un);
      m.widthsKw.forEach((w, k) => {
        const x = `x${i}_${t}_${k}`;
        obj.add(d * m.slopesKgPerKwh[k], x);
        push(new Row().add(1, x).add(-w, un), '<=', 0);
        bounds.push(` 0 <= ${x} <= ${num(w)}`);
      });
      const s = `s${i}_${t}`;
      const dn = `d${i}_${t}`;
      obj.add(u.startCostKg, s);
      bounds.push(` 0 <= ${s} <= 1`, ` 0 <= ${dn} <= 1`);
      const link = new Row().add(1, s).add(-1, dn).add(-1, un);
      const prev = t === 0 ? null : uName[t - 1][i];
      if (prev) link.add(1, prev);
      push(link, '=', t === 0 && init[i].on ? -1 : 0);
      // Minimum up / down windows.
      const up = new Row();
      const down = new Row();
      for (let tau = t; tau >= 0 && startH[t] - startH[tau] < u.minUpH - EPS_H; tau--) up.add(1, `s${i}_${tau}`);
      for (let tau = t; tau >= 0 && startH[t] - startH[tau] < u.minDownH - EPS_H; tau--) down.add(1, `d${i}_${tau}`);
      if (up.terms.length > 1) push(up.add(-1, un), '<=', 0);
      if (down.terms.length > 1) push(down.add(1, un), '<=', 1);
      // Initial state hold, must-run.
      const held = init[i].on ? startH[t] + init[i].hoursInState < u.minUpH - EPS_H : startH[t] + init[i].hoursInState < u.minDownH - EPS_H;
      if (u.mustRun) bounds.push(` ${un} = 1`);
      if (held) push(new Row().add(1, un), '=', init[i].on ? 1 : 0);
    }
    const budget = problem.maxRunningHours?.[u.id];
    if (budget !== undefined && u.available) {
      const row = new Row();
      for (let t = 0; t < T; t++) row.add(periods[t].durationH, uName[t][i]!);
      push(row, '<=', budget);
    }
  }
  for (let t = 0; t < T; t++) {
    const rule = periods[t].rule;
    for (const g of loadGroups(units, periods[t])) {
      const on = g.unitIndices.filter((i) => uName[t][i]);
      const balance = new Row();
      const reserve = new Row();
      const count = new Row();
      for (const i of on) {
        const un = uName[t][i]!;
        balance.add(models[i].minKw, un);
        models[i].widthsKw.forEach((_, k) => balance.add(1, `x${i}_${t}_${k}`));
        reserve.add(models[i].maxKw, un);
        count.add(1, un);
      }
      push(balance, '=', g.loadKw);
      push(reserve, '>=', g.loadKw + reserveMarginKw(rule, g.loadKw));
      push(count, '>=', rule.minSets);
      if (rule.nMinus1 && g.loadKw > 0) {
        for (const j of on) {
          const row = new Row();
          for (const i of on) if (i !== j) row.add(models[i].maxKw, uName[t][i]!);
          row.add(-g.loadKw, uName[t][j]!);
          push(row, '>=', 0);
        }
      }
    }
  }
  const objLines: string[] = [];
  for (let i = 0; i < obj.terms.length; i += 12) objLines.push(obj.terms.slice(i, i + 12).join(' '));
  const lp = ['Minimize', ` obj: ${objLines.join('\n   ') || '0 zero'}`, 'Subject To', ...rows, 'Bounds', ...bounds, 'Binaries', ...binaries, 'End', ''].join('\n');
  return { lp, uName };
}

/**
 * Solves the voyage plan as a MILP with HiGHS on chord-segment curves (quadratics become `segments` chords
 * between minimum and maximum load), within a time limit, and reports the incumbent with HiGHS's proven
 * bound (info mip_dual_bound). The committed sets are re-dispatched exactly on the same chord curves.
 *
 * Cost: HiGHS branch and cut, bounded by timeLimitS. Throws on malformed input; an infeasible model or a
 * time-out without a plan is a result with reasons.
 *
 * @example (await solvePlanMilp(problem, { timeLimitS: 10 })).statusText
 */
export async function solvePlanMilp(problem: PlanProblem, options: MilpOptions = {}): Promise<VoyagePlan> {
  validatePlanProblem(problem, 'solvePlanMilp');
  const progress = options.onProgress ?? (() => undefined);
  progress(0);
  const chord: PlanProblem = { ...problem, units: withChordCurves(problem.units, options.segments ?? 5) };
  const bad = infeasiblePeriodsOf(periodCommitments(chord));
  if (bad.length) return infeasiblePlan(chord, 'highs-milp', bad, []);
  const highs = options.highs ?? (await loadHighs());
  const { lp, uName } = buildPlanMilp(chord);
  progress(0.1);
  const model = highs.createModel({ format: 'lp', data: lp });
  try {
    model.options.set({ output_flag: false, time_limit: options.timeLimitS ?? 60, mip_rel_gap: options.mipRelGap ?? 1e-6 });
    const run = model.run();
    progress(0.95);
    const codes = highs.constants.modelStatus;
    if (run.modelStatus === codes.infeasible) {
      return infeasiblePlan(chord, 'highs-milp', [], ['HiGHS proved the plan infeasible (running-hour budgets or minimum up/down times with the initial state)']);
    }
    const hasSolution = Number(model.info.get('primal_solution_status')) === 2;
    if (!hasSolution) return infeasiblePlan(chord, 'highs-milp', [], [`HiGHS found no plan (status ${run.modelStatus}) within ${options.timeLimitS ?? 60} s`]);
    const values = model.getSolution().colValue;
    const masks = new Int32Array(chord.periods.length);
    uName.forEach((names, t) => names.forEach((name, i) => {
      if (name && values[model.getColByName(name)] > 0.5) masks[t] |= 1 << i;
    }));
    const bound = Number(model.info.get('mip_dual_bound'));
    const plan = buildPlan(chord, masks, 'highs-milp', Number.isFinite(bound) ? bound : null, options.optimalityGap ?? 1e-6);
    progress(1);
    return plan;
  } finally {
    model.dispose();
  }
}
