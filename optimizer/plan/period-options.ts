/**
 * Per-period commitments: every set of running units that meets the period's own rules, with its
 * least-fuel load sharing. Commitments are bit masks over the problem's unit order.
 */
import type { GensetUnit, ReserveRule } from '../plant';
import { shareLoad, unitCostModel, type UnitCostModel } from './load-sharing';
import type { PlanPeriod, PlanProblem } from './types';

export interface PeriodCommitments {
  /** Feasible commitments as bit masks. */
  masks: Int32Array;
  /** Running fuel of each commitment over the period, kg. */
  fuelKg: Float64Array;
  /** Why no commitment is feasible; null when some are. */
  reason: string | null;
}

interface RuleOutcome {
  masks: number[];
  fuelKgPerH: number[];
  reason: string | null;
}

const MAX_UNITS = 16;

/** Sections of the plant in first-seen order, each with its unit indices. */
export function busSections(units: GensetUnit[]): { name: string; unitIndices: number[] }[] {
  const out: { name: string; unitIndices: number[] }[] = [];
  units.forEach((u, i) => {
    let s = out.find((x) => x.name === u.busSection);
    if (!s) out.push((s = { name: u.busSection, unitIndices: [] }));
    s.unitIndices.push(i);
  });
  return out;
}

/** Reserve margin a rule asks for at a load, kW: the larger of the absolute and the percentage margin. */
export function reserveMarginKw(rule: ReserveRule, loadKw: number): number {
  return Math.max(rule.marginKw, (rule.marginPct / 100) * loadKw);
}

function fmtKw(x: number): string {
  return `${Math.round(x * 10) / 10} kW`;
}

/** All commitments of the units in `indices` that carry loadKw under the rule (one bus, or one open section). */
function enumerateSection(
  units: GensetUnit[],
  models: UnitCostModel[],
  indices: number[],
  loadKw: number,
  rule: ReserveRule,
  label: string,
): RuleOutcome {
  const k = indices.length;
  const masks: number[] = [];
  const fuel: number[] = [];
  const tol = 1e-7 * Math.max(1, loadKw);
  const margin = reserveMarginKw(rule, loadKw);
  let stage = -1;
  let availableMaxKw = 0;
  let mustMinKw = 0;
  let availableCount = 0;
  for (const i of indices) {
    if (units[i].available) {
      availableMaxKw += models[i].maxKw;
      availableCount++;
    }
    if (units[i].mustRun) mustMinKw += models[i].minKw;
  }
  for (let sub = 0; sub < 1 << k; sub++) {
    let mask = 0;
    let count = 0;
    let sumMin = 0;
    let sumMax = 0;
    let largestMax = 0;
    let allowed = true;
    const chosen: UnitCostModel[] = [];
    for (let j = 0; j < k; j++) {
      const i = indices[j];
      const on = (sub >> j) & 1;
      if (on ? !units[i].available : units[i].mustRun) {
        allowed = false;
        break;
      }
      if (!on) continue;
      mask |= 1 << i;
      count++;
      sumMin += models[i].minKw;
      sumMax += models[i].maxKw;
      largestMax = Math.max(largestMax, models[i].maxKw);
      chosen.push(models[i]);
    }
    if (!allowed) continue;
    if (count < rule.minSets) continue;
    stage = Math.max(stage, 0);
    if (loadKw < sumMin - tol || loadKw > sumMax + tol) continue;
    stage = Math.max(stage, 1);
    if (sumMax < loadKw + margin - tol) continue;
    stage = Math.max(stage, 2);
    if (rule.nMinus1 && loadKw > tol && sumMax - largestMax < loadKw - tol) continue;
    const share = shareLoad(chosen, loadKw);
    if (!share) continue;
    masks.push(mask);
    fuel.push(share.fuelKgPerH);
  }
  let reason: string | null = null;
  if (masks.length === 0) {
    const L = fmtKw(loadKw);
    if (stage < 0) reason = `${label}only ${availableCount} sets available, the rule needs at least ${rule.minSets} running`;
    else if (stage === 0)
      reason =
        loadKw > availableMaxKw + tol
          ? `${label}load ${L} exceeds the maximum continuous capacity ${fmtKw(availableMaxKw)} of the available sets`
          : loadKw < mustMinKw - tol
            ? `${label}load ${L} is below the minimum load ${fmtKw(mustMinKw)} of the sets that must run`
            : `${label}no combination of available sets can carry ${L} between their minimum and maximum loads`;
    else if (stage === 1) reason = `${label}no combination of available sets carries ${L} with the reserve margin of ${fmtKw(margin)}`;
    else reason = `${label}no combination of available sets carries ${L} with N-1 (losing the largest running set)`;
  }
  return { masks, fuelKgPerH: fuel, reason };
}

