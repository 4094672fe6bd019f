import { z } from 'zod';

/** Fuel grades a company can price (the bunker grade codes of the logs). */
export const PRICED_FUEL_GRADES = [
  'MGO',
  'LSMGO',
  'MDO',
  'ULSFO',
  'VLSFO',
  'LSFO',
  'HSFO',
  'HFO',
  'IFO180',
  'IFO380',
  'LNG',
  'LPG_PROPANE',
  'LPG_BUTANE',
  'ETHANE',
  'METHANOL',
  'ETHANOL',
] as const;
export const pricedFuelGradeSchema = z.enum(PRICED_FUEL_GRADES);

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date YYYY-MM-DD');
const MAX_PERIOD_DAYS = 366;

/** Query of the savings routes: the chosen period (inclusive) and the interval level. */
export const savingsQuerySchema = z
  .object({
    from: isoDate,
    to: isoDate,
    level: z.coerce.number().min(0.5).max(0.999).default(0.95),
  })
  .refine((q) => q.from <= q.to, { message: 'from must not be after to', path: ['to'] })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 < MAX_PERIOD_DAYS, { message: `Choose at most ${MAX_PERIOD_DAYS} days`, path: ['to'] });
export type SavingsQuery = z.input<typeof savingsQuerySchema>;

/** A company fuel price: per tonne of a grade, in the company currency, from a date until the next price of that grade. */
export const fuelPriceInputSchema = z.object({
  grade: pricedFuelGradeSchema,
  pricePerT: z.number().min(0).max(100_000),
  validFrom: isoDate,
});
export type FuelPriceInput = z.infer<typeof fuelPriceInputSchema>;

export interface FuelPriceRow {
  id: string;
  grade: string;
  pricePerT: number;
  currency: string;
  validFrom: string;
  /** The day before the next price of the same grade; null when open-ended. */
  validTo: string | null;
}

/** An amount with its interval, in the unit named by the field that holds it. */
export interface IntervalAmountView {
  value: number;
  lower: number;
  upper: number;
  sd: number;
}

/** Totals of a day, a month (label YYYY-MM) or the chosen period (label 'period'). */
export interface SavingsTotalsView {
  label: string;
  from: string;
  to: string;
  days: number;
  energyMwh: number;
  modelledActualFuelT: number;
  measuredFuelT: number | null;
  residualT: number | null;
  residualPct: number | null;
  daysWithoutRecommendation: string[];
  recommendedFuelT: number;
  avoidableFuelT: IntervalAmountView;
  avoidablePct: number | null;
  effectiveDof: number | null;
  co2: { modelledActualT: number; measuredT: number | null; avoidableT: IntervalAmountView };
  cost: { currency: string; measured: number | null; modelledActual: number; avoidable: IntervalAmountView; daysWithoutPrice: string[] } | null;
  lowLoadHours: number;
  splitSavingRecommendedSetsT: number;
  splitSavingActualSetsT: number;
  daysWithoutActualSplit: string[];
  daysFollowingRecommendation: number;
}

export interface SavingsModeView {
  mode: string;
  hours: number;
  loadKw: number;
  feasible: boolean;
  /** Designations of the recommended sets. */
  sets: string[];
  loadsKw: Record<string, number>;
  fuelKg: number | null;
  reasons: string[];
}

/** One logged day: actual against recommended, with measured fuel and the residual. */
export interface SavingsDayView {
  date: string;
  grade: string;
  energyKwh: number;
  plantHours: number;
  averageLoadKw: number;
  actualSets: { designation: string; hoursRun: number; kwh: number; loadKw: number; loadPct: number; modelledFuelKg: number; measuredFuelKg: number | null; lowLoadHours: number }[];
  modelledActualFuelKg: number;
  measuredFuelKg: number | null;
  residualKg: number | null;
  residualPct: number | null;
  recommendedFuelKg: number | null;
  avoidableFuelKg: number | null;
  avoidableLowerKg: number | null;
  avoidableUpperKg: number | null;
  avoidablePct: number | null;
  modes: SavingsModeView[];
  splitSavingRecommendedSetsKg: number | null;
  splitSavingActualSetsKg: number | null;
  splitSavingActualSetsReason: string | null;
  lowLoadHours: number;
  followedRecommendation: boolean;
}

export interface AdoptionView {
  adoptedFrom: string;
  source: 'chief_engineer' | 'matched_days';
  daysBefore: number;
  daysAfter: number;
  rawSfocBeforeGPerKwh: number;
  rawSfocAfterGPerKwh: number;
  changeGPerKwh: number;
  changeLowerGPerKwh: number;
  changeUpperGPerKwh: number;
  changePct: number;
  fuelSavedAfterT: { value: number; lower: number; upper: number };
  level: number;
  warnings: string[];
}

export interface SavingsCurveSource {
  gensetId: string;
  designation: string;
  source: 'fit' | 'shop_test';
  note: string;
  /** false: the curve counts as exact in the intervals (no fit covariance). */
  hasCovariance: boolean;
}

export interface VesselSavingsReport {
  vesselId: string;
  vesselName: string;
  from: string;
  to: string;
  level: number;
  currency: string;
  curves: SavingsCurveSource[];
  days: SavingsDayView[];
  byMonth: SavingsTotalsView[];
  period: SavingsTotalsView;
  adoption: AdoptionView | null;
  adoptionUnavailable: string | null;
  /** Logged days left out, with the reason (e.g. no mode hours). */
  skippedDays: { date: string; reason: string }[];
  warnings: string[];
  method: string[];
  caution: string;
}

/** How every figure is computed, shown beside it on pages and reports. */
export const SAVINGS_METHOD: Record<string, string> = {
  modelledActual: 'Modelled fuel of what was done: each set at its daily average load (kWh / hours run) for its hours, costed with its fitted curve.',
  recommended: 'Modelled fuel of the recommendation for the same daily energy and mode hours under the vessel’s reserve rules, costed with the same curves.',
  avoidable: 'Avoidable fuel = modelled actual − recommended; both use the same curves, so a common bias cancels. Interval: delta method with each curve’s coefficient covariance.',
  measured: 'Measured fuel: the logged fuel mass (at 15 °C) of the sets that ran.',
  residual: 'Residual = measured − modelled actual; a check of the curves.',
  co2: 'CO2 = fuel × Cf of the grade burned (IMO MEPC.364(79)).',
  cost: 'Cost = fuel × the company price per tonne of the grade valid on the day.',
  split: 'Split saving = fuel of an equal load split − fuel of the optimal split, with the same sets.',
  lowLoad: 'Low-load hours: all hours of a set-day whose daily average load is below the set’s minimum load.',
  adoption: 'Adoption: regression of daily plant SFOC on load fraction (and its square) with an after-adoption indicator; the change is at equal load.',
};

/** The caution stated on every savings page and report (the same words as the recommendations'). */
export { RECOMMENDATION_CAUTION as SAVINGS_CAUTION } from './recommendations';
