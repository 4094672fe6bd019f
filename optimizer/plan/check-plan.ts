/**
 * Independent checker of a voyage plan: re-verifies every constraint from the problem alone and recomputes
 * the fuel with the plant's own curve evaluation. Shares no code with the solvers of this folder.
 */
import { curveFuelKgPerH, maxLoadKw, minLoadKw } from '../plant';
import type { PlanProblem, VoyagePlan } from './types';

export interface PlanCheck {
  feasible: boolean;
  violations: string[];
  runningFuelKg: number;
  startFuelKg: number;
  totalFuelKg: number;
  starts: number[];
  runningHours: number[];
}

export interface CheckTolerances {
  /** Relative tolerance on loads and capacities (× max(1, load)). Default 1e-6. */
  loadRel?: number;
  /** Relative tolerance between reported and recomputed fuel. Default 1e-6. */
  fuelRel?: number;
}

/**
 * Re-verifies a plan against its problem: sets available / must run, loads within minimum and maximum,
 * load balance per load group (whole bus or each open section), reserve margin on maximum continuous
 * capacity, minimum sets, N-1, minimum up and down times with the initial state, running-hour budgets;
 * recomputes running fuel (curveFuelKgPerH × duration), starts and start fuel, and compares them with the
 * plan's totals.
 *
 * Cost: O(T·n). Does not throw; every finding is a violation string.
 *
 * @example checkPlan(problem, planVoyage(problem)).feasible // true
 */
export function checkPlan(problem: PlanProblem, plan: VoyagePlan, tol: CheckTolerances = {}): PlanCheck {
  const loadRel = tol.loadRel ?? 1e-6;
  const fuelRel = tol.fuelRel ?? 1e-6;
  const { units, periods } = problem;
  const n = units.length;
  const v: string[] = [];
  const starts = new Array<number>(n).fill(0);
  const runningHours = new Array<number>(n).fill(0);
  const result = (runningFuelKg: number, startFuelKg: number): PlanCheck => ({
    feasible: v.length === 0,
    violations: v,
    runningFuelKg,
    startFuelKg,
    totalFuelKg: runningFuelKg + startFuelKg,
    starts,
    runningHours,
  });
  if (plan.status === 'infeasible') {
    v.push('the plan has no schedule (infeasible)');
    return result(0, 0);
  }
  if (plan.periods.length !== periods.length) {
    v.push(`the plan has ${plan.periods.length} periods, the problem ${periods.length}`);
    return result(0, 0);
  }
  const on: boolean[] = units.map((u) => problem.initialState?.[u.id]?.on ?? false);
  const sinceSwitchH: number[] = units.map((u) => problem.initialState?.[u.id]?.hoursInState ?? Infinity);
  let runningFuelKg = 0;
  let startFuelKg = 0;
  const sections = [...new Set(units.map((u) => u.busSection))];
  periods.forEach((p, t) => {
    const pp = plan.periods[t];
    const where = `period ${t + 1}`;
    const running = units.map((u) => pp.runningIds.includes(u.id));
    for (const id of pp.runningIds) if (!units.some((u) => u.id === id)) v.push(`${where}: unknown set ${id} running`);
    let periodFuel = 0;
    units.forEach((u, i) => {
      const load = pp.loadsKw[i] ?? NaN;
      const lt = loadRel * Math.max(1, maxLoadKw(u));
      if (running[i]) {
        if (!u.available) v.push(`${where}: ${u.id} runs but is not available`);
        if (!(load >= minLoadKw(u) - lt && load <= maxLoadKw(u) + lt)) v.push(`${where}: ${u.id} at ${load} kW outside ${minLoadKw(u)} to ${maxLoadKw(u)} kW`);
        else periodFuel += curveFuelKgPerH(u.curve, Math.min(maxLoadKw(u), Math.max(minLoadKw(u), load))) * p.durationH;
        runningHours[i] += p.durationH;
      } else {
        if (u.mustRun) v.push(`${where}: ${u.id} must run but is off`);
        if (Math.abs(load) > lt) v.push(`${where}: ${u.id} is off but carries ${load} kW`);
      }
      // Minimum up / down: a change of state needs the time in the old state.
      if (running[i] !== on[i]) {
        const need = on[i] ? u.minUpH : u.minDownH;
        if (sinceSwitchH[i] < need - 1e-9) v.push(`${where}: ${u.id} ${on[i] ? 'stops' : 'starts'} after ${sinceSwitchH[i]} h, minimum ${on[i] ? 'up' : 'down'} time is ${need} h`);
        if (running[i]) {
          starts[i]++;
          startFuelKg += u.startCostKg;
        }
        on[i] = running[i];
        sinceSwitchH[i] = 0;
      }
      sinceSwitchH[i] += p.durationH;
    });
    runningFuelKg += periodFuel;
    if (Math.abs(periodFuel - pp.fuelKg) > fuelRel * Math.max(1, periodFuel)) v.push(`${where}: reported fuel ${pp.fuelKg} kg, recomputed ${periodFuel} kg`);
    // Load groups: whole bus with the tie closed, else each section.
    const groups = p.rule.busTieClosed
      ? [{ name: 'bus', load: p.loadKw, members: units.map((_, i) => i) }]
      : sections.map((s) => ({
          name: `section ${s}`,
          load: p.sectionLoadsKw?.[s] ?? (sections.length === 1 ? p.loadKw : 0),
          members: units.map((u, i) => (u.busSection === s ? i : -1)).filter((i) => i >= 0),
        }));
    for (const g of groups) {
      const lt = loadRel * Math.max(1, g.load);
      const runningMembers = g.members.filter((i) => running[i]);
      const carried = g.members.reduce((a, i) => a + (running[i] ? pp.loadsKw[i] : 0), 0);
      if (Math.abs(carried - g.load) > lt) v.push(`${where}, ${g.name}: sets carry ${carried} kW, load is ${g.load} kW`);
      const capacity = runningMembers.reduce((a, i) => a + maxLoadKw(units[i]), 0);
      const margin = Math.max(p.rule.marginKw, (p.rule.marginPct / 100) * g.load);
      if (capacity < g.load + margin - lt) v.push(`${where}, ${g.name}: online capacity ${capacity} kW below load plus margin ${g.load + margin} kW`);
      if (runningMembers.length < p.rule.minSets) v.push(`${where}, ${g.name}: ${runningMembers.length} sets running, minimum ${p.rule.minSets}`);
      if (p.rule.nMinus1 && g.load > lt) {
        const largest = Math.max(0, ...runningMembers.map((i) => maxLoadKw(units[i])));
        if (capacity - largest < g.load - lt) v.push(`${where}, ${g.name}: N-1 not met (${capacity - largest} kW left for ${g.load} kW)`);
      }
    }
  });
  units.forEach((u, i) => {
    const budget = problem.maxRunningHours?.[u.id];
    if (budget !== undefined && runningHours[i] > budget + 1e-9) v.push(`${u.id} runs ${runningHours[i]} h, budget ${budget} h`);
    const reported = plan.units.find((x) => x.unitId === u.id);
    if (!reported || reported.starts !== starts[i] || Math.abs(reported.runningHours - runningHours[i]) > 1e-9) v.push(`${u.id}: reported starts/hours differ from the schedule`);
  });
  const totalFuelKg = runningFuelKg + startFuelKg;
  if (Math.abs(totalFuelKg - plan.totalFuelKg) > fuelRel * Math.max(1, totalFuelKg)) v.push(`reported total ${plan.totalFuelKg} kg, recomputed ${totalFuelKg} kg`);
  return result(runningFuelKg, startFuelKg);
}
