// Public API of the savings computations (the lead wires this into optimizer/index.ts). Pure computation.
export { daySavings, costDay, unitsWithFittedCurves, subtractSensitivity } from './daily-savings';
export type { DaySavingsOptions } from './daily-savings';
export { vesselSavings, summarizeDays, fuelPriceOn, periodDays } from './totals';
export type { FuelPrice, IntervalAmount, SavingsOptions, SavingsTotals, VesselSavings } from './totals';
export { deltaInterval, multivariateNormalSampler, criticalValue, addScaledSensitivity } from './uncertainty';
export { sampleSavings } from './sampling';
export type { SampledSavings, SamplingOptions } from './sampling';
export { adoptionEffect, adoptionPointsFromDays } from './adoption';
export type { AdoptionEffect, AdoptionOptions, AdoptionPoint } from './adoption';
export type {
  ActualSetDay,
  ActualSetResult,
  CurveUncertainty,
  DayFuel,
  DaySavings,
  FuelSensitivity,
  ModeRecommendation,
  SavingsDay,
  SavingsInput,
  SavingsInterval,
} from './types';
