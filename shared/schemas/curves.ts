import { z } from 'zod';

/**
 * Fuel curves per genset: the window a fit covers, the fit with its statistics, the daily points it used, and
 * the SFOC drift since the last overhaul. Figures that cannot be computed (no residual degrees of freedom) are
 * null, never NaN.
 */

export const CURVE_WINDOW_KINDS = ['since_overhaul', 'rolling_90', 'rolling_180', 'rolling_365', 'custom'] as const;
export const curveWindowKindSchema = z.enum(CURVE_WINDOW_KINDS);
export type CurveWindowKind = z.infer<typeof curveWindowKindSchema>;

export const CURVE_WINDOW_LABELS: Record<CurveWindowKind, string> = {
  since_overhaul: 'Since the last overhaul',
  rolling_90: 'Last 90 days',
  rolling_180: 'Last 180 days',
  rolling_365: 'Last 365 days',
  custom: 'Chosen dates',
};

/**
 * Maintenance kinds that start a new curve window and a new drift cycle (case-insensitive). A fuel-injector
 * overhaul or an inspection does not: the cylinder units are not reconditioned.
 */
export const CURVE_RESET_KINDS = ['overhaul', 'top overhaul', 'major overhaul'] as const;

/** Query of the curve endpoints: ?window=rolling_90, or ?window=custom&from=YYYY-MM-DD&to=YYYY-MM-DD. */
export const curveQuerySchema = z
  .object({
    window: curveWindowKindSchema.default('since_overhaul'),
    from: z.iso.date('Enter the date as YYYY-MM-DD').optional(),
    to: z.iso.date('Enter the date as YYYY-MM-DD').optional(),
  })
  .superRefine((q, ctx) => {
    if (q.window === 'custom') {
      if (!q.from) ctx.addIssue({ code: 'custom', path: ['from'], message: 'A custom window needs a first date' });
      if (!q.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'A custom window needs a last date' });
      if (q.from && q.to && q.from > q.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The last date must not be before the first' });
    }
  });
export type CurveQuery = z.input<typeof curveQuerySchema>;

const num = z.number();
const numOrNull = z.number().nullable();

export const curveWindowSchema = z.object({
  kind: curveWindowKindSchema,
  /** First and last day of the window (inclusive); null when the set has no logs to bound it. */
  from: z.iso.date().nullable(),
  to: z.iso.date().nullable(),
  /** The overhaul that opened a since-overhaul window; null when none is recorded (all logs are used). */
  overhaul: z.object({ kind: z.string(), doneOn: z.iso.date(), runningHours: num }).nullable(),
});
export type CurveWindow = z.infer<typeof curveWindowSchema>;

/** One day that entered the fit. */
export const curvePointSchema = z.object({
  logId: z.uuid(),
  date: z.iso.date(),
  loadKw: num,
  /** Fuel rate referred to the ISO 3046-1 LCV, kg/h. */
  fuelKgPerH: num,
  hoursRun: num,
  sfocGPerKwh: num,
  /** Running hours since the window's overhaul at the end of the day; null without a recorded overhaul. */
  hoursSinceOverhaul: numOrNull,
  /** Robust (IRLS) weight, 1 for a day the fit trusts fully. */
  robustWeight: num,
});
export type CurvePoint = z.infer<typeof curvePointSchema>;

/** SFOC of the fitted curve at a load with its 95 % confidence band (null bounds without degrees of freedom). */
export const curveSampleSchema = z.object({
  loadKw: num,
  sfocGPerKwh: num,
  lowerGPerKwh: numOrNull,
  upperGPerKwh: numOrNull,
  /** Outside the load range of the days fitted. */
  extrapolated: z.boolean(),
});
export type CurveSample = z.infer<typeof curveSampleSchema>;

export const sfocAtLoadSchema = curveSampleSchema.extend({
  loadPct: num,
  shopSfocGPerKwh: numOrNull,
  offsetFromShopGPerKwh: numOrNull,
});
export type SfocAtLoadView = z.infer<typeof sfocAtLoadSchema>;

export const curveOutlierSchema = z.object({
  logId: z.string().nullable(),
  date: z.string().nullable(),
  loadKw: num,
  fuelKgPerH: num,
  residualKgPerH: num,
  standardizedResidual: num,
  robustWeight: num,
});

const triple = z.object({ a: num, b: num, c: num });

