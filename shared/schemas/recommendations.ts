import { z } from 'zod';

/**
 * Recommendations: operating rules per mode, set status (availability, must-run), the plant model the
 * computations see, one operating point, and the versioned operating guideline.
 */

export const OPERATING_MODES = ['sea', 'manoeuvring', 'port', 'anchorage'] as const;
export const operatingModeSchema = z.enum(OPERATING_MODES);
export type OperatingModeName = z.infer<typeof operatingModeSchema>;

export const OPERATING_MODE_LABELS: Record<OperatingModeName, string> = {
  sea: 'Sea passage',
  manoeuvring: 'Manoeuvring',
  port: 'Port',
  anchorage: 'Anchorage',
};

/** Printed on every result that touches reserve, overload or blackout. */
export const RECOMMENDATION_CAUTION =
  "Kilowatch advises; the vessel's power management system, the maker's limits, class rules, local regulations and the chief engineer decide.";

const num = z.number();
const numOrNull = z.number().nullable();

export const operatingRuleInputSchema = z.object({
  marginKw: z.number({ message: 'Margin must be a number' }).min(0, 'Margin cannot be negative').max(50_000),
  marginPct: z.number({ message: 'Margin must be a number' }).min(0, 'Margin cannot be negative').max(200),
  minSets: z.number().int('Whole sets only').min(0).max(12),
  nMinus1: z.boolean(),
  busTieClosed: z.boolean(),
});
export type OperatingRuleInput = z.infer<typeof operatingRuleInputSchema>;

export const operatingRuleSchema = operatingRuleInputSchema.extend({
  mode: operatingModeSchema,
  /** false: no rule stored for the mode yet; the defaults shown apply. */
  stored: z.boolean(),
  updatedAt: z.string().nullable(),
});
export type OperatingRule = z.infer<typeof operatingRuleSchema>;
export const operatingRulesSchema = z.object({ vesselId: z.uuid(), rules: z.array(operatingRuleSchema) });
export type OperatingRules = z.infer<typeof operatingRulesSchema>;

export const gensetStatusInputSchema = z
  .object({
    available: z.boolean(),
    unavailableReason: z.string().trim().max(200).nullable().default(null),
    mustRun: z.boolean(),
  })
  .refine((s) => s.available || (s.unavailableReason ?? '').length > 0, {
    message: 'Say why the set is unavailable (maintenance, defect)',
    path: ['unavailableReason'],
  })
  .refine((s) => s.available || !s.mustRun, { message: 'An unavailable set cannot be must-run', path: ['mustRun'] });
export type GensetStatusInput = z.input<typeof gensetStatusInputSchema>;

export const curveSourceSchema = z.enum(['fit', 'shop_test']);
export type CurveSource = z.infer<typeof curveSourceSchema>;

/** One service set as the recommendation sees it. */
export const plantUnitSchema = z.object({
  gensetId: z.uuid(),
  designation: z.string(),
  busSection: z.string(),
  ratedKw: num,
  minLoadPct: num,
  maxLoadPct: num,
  available: z.boolean(),
  unavailableReason: z.string().nullable(),
  mustRun: z.boolean(),
  startCostKg: num,
  minUpH: num,
  minDownH: num,
  /** F(P) = a + bP + cP² kg/h, P in kW. */
  curve: z.object({ a: num, b: num, c: num }),
  curveSource: curveSourceSchema,
  /** The stored fit used (source 'fit'); null from the shop test. */
  curveFitId: z.uuid().nullable(),
  curveNote: z.string(),
});
export type PlantUnit = z.infer<typeof plantUnitSchema>;

export const plantModelSchema = z.object({
  vesselId: z.uuid(),
  busSections: z.array(z.string()),
  units: z.array(plantUnitSchema),
  /** Service sets left out, and why (no curve at all). */
  leftOut: z.array(z.object({ gensetId: z.uuid(), designation: z.string(), reason: z.string() })),
});
export type PlantModel = z.infer<typeof plantModelSchema>;

