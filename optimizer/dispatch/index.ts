// Public API of the single-operating-point recommendation (the lead wires this into optimizer/index.ts).
export { dispatchLoad, equalSplit } from './economic-dispatch';
export type {
  DispatchFailureRule,
  DispatchFeasible,
  DispatchInfeasible,
  DispatchOptions,
  DispatchResult,
  UnitLoad,
} from './economic-dispatch';
export { rankCombinations, requiredMarginKw } from './combinations';
export type {
  CombinationRule,
  Demand,
  RankedCombination,
  RankFeasible,
  RankInfeasible,
  RankOptions,
  RankResult,
  RejectedCombination,
  SectionDispatch,
  UnitReason,
} from './combinations';
export { buildSinglePointMilp, solveSinglePointMilp } from './milp';
export type { LpSolver, MilpResult, SinglePointMilp } from './milp';
export { operatingGuideline } from './guideline';
export type { GuidelineAlternative, GuidelineBand, GuidelineGap, GuidelineOptions, OperatingGuideline } from './guideline';
