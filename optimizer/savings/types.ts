/**
 * Inputs and results of the savings computations: what was burned against what the recommendation would have
 * burned, per logged day, costed with the same fitted curves.
 *
 * Fuel conventions: the fitted curves give fuel at the ISO 3046-1 reference LCV (42 700 kJ/kg). Every fuel mass in
 * the results ("fuelKg", "t") is mass of the grade burned that day: ISO fuel × 42 700 / LCV of the lot (factor 1
 * when the day gives no LCV). Measured fuel is that mass as logged (at 15 °C, in vacuum).
 */
import type { FuelGrade, ResidualLotProperties } from '../fuel/index';
import type { GensetUnit, OperatingMode, ReserveRule } from '../plant';

/** What a fit contributes: the curve and the covariance of (a, b, c) with its residual degrees of freedom. */
export interface CurveUncertainty {
  curve: { kind: 'quadratic'; a: number; b: number; c: number };
  /** Covariance of (a, b, c), order a, b, c (kg/h, kg/h/kW, kg/h/kW² units). */
  covariance: number[][];
  /** Residual degrees of freedom of the fit; Infinity or absent: the covariance is taken as known. */
  dof?: number;
}

/** The fuel the gensets burned on a day. */
export interface DayFuel {
  grade: FuelGrade;
  /** LCV of the lot, kJ/kg; absent: 42 700 (modelled ISO fuel is taken as mass burned). */
  lcvKjPerKg?: number;
  /** Viscosity or density of a residual blend, for its MEPC.364(79) fuel type. */
  lot?: ResidualLotProperties;
}

/** One set on one logged day: what was done. */
export interface ActualSetDay {
  unitId: string;
  hoursRun: number;
  kwh: number;
  /** Logged fuel, kg (mass at 15 °C); absent when not metered per set. */
  measuredFuelKg?: number;
}

/** One logged day of a vessel. */
export interface SavingsDay {
  /** ISO date, YYYY-MM-DD. */
  date: string;
  /** Hours in each operating mode with the gensets running (shore-power hours are not a mode here). */
  modeHours: Partial<Record<OperatingMode, number>>;
  /**
   * Optional average plant load per mode, kW, when logged. Used as the shape of the day's load: scaled by one
   * factor so that Σ load × hours equals the day's metered energy. Absent: every mode at the day's average load.
   */
  modeLoadsKw?: Partial<Record<OperatingMode, number>>;
  sets: ActualSetDay[];
  fuel: DayFuel;
  /** Sets not available that day (maintenance, defect); the recommendation does not use them. */
  unavailableUnitIds?: string[];
}

export interface SavingsInput {
  /** The vessel's gensets; curves are replaced by `fits[id].curve` where a fit is given. */
  units: GensetUnit[];
  /** Fitted curve with covariance per unit id. A unit without one counts as a known curve (no uncertainty). */
  fits?: Record<string, CurveUncertainty>;
  /** One reserve rule per operating mode the days use. */
  rules: Partial<Record<OperatingMode, ReserveRule>>;
  days: SavingsDay[];
}

/** Fuel sensitivity of a fixed operation: ∂fuel/∂(a, b, c) of each unit, i.e. Σ h·(1, P, P²) over its hours. */
export type FuelSensitivity = Record<string, [number, number, number]>;

export interface SavingsInterval {
  level: number;
  /** Point estimate the interval is centred on (delta method) or the sampled median (sampling), kg. */
  estimateKg: number;
  sdKg: number;
  lowerKg: number;
  upperKg: number;
  /** Welch–Satterthwaite effective degrees of freedom (delta method); Infinity when the curves are known. */
  effectiveDof: number;
  method: 'delta' | 'sampling';
}

/** One set on one day, as costed. */
export interface ActualSetResult {
  unitId: string;
  hoursRun: number;
  kwh: number;
  /** kwh / hoursRun; 0 when the set did not run. */
  loadKw: number;
  loadPct: number;
  modelledFuelKg: number;
  measuredFuelKg: number | null;
  /** Hours run with the daily average load below the set's minimum load (all hours of such a day, else 0). */
  lowLoadHours: number;
}

/** The recommendation for one mode of one day. */
export interface ModeRecommendation {
  mode: OperatingMode;
  hours: number;
  /** Plant load assumed in this mode, kW. */
  loadKw: number;
  feasible: boolean;
  unitIds: string[];
  /** Load of each recommended set, kW, by unit id. */
  loadsKw: Record<string, number>;
  fuelKg: number | null;
  /** Fuel of the same recommended sets sharing load equally (% of rating); null when not possible. */
  equalSplitFuelKg: number | null;
  /** Reasons when no combination meets the mode's rule, or why equal split is not possible. */
  reasons: string[];
}

export interface DaySavings {
  date: string;
  /** YYYY-MM. */
  month: string;
  energyKwh: number;
  /** Σ mode hours. */
  plantHours: number;
  averageLoadKw: number;
  /** Mass of the grade burned per kg of ISO fuel (42 700 / LCV). */
  isoToMassFactor: number;
  fuel: DayFuel;
  actualSets: ActualSetResult[];
  actualUnitIds: string[];
  modelledActualFuelKg: number;
  /** Σ measured fuel; null when any running set has no measured fuel. */
  measuredFuelKg: number | null;
  /** measured − modelled actual, kg; null without measured fuel. */
  residualKg: number | null;
  /** 100 · residual / modelled actual. */
  residualPct: number | null;
  modes: ModeRecommendation[];
  recommendationFeasible: boolean;
  recommendedFuelKg: number | null;
  /** modelled actual − recommended, kg; null when the recommendation is infeasible. */
  avoidableFuelKg: number | null;
  /** 100 · avoidable / modelled actual. */
  avoidablePct: number | null;
  /** The recommended sets: Σ over modes of (equal split − optimal split), kg; null when any mode has no equal split. */
  splitSavingRecommendedSetsKg: number | null;
  /**
   * The sets actually run, each for the day's common running hours: equal split − optimal split of the day's
   * energy, kg. null (with `splitSavingActualSetsReason`) when the sets ran different hours or a split is infeasible.
   */
  splitSavingActualSetsKg: number | null;
  splitSavingActualSetsReason: string | null;
  lowLoadHours: number;
  /** Same-day recommendation combination equals the actual sets in every mode. */
  followedRecommendation: boolean;
  /** ∂(avoidable fuel, kg of grade)/∂ coefficients, per unit; null when avoidable is null. */
  avoidableSensitivity: FuelSensitivity | null;
  modelledActualSensitivity: FuelSensitivity;
}