/**
 * Enumerates, for every period, the commitments that meet that period's rules (availability, must-run,
 * minimum sets, minimum and maximum loads, reserve margin, N-1, bus sections) and dispatches each exactly.
 * Periods with the same load and rule share one enumeration.
 *
 * Cost: O(P_distinct · 2^n · dispatch) time; O(T · feasible commitments) memory. Throws when there are more
 * than 16 units or a fuel curve is not convex; an infeasible period gets a reason instead.
 *
 * @example periodCommitments(problem)[0].masks // Int32Array of feasible commitments in period 1
 */
export function periodCommitments(problem: PlanProblem): PeriodCommitments[] {
  const { units, periods } = problem;
  if (units.length > MAX_UNITS) throw new Error(`periodCommitments supports at most ${MAX_UNITS} units`);
  const models = units.map(unitCostModel);
  const cache = new Map<string, RuleOutcome>();
  return periods.map((period) => {
    const key = periodKey(period, units);
    let outcome = cache.get(key);
    if (!outcome) {
      outcome = enumeratePeriod(units, models, period);
      cache.set(key, outcome);
    }
    const fuelKg = new Float64Array(outcome.fuelKgPerH.length);
    outcome.fuelKgPerH.forEach((f, j) => (fuelKg[j] = f * period.durationH));
    return { masks: Int32Array.from(outcome.masks), fuelKg, reason: outcome.reason };
  });
}

function periodKey(p: PlanPeriod, units: GensetUnit[]): string {
  const r = p.rule;
  const loads = loadGroups(units, p).map((g) => g.loadKw).join(',');
  return `${r.busTieClosed ? 'C' : 'O'}|${loads}|${r.marginKw}|${r.marginPct}|${r.minSets}|${r.nMinus1}`;
}

/**
 * The load groups of a period: one group with every unit when the bus tie is closed, else one per bus
 * section with that section's load (a plant with a single section uses loadKw when no section load is given).
 *
 * Cost: O(units). Does not throw.
 *
 * @example loadGroups(units, period).map((g) => g.loadKw) // [1200] with the tie closed
 */
export function loadGroups(units: GensetUnit[], period: PlanPeriod): { name: string; loadKw: number; unitIndices: number[] }[] {
  if (period.rule.busTieClosed) return [{ name: '', loadKw: period.loadKw, unitIndices: units.map((_, i) => i) }];
  const sections = busSections(units);
  return sections.map((s) => ({
    name: s.name,
    loadKw: period.sectionLoadsKw?.[s.name] ?? (sections.length === 1 ? period.loadKw : 0),
    unitIndices: s.unitIndices,
  }));
}

function enumeratePeriod(units: GensetUnit[], models: UnitCostModel[], period: PlanPeriod): RuleOutcome {
  const groups = loadGroups(units, period);
  let combined: RuleOutcome = { masks: [0], fuelKgPerH: [0], reason: null };
  const reasons: string[] = [];
  for (const g of groups) {
    const label = groups.length > 1 ? `section ${g.name}: ` : '';
    const part = enumerateSection(units, models, g.unitIndices, g.loadKw, period.rule, label);
    if (part.reason) reasons.push(part.reason);
    const masks: number[] = [];
    const fuel: number[] = [];
    combined.masks.forEach((m, a) => part.masks.forEach((pm, b) => {
      masks.push(m | pm);
      fuel.push(combined.fuelKgPerH[a] + part.fuelKgPerH[b]);
    }));
    combined = { masks, fuelKgPerH: fuel, reason: null };
  }
  return reasons.length ? { masks: [], fuelKgPerH: [], reason: reasons.join('; ') } : combined;
}

/**
 * Least-fuel loads of one commitment in one period (the loads the plan reports).
 *
 * Cost: one exact dispatch per load group. Returns null when the commitment cannot carry the load.
 *
 * @example commitmentLoads(units, models, period, 0b11)!.loadsKw // loads of units 1 and 2, others 0
 */
export function commitmentLoads(units: GensetUnit[], models: UnitCostModel[], period: PlanPeriod, mask: number): { loadsKw: number[]; fuelKgPerH: number } | null {
  const loadsKw = new Array<number>(units.length).fill(0);
  let fuel = 0;
  for (const g of loadGroups(units, period)) {
    const on = g.unitIndices.filter((i) => (mask >> i) & 1);
    const share = shareLoad(on.map((i) => models[i]), g.loadKw);
    if (!share) return null;
    on.forEach((i, j) => (loadsKw[i] = share.loadsKw[j]));
    fuel += share.fuelKgPerH;
  }
  return { loadsKw, fuelKgPerH: fuel };
}