/** The fitted curve F(P) = a + bP + cP² (kg/h, P in kW) and its statistics. */
export const curveFitStatsSchema = z.object({
  coefficients: triple,
  standardErrors: z.object({ a: numOrNull, b: numOrNull, c: numOrNull }),
  covariance: z.array(z.array(numOrNull)),
  activeConstraints: z.array(z.enum(['a', 'c'])),
  rSquared: numOrNull,
  residualSdKgPerH: numOrNull,
  dof: num,
  days: num,
  loadRangeKw: z.object({ min: num, max: num }),
  loadSpanPct: num,
  robust: z.string(),
  robustTuning: numOrNull,
  iterations: num,
  converged: z.boolean(),
  priorUsed: z.boolean(),
  priorWeightDays: num,
  priorWeightShare: num,
  lowestSfoc: z.object({ loadKw: num, sfocGPerKwh: num, extrapolated: z.boolean() }),
  atLoads: z.array(sfocAtLoadSchema),
  outliers: z.array(curveOutlierSchema),
  warnings: z.array(z.string()),
  /** The curve with its 95 % band from 10 % to 100 % of rating, for drawing. */
  samples: z.array(curveSampleSchema),
});
export type CurveFitStats = z.infer<typeof curveFitStatsSchema>;

export const driftSchema = z.object({
  referenceLoadKw: num,
  /** 'median' when the reference load is the set's median daily load, 'rated75' for 75 % of rating. */
  referenceBasis: z.enum(['median', 'rated75']),
  days: num,
  slopeGPerKwhPer1000h: numOrNull,
  slopeInterval: z.object({ lower: numOrNull, upper: numOrNull, level: num }),
  interceptGPerKwh: numOrNull,
  daySfoc: z.array(z.object({ date: z.string().nullable(), hoursSinceOverhaul: num, sfocGPerKwh: num })),
  baselineSfocGPerKwh: numOrNull,
  latestSfocGPerKwh: numOrNull,
  excessGPerKwh: numOrNull,
  excessLowerBoundGPerKwh: numOrNull,
  thresholdGPerKwh: numOrNull,
  /** One-sided confidence of the alert (0.95). */
  confidence: num,
  alert: z.boolean(),
  alertUnavailable: z.string().nullable(),
});
export type DriftView = z.infer<typeof driftSchema>;

export const shopTestPointSchema = z.object({ loadPct: num, sfocGPerKwh: num });

/** One set's fit for one window; `fit` is null when the window holds too few usable days (see `reason`). */
export const curveSetFitSchema = z.object({
  gensetId: z.uuid(),
  designation: z.string(),
  ratedKw: num,
  window: curveWindowSchema,
  fitId: z.uuid().nullable(),
  inputHash: z.string().nullable(),
  fittedAt: z.string().nullable(),
  /** true when this read refitted because the inputs changed (or no fit was stored). */
  refitted: z.boolean(),
  /** Days of the window with a log, and how many were left out and why. */
  daysLogged: num,
  daysLeftOut: z.object({ excluded: num, flagged: num, shorePower: num, notRun: num }),
  shopTest: z.array(shopTestPointSchema),
  fit: curveFitStatsSchema.nullable(),
  drift: driftSchema.nullable(),
  reason: z.string().nullable(),
});
export type CurveSetFit = z.infer<typeof curveSetFitSchema>;

export const curveSetDetailSchema = curveSetFitSchema.extend({ points: z.array(curvePointSchema) });
export type CurveSetDetail = z.infer<typeof curveSetDetailSchema>;

export const vesselCurvesSchema = z.object({
  vesselId: z.uuid(),
  window: curveWindowKindSchema,
  sets: z.array(curveSetFitSchema),
});
export type VesselCurves = z.infer<typeof vesselCurvesSchema>;

export const driftAlertSetSchema = z.object({
  gensetId: z.uuid(),
  designation: z.string(),
  alert: z.boolean(),
  excessGPerKwh: numOrNull,
  excessLowerBoundGPerKwh: numOrNull,
  thresholdGPerKwh: numOrNull,
  slopeGPerKwhPer1000h: numOrNull,
  confidence: num,
  unavailable: z.string().nullable(),
});
export type DriftAlertSet = z.infer<typeof driftAlertSetSchema>;

export const vesselDriftAlertsSchema = z.object({
  vesselId: z.uuid(),
  vesselName: z.string(),
  alertCount: num,
  sets: z.array(driftAlertSetSchema),
});
export type VesselDriftAlerts = z.infer<typeof vesselDriftAlertsSchema>;

export const fleetDriftAlertsSchema = z.object({
  alertCount: num,
  vessels: z.array(vesselDriftAlertsSchema),
});
export type FleetDriftAlerts = z.infer<typeof fleetDriftAlertsSchema>;
