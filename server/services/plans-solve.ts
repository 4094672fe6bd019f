/**
 * A voyage plan from its stored inputs, with no database access, so the worker thread can run it: the
 * optimizer problem (buildPlanProblem), the plan (optimizer/plan planVoyage), the baseline a power management
 * system would run (baselinePlan with the vessel's thresholds), the independent check (checkPlan), CO2
 * (optimizer/fuel co2Kg, MEPC.364(79) factors, the vessel's main grade) and hours left to each overhaul.
 */
import { co2Kg, FUEL_GRADES, type FuelGrade } from '../../optimizer/fuel/index';
import { baselinePlan, checkPlan, planVoyage, type PlanPeriod, type PlanProblem } from '../../optimizer/plan/index';
import type { OperatingModeName, OperatingRuleInput, PlantUnit } from '../../shared/schemas/recommendations';
import type { PlanResult, ProfilePeriod } from '../../shared/schemas/plans';
import { toGensetUnit } from './plant-model';

/** Everything a plan depends on, stored in voyage_plans.inputs; a re-solve reads only this. */
export interface StoredPlanInputs {
  version: 1;
  profileSource: 'typed' | 'csv' | 'history';
  profile: ProfilePeriod[];
  units: PlantUnit[];
  rules: Record<OperatingModeName, OperatingRuleInput>;
  hourBudgetsH: Record<string, number>;
  budgetSource: 'typed' | 'approved_overhaul_plan' | 'none';
  pmsThresholds: { startAbovePct: number; stopBelowPct: number };
  fuelGrade: string;
  maintenance: { gensetId: string; kind: string; intervalHours: number; hoursLeftAtStartH: number | null }[];
  resolvedFrom: string | null;
}

/** Load per section of a period: as given, else the plant load shared in proportion to available capacity. */
function sectionLoads(period: ProfilePeriod, units: PlantUnit[]): Record<string, number> | undefined {
  if (period.sectionLoadsKw) return period.sectionLoadsKw;
  const cap = new Map<string, number>();
  for (const u of units) if (u.available) cap.set(u.busSection, (cap.get(u.busSection) ?? 0) + (u.ratedKw * u.maxLoadPct) / 100);
  if (cap.size <= 1) return undefined;
  const total = [...cap.values()].reduce((s, x) => s + x, 0);
  return Object.fromEntries([...cap.entries()].map(([k, v]) => [k, (period.loadKw * v) / total]));
}

/** The optimizer problem of stored inputs (same inputs, same problem). All sets start off and free to start. */
export function buildPlanProblem(inputs: StoredPlanInputs): PlanProblem {
  const periods: PlanPeriod[] = inputs.profile.map((p) => {
    const rule = inputs.rules[p.mode];
    const sections = rule.busTieClosed ? undefined : sectionLoads(p, inputs.units);
    const loadKw = sections ? Object.values(sections).reduce((s, x) => s + x, 0) : p.loadKw;
    return { durationH: p.durationH, rule: { ...rule }, loadKw, ...(sections ? { sectionLoadsKw: sections } : {}) };
  });
  const budgets = Object.fromEntries(Object.entries(inputs.hourBudgetsH).filter(([id]) => inputs.units.some((u) => u.gensetId === id)));
  return { units: inputs.units.map(toGensetUnit), periods, maxRunningHours: budgets };
}

function gradeOf(grade: string): FuelGrade | null {
  return (FUEL_GRADES as readonly string[]).includes(grade) ? (grade as FuelGrade) : null;
}

/**
 * Solves stored plan inputs. Deterministic: the same inputs give the same result (no clock, no randomness).
 * Throws only on malformed inputs (the optimizer's messages); an infeasible plan is a result with reasons.
 */
export function solveStoredPlan(inputs: StoredPlanInputs, onProgress: (fraction: number) => void = () => undefined): Omit<PlanResult, 'solveMs'> {
  const problem = buildPlanProblem(inputs);
  const plan = planVoyage(problem, { onProgress: (f) => onProgress(0.95 * f) });
  const baseline = baselinePlan(problem, inputs.pmsThresholds);
  onProgress(0.98);
  const check = checkPlan(problem, plan);
  const grade = gradeOf(inputs.fuelGrade);
  const co2 = (kg: number) => (grade ? co2Kg(kg, grade) : 0);
  const startH: number[] = [];
  inputs.profile.reduce((t, p) => (startH.push(t), t + p.durationH), 0);
  const feasible = plan.status !== 'infeasible';
  const baselineFeasible = baseline.status !== 'infeasible';
  const totals = new Map(plan.units.map((u) => [u.unitId, u]));
  const baseTotals = new Map(baseline.units.map((u) => [u.unitId, u]));
  const saving = feasible && baselineFeasible ? baseline.totalFuelKg - plan.totalFuelKg : null;
  return {
    solver: plan.solver,
    status: plan.status,
    statusText: plan.statusText,
    gapPct: plan.gapPct,
    lowerBoundKg: plan.lowerBoundKg,
    totalFuelKg: plan.totalFuelKg,
    runningFuelKg: plan.runningFuelKg,
    startFuelKg: plan.startFuelKg,
    co2Kg: co2(plan.totalFuelKg),
    fuelGrade: grade ?? `${inputs.fuelGrade} (no carbon factor: CO2 shown as 0)`,
    periods: plan.periods.map((pp, t) => ({
      startH: startH[t],
      durationH: inputs.profile[t].durationH,
      mode: inputs.profile[t].mode,
      loadKw: problem.periods[t].loadKw,
      runningIds: pp.runningIds,
      loadsKw: pp.loadsKw,
      fuelKg: pp.fuelKg,
    })),
    units: inputs.units.map((u) => {
      const t = totals.get(u.gensetId);
      const hours = t?.runningHours ?? 0;
      return {
        gensetId: u.gensetId,
        designation: u.designation,
        starts: t?.starts ?? 0,
        runningHours: hours,
        budgetH: t?.budgetH ?? null,
        baselineRunningHours: baselineFeasible ? (baseTotals.get(u.gensetId)?.runningHours ?? 0) : null,
        maintenance: inputs.maintenance
          .filter((m) => m.gensetId === u.gensetId)
          .map((m) => ({
            kind: m.kind,
            intervalHours: m.intervalHours,
            hoursLeftAtStartH: m.hoursLeftAtStartH,
            hoursLeftAtEndH: m.hoursLeftAtStartH === null || !feasible ? null : m.hoursLeftAtStartH - hours,
          })),
      };
    }),
    baseline: {
      totalFuelKg: baselineFeasible ? baseline.totalFuelKg : null,
      co2Kg: baselineFeasible ? co2(baseline.totalFuelKg) : null,
      statusText: baseline.statusText,
      starts: baselineFeasible ? baseline.units.reduce((s, u) => s + u.starts, 0) : null,
    },
    savingFuelKg: saving,
    savingPct: saving !== null && baseline.totalFuelKg > 0 ? (100 * saving) / baseline.totalFuelKg : null,
    savingCo2Kg: saving !== null ? co2(baseline.totalFuelKg) - co2(plan.totalFuelKg) : null,
    check: { feasible: check.feasible, violations: check.violations.slice(0, 50) },
    infeasibleReasons: [
      ...plan.infeasiblePeriods.map((p) => `period ${p.index + 1} (from ${startH[p.index]} h): ${p.reason}`),
      ...plan.reasons,
    ],
  };
}
