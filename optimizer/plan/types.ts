/**
 * Types of a voyage plan: unit commitment and load sharing over many periods.
 *
 * Conventions used by every solver, the checker and the baseline in this folder:
 * - A period starts at the sum of the durations before it (hours from the plan start).
 * - Online capacity for the reserve margin and for N-1 is the sum of the maximum continuous loads
 *   (maxLoadPct of rating) of the running sets, as in optimizer/dispatch.
 * - A set that starts in period t must stay on in every period that starts less than minUpH after the
 *   start of period t; the same for stops and minDownH. The initial state counts: a set that has been on
 *   for hoursInState h must stay on in every period that starts before minUpH − h.
 * - A start (off in the period before, or in the initial state, and on now) burns startCostKg.
 */
import type { GensetUnit, ReserveRule } from '../plant';

export interface PlanPeriod {
  durationH: number;
  rule: ReserveRule;
  /** Total electrical load, kW. Used when the bus tie is closed. */
  loadKw: number;
  /** Load per bus section, kW, used when the bus tie is open (missing sections carry 0 kW). */
  sectionLoadsKw?: Record<string, number>;
}

export interface InitialUnitState {
  on: boolean;
  /** Hours the set has been in that state before the plan starts. */
  hoursInState: number;
}

export interface PlanProblem {
  units: GensetUnit[];
  periods: PlanPeriod[];
  /** By unit id. A unit without an entry starts off and free to start. */
  initialState?: Record<string, InitialUnitState>;
  /** Running-hour budget per unit id over the whole plan, h. A unit without an entry is unlimited. */
  maxRunningHours?: Record<string, number>;
}

export interface PlannedPeriod {
  /** Ids of the running sets. */
  runningIds: string[];
  /** Load of every unit in problem order, kW (0 when off). */
  loadsKw: number[];
  /** Fuel burned while running in this period, kg (start fuel not included). */
  fuelKg: number;
}

export interface UnitPlanTotals {
  unitId: string;
  starts: number;
  runningHours: number;
  /** Running-hour budget, h; null when unlimited. */
  budgetH: number | null;
}

export interface InfeasiblePeriod {
  index: number;
  reason: string;
}

export type PlanStatus = 'optimal' | 'within-gap' | 'best-found' | 'infeasible';

export interface VoyagePlan {
  solver: 'decomposition' | 'highs-milp' | 'baseline';
  status: PlanStatus;
  /** "optimal", "within 0.03 % of the lower bound", "best found" or "infeasible: ...". */
  statusText: string;
  /** One entry per period; empty when the plan is infeasible. */
  periods: PlannedPeriod[];
  runningFuelKg: number;
  startFuelKg: number;
  /** runningFuelKg + startFuelKg. */
  totalFuelKg: number;
  units: UnitPlanTotals[];
  /** A proven lower bound on the optimal total fuel, kg; null when none is known. */
  lowerBoundKg: number | null;
  /** 100·(total − lowerBound)/total; null when no lower bound is known. */
  gapPct: number | null;
  infeasiblePeriods: InfeasiblePeriod[];
  /** Plan-wide reasons (running-hour budgets, minimum up/down times with the initial state). */
  reasons: string[];
}

export interface PlanOptions {
  /** Called with a fraction in [0, 1] as the solve progresses. */
  onProgress?: (fraction: number) => void;
  /** Relative gap at or below which a plan is called optimal. Default 1e-6. */
  optimalityGap?: number;
  /** Subgradient iterations for the running-hour prices. Default 40. */
  maxPriceIterations?: number;
  /** Most labels per period in the exact budget-tracking pass before it gives up. Default 40000. */
  maxLabelsPerPeriod?: number;
  /** Most label extensions of a budget-tracking pass (repair beams and the exact pass) in total. Default 4e6. */
  maxLabelWork?: number;
  /**
   * The budget-tracking beams beyond the first and the exact pass run only when the plan has at most this
   * many commitments summed over its periods. Default 8000 (a week of hourly periods with ~50 options each).
   */
  exactPassMaxTransitions?: number;
  /** Most DP states per period before the plan stops being exact (beam). Default 200000. */
  maxStatesPerPeriod?: number;
}
