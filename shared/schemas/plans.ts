import { z } from 'zod';
import { operatingModeSchema, operatingRuleInputSchema, plantUnitSchema } from './recommendations';

/**
 * Voyage plans: a load profile over up to 30 days under the vessel's operating rules, solved off the request
 * thread; per period the sets on and their loads, totals, hours left to overhaul, and the baseline comparison.
 */

export const PLAN_LIMITS = { maxHorizonH: 30 * 24, maxPeriods: 720, minPeriodH: 0.25 } as const;

const num = z.number();
const numOrNull = z.number().nullable();

export const profilePeriodSchema = z.object({
  durationH: z.number({ message: 'Duration must be a number' }).min(PLAN_LIMITS.minPeriodH, 'A period lasts at least 0.25 h').max(PLAN_LIMITS.maxHorizonH),
  mode: operatingModeSchema,
  loadKw: z.number({ message: 'Load must be a number' }).min(0, 'Load cannot be negative').max(200_000),
  /** Load per bus section name when the mode's bus tie is open; else the load is shared by installed capacity. */
  sectionLoadsKw: z.record(z.string(), z.number().min(0).max(200_000)).optional(),
});
export type ProfilePeriod = z.infer<typeof profilePeriodSchema>;

export const planInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Name the plan').max(120),
    profileSource: z.enum(['typed', 'csv', 'history']).default('typed'),
    periods: z.array(profilePeriodSchema).min(1, 'Enter at least one period').max(PLAN_LIMITS.maxPeriods, `At most ${PLAN_LIMITS.maxPeriods} periods`),
    /** Running-hour budgets per genset id over the plan, h; absent: the approved overhaul budgets, if any. */
    hourBudgetsH: z.record(z.uuid(), z.number().min(0, 'A budget cannot be negative')).optional(),
  })
  .refine((p) => p.periods.reduce((s, x) => s + x.durationH, 0) <= PLAN_LIMITS.maxHorizonH + 1e-9, {
    message: 'The horizon is at most 30 days (720 h)',
    path: ['periods'],
  });
export type PlanInput = z.input<typeof planInputSchema>;

/** Build a profile from logged history: average daily load per mode over a window, repeated along a sequence. */
export const historyProfileInputSchema = z
  .object({
    from: z.iso.date('Enter the date as YYYY-MM-DD'),
    to: z.iso.date('Enter the date as YYYY-MM-DD'),
    /** Legs in order: mode and hours. */
    sequence: z.array(z.object({ mode: operatingModeSchema, hours: z.number().positive('Hours must be above 0').max(PLAN_LIMITS.maxHorizonH) })).min(1).max(100),
    periodH: z.number().min(1).max(24).default(6),
  })
  .refine((h) => h.from <= h.to, { message: 'The last date must not be before the first', path: ['to'] })
  .refine((h) => h.sequence.reduce((s, x) => s + x.hours, 0) <= PLAN_LIMITS.maxHorizonH, { message: 'The horizon is at most 30 days (720 h)', path: ['sequence'] });
export type HistoryProfileInput = z.input<typeof historyProfileInputSchema>;

export const historyProfileSchema = z.object({
  periods: z.array(profilePeriodSchema),
  /** Average load per mode over the window, kW, and the days behind it; null load when the mode was never logged. */
  modeLoads: z.array(z.object({ mode: operatingModeSchema, loadKw: numOrNull, days: num })),
  warnings: z.array(z.string()),
});
export type HistoryProfile = z.infer<typeof historyProfileSchema>;

export const PLAN_STATUSES = ['queued', 'solving', 'solved', 'failed', 'approved'] as const;
export const planStatusSchema = z.enum(PLAN_STATUSES);

export const plannedPeriodSchema = z.object({
  startH: num,
  durationH: num,
  mode: operatingModeSchema,
  loadKw: num,
  runningIds: z.array(z.string()),
  /** kW per unit, in the order of `units`. */
  loadsKw: z.array(num),
  fuelKg: num,
});

export const planUnitTotalsSchema = z.object({
  gensetId: z.string(),
  designation: z.string(),
  starts: num,
  runningHours: num,
  budgetH: numOrNull,
  baselineRunningHours: numOrNull,
  /** Hours left to each maintenance kind at the end of the plan (interval − hours since it was done). */
  maintenance: z.array(z.object({ kind: z.string(), intervalHours: num, hoursLeftAtStartH: numOrNull, hoursLeftAtEndH: numOrNull })),
});

export const planResultSchema = z.object({
  solver: z.string(),
  status: z.enum(['optimal', 'within-gap', 'best-found', 'infeasible']),
  statusText: z.string(),
  gapPct: numOrNull,
  lowerBoundKg: numOrNull,
  totalFuelKg: num,
  runningFuelKg: num,
  startFuelKg: num,
  co2Kg: num,
  fuelGrade: z.string(),
  periods: z.array(plannedPeriodSchema),
  units: z.array(planUnitTotalsSchema),
  baseline: z.object({ totalFuelKg: numOrNull, co2Kg: numOrNull, statusText: z.string(), starts: numOrNull }),
  savingFuelKg: numOrNull,
  savingPct: numOrNull,
  savingCo2Kg: numOrNull,
  /** Independent re-check of the plan against its stored inputs. */
  check: z.object({ feasible: z.boolean(), violations: z.array(z.string()) }),
  infeasibleReasons: z.array(z.string()),
  solveMs: num,
});
export type PlanResult = z.infer<typeof planResultSchema>;

export const planSummarySchema = z.object({
  id: z.uuid(),
  vesselId: z.uuid(),
  name: z.string(),
  status: planStatusSchema,
  progress: num,
  horizonH: num,
  periods: num,
  totalFuelKg: numOrNull,
  savingFuelKg: numOrNull,
  statusText: z.string().nullable(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  approvedAt: z.string().nullable(),
  approvedBy: z.string().nullable(),
  /** The plan this one re-solves, when it does. */
  resolvedFrom: z.uuid().nullable(),
});
export type PlanSummary = z.infer<typeof planSummarySchema>;

export const planDetailSchema = planSummarySchema.extend({
  error: z.string().nullable(),
  units: z.array(plantUnitSchema),
  rules: z.record(z.string(), operatingRuleInputSchema),
  budgetSource: z.enum(['typed', 'approved_overhaul_plan', 'none']),
  pmsThresholds: z.object({ startAbovePct: num, stopBelowPct: num }),
  profile: z.array(profilePeriodSchema),
  result: planResultSchema.nullable(),
  caution: z.string(),
});
export type PlanDetail = z.infer<typeof planDetailSchema>;
