// Public API of the voyage plan (many periods: unit commitment and load sharing). The lead wires this into
// optimizer/index.ts.
export { planVoyage, validatePlanProblem } from './plan-voyage';
export { solvePlanMilp, buildPlanMilp } from './plan-milp';
export type { MilpModel, MilpOptions } from './plan-milp';
export { checkPlan } from './check-plan';
export type { CheckTolerances, PlanCheck } from './check-plan';
export { baselinePlan } from './baseline-plan';
export type { PmsThresholds } from './baseline-plan';
export { withChordCurves, shareLoad, unitCostModel } from './load-sharing';
export type { LoadShare, UnitCostModel } from './load-sharing';
export { randomPlanProblem } from './random-problem';
export type { RandomPlanOptions } from './random-problem';
export type {
  InfeasiblePeriod,
  InitialUnitState,
  PlanOptions,
  PlanPeriod,
  PlanProblem,
  PlanStatus,
  PlannedPeriod,
  UnitPlanTotals,
  VoyagePlan,
} from './types';