export const singlePointInputSchema = z
  .object({
    mode: operatingModeSchema,
    loadKw: z.number({ message: 'Enter the load in kW' }).min(0, 'Load cannot be negative').max(200_000).optional(),
    /** Load per bus section name, kW: needed when the mode's bus tie is open and the vessel has several sections. */
    sectionLoadsKw: z.record(z.string(), z.number().min(0, 'Load cannot be negative').max(200_000)).optional(),
  })
  .refine((s) => s.loadKw !== undefined || s.sectionLoadsKw !== undefined, { message: 'Enter the load in kW', path: ['loadKw'] });
export type SinglePointInput = z.infer<typeof singlePointInputSchema>;

export const unitLoadSchema = z.object({
  gensetId: z.string(),
  designation: z.string(),
  loadKw: num,
  loadPct: num,
  fuelKgPerH: num,
  sfocGPerKwh: numOrNull,
});
export type UnitLoadView = z.infer<typeof unitLoadSchema>;

export const combinationSchema = z.object({
  rank: num,
  gensetIds: z.array(z.string()),
  designations: z.array(z.string()),
  loadKw: num,
  fuelKgPerH: num,
  fuelKgPerDay: num,
  sfocGPerKwh: numOrNull,
  capacityKw: num,
  reserveKw: num,
  reservePct: numOrNull,
  units: z.array(unitLoadSchema),
  sections: z.array(z.object({ busSection: z.string(), loadKw: num, capacityKw: num, reserveKw: num })),
});
export type CombinationView = z.infer<typeof combinationSchema>;

export const unitReasonSchema = z.object({ gensetId: z.string(), designation: z.string(), on: z.boolean(), reason: z.string() });

export const singlePointResultSchema = z.object({
  vesselId: z.uuid(),
  mode: operatingModeSchema,
  rule: operatingRuleInputSchema,
  loadKw: num,
  sectionLoadsKw: z.record(z.string(), num).nullable(),
  feasible: z.boolean(),
  /** Infeasible: which rule cannot be met. */
  reasons: z.array(z.string()),
  combinations: z.array(combinationSchema),
  unitReasons: z.array(unitReasonSchema),
  equalSplitFuelKgPerH: numOrNull,
  equalSplitReason: z.string().nullable(),
  savedFuelKgPerDay: numOrNull,
  plant: plantModelSchema,
  caution: z.string(),
});
export type SinglePointResult = z.infer<typeof singlePointResultSchema>;

export const guidelineBandSchema = z.object({
  fromKw: num,
  toKw: num,
  gensetIds: z.array(z.string()),
  designations: z.array(z.string()),
  midKw: num,
  fuelKgPerDay: num,
  sfocGPerKwh: numOrNull,
  nextBest: z.object({ designations: z.array(z.string()), fuelKgPerDay: num }).nullable(),
  extraFuelNextBestKgPerDay: numOrNull,
});
export const guidelineModeSchema = z.object({
  mode: operatingModeSchema,
  rule: operatingRuleInputSchema,
  stepKw: num,
  /** Bus tie open with several sections: share of the load on each section, %. */
  sectionSharePct: z.record(z.string(), num).nullable(),
  minFeasibleKw: numOrNull,
  maxFeasibleKw: numOrNull,
  bands: z.array(guidelineBandSchema),
  gaps: z.array(z.object({ fromKw: num, toKw: num, reasons: z.array(z.string()) })),
  /** Why the sweep could not run for this mode (e.g. no set with a curve); null when it ran. */
  error: z.string().nullable(),
});
export const guidelineSchema = z.object({
  id: z.uuid(),
  vesselId: z.uuid(),
  vesselName: z.string(),
  version: num,
  inputHash: z.string(),
  createdAt: z.string(),
  /** true when this request made the version (the inputs changed or none existed). */
  created: z.boolean(),
  units: z.array(plantUnitSchema),
  modes: z.array(guidelineModeSchema),
  caution: z.string(),
});
export type Guideline = z.infer<typeof guidelineSchema>;
export const guidelineSummarySchema = z.object({ id: z.uuid(), version: num, inputHash: z.string(), createdAt: z.string() });
export type GuidelineSummary = z.infer<typeof guidelineSummarySchema>;
