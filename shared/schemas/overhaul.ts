import { z } from 'zod';

/**
 * Running hours and overhaul planning: hours since each maintenance kind and the forecast due dates, work windows
 * (port calls, dry docks), completed work, stagger advice (hour budgets per set until a date) and its approval.
 */

const num = z.number();
const numOrNull = z.number().nullable();
const isoDate = z.iso.date('Enter the date as YYYY-MM-DD');

export const OVERHAUL_CAUTION =
  'Kilowatch advises. The vessel’s power management system, the maker’s limits and maintenance instructions, class rules, local regulations and the chief engineer decide when a set runs and when work is done.';

export const USAGE_WINDOWS_DAYS = [30, 90] as const;

/** Days of recent usage a forecast is taken over: 30 or 90, default 30. */
const usageWindowDays = (n: z.ZodNumber | z.ZodCoercedNumber) =>
  n
    .int()
    .refine((d) => (USAGE_WINDOWS_DAYS as readonly number[]).includes(d), { message: 'The usage window is 30 or 90 days' })
    .default(30);

/** ?usage=recent&windowDays=30|90, or ?usage=plan&planId=<voyage plan>&planStartDate=YYYY-MM-DD. */
export const overhaulQuerySchema = z
  .object({
    usage: z.enum(['recent', 'plan']).default('recent'),
    windowDays: usageWindowDays(z.coerce.number()),
    planId: z.uuid('Choose a voyage plan').optional(),
    /** Date the voyage plan's first hour falls on; default the day after the vessel's latest reading. */
    planStartDate: isoDate.optional(),
  })
  .refine((q) => q.usage !== 'plan' || q.planId !== undefined, { message: 'Choose a voyage plan', path: ['planId'] });
export type OverhaulQuery = z.input<typeof overhaulQuerySchema>;

export const usageSchema = z.object({
  source: z.enum(['recent', 'plan']),
  /** Recent usage over the window, h/day; with a plan, the rate after the plan ends. */
  hPerDay: numOrNull,
  fromDate: z.string().nullable(),
  toDate: z.string().nullable(),
  /** Why there is no rate (e.g. fewer than two readings). */
  note: z.string().nullable(),
  /** Hours the voyage plan runs the set, when the forecast is under a plan. */
  planHours: numOrNull,
});

export const maintenanceDueSchema = z.object({
  kind: z.string(),
  intervalHours: num,
  intervalMonths: numOrNull,
  basis: z.enum(['recorded', 'since-new']),
  lastDoneOn: z.string().nullable(),
  hoursSince: num,
  hoursLeft: num,
  /** The due point on the meter fitted now, h. */
  dueAtMeterReadingH: num,
  dueByHoursDate: z.string().nullable(),
  dueByMonthsDate: z.string().nullable(),
  dueDate: z.string().nullable(),
  governedBy: z.enum(['hours', 'months', 'both']).nullable(),
  daysLeft: numOrNull,
  overdue: z.boolean(),
  /** The work window the due date falls in, if any. */
  windowId: z.uuid().nullable(),
});
export type MaintenanceDue = z.infer<typeof maintenanceDueSchema>;

export const setOverhaulSchema = z.object({
  gensetId: z.uuid(),
  designation: z.string(),
  duty: z.enum(['service', 'emergency']),
  /** Date of the latest hour-meter reading (the "today" of the counts); null without readings. */
  asOfDate: z.string().nullable(),
  latestMeterH: numOrNull,
  usage: usageSchema,
  items: z.array(maintenanceDueSchema),
  /** Why the set's hours could not be counted (no readings, a meter fall without a replacement, ...). */
  problem: z.string().nullable(),
});
export type SetOverhaul = z.infer<typeof setOverhaulSchema>;

export const WORK_WINDOW_KINDS = ['port_call', 'dry_dock'] as const;
export const WORK_WINDOW_LABELS: Record<(typeof WORK_WINDOW_KINDS)[number], string> = { port_call: 'Port call', dry_dock: 'Dry dock' };

export const workWindowInputSchema = z
  .object({
    kind: z.enum(WORK_WINDOW_KINDS),
    place: z.string().trim().min(1, 'Enter the place').max(120),
    startsOn: isoDate,
    endsOn: isoDate,
  })
  .refine((w) => w.startsOn <= w.endsOn, { message: 'The window cannot end before it starts', path: ['endsOn'] });
export type WorkWindowInput = z.input<typeof workWindowInputSchema>;

export const workWindowSchema = z.object({
  id: z.uuid(),
  vesselId: z.uuid(),
  kind: z.enum(WORK_WINDOW_KINDS),
  place: z.string(),
  startsOn: z.string(),
  endsOn: z.string(),
});
export type WorkWindow = z.infer<typeof workWindowSchema>;

export const vesselOverhaulSchema = z.object({
  vesselId: z.uuid(),
  vesselName: z.string(),
  usage: z.enum(['recent', 'plan']),
  windowDays: num,
  planId: z.uuid().nullable(),
  planName: z.string().nullable(),
  planStartDate: z.string().nullable(),
  sets: z.array(setOverhaulSchema),
  windows: z.array(workWindowSchema),
  caution: z.string(),
});
export type VesselOverhaul = z.infer<typeof vesselOverhaulSchema>;

/** One row of the fleet list: a maintenance kind of a set of a vessel. */
export const fleetOverhaulRowSchema = maintenanceDueSchema.extend({
  vesselId: z.uuid(),
  vesselName: z.string(),
  gensetId: z.uuid(),
  designation: z.string(),
  asOfDate: z.string().nullable(),
  usageHPerDay: numOrNull,
});
export type FleetOverhaulRow = z.infer<typeof fleetOverhaulRowSchema>;

export const fleetOverhaulSchema = z.object({
  windowDays: num,
  /** Sorted by due date (no date last), then hours left. */
  rows: z.array(fleetOverhaulRowSchema),
  /** Sets whose hours could not be counted, with the reason. */
  problems: z.array(z.object({ vesselId: z.uuid(), vesselName: z.string(), gensetId: z.uuid(), designation: z.string(), problem: z.string() })),
  caution: z.string(),
});
export type FleetOverhaul = z.infer<typeof fleetOverhaulSchema>;

export const maintenanceEventInputSchema = z.object({
  gensetId: z.uuid('Choose a set'),
  kind: z.string().trim().min(1, 'Enter the kind of work').max(60),
  doneOn: isoDate,
  /** Hour-meter reading when the work was done, h (the meter fitted then). */
  runningHours: z.number({ message: 'Enter the meter reading' }).min(0, 'A meter reading cannot be negative').max(1_000_000),
  remarks: z.string().trim().max(500).nullable().default(null),
});
export type MaintenanceEventInput = z.input<typeof maintenanceEventInputSchema>;

export const maintenanceEventSchema = z.object({
  id: z.uuid(),
  gensetId: z.uuid(),
  designation: z.string(),
  kind: z.string(),
  doneOn: z.string(),
  runningHours: num,
  remarks: z.string().nullable(),
  recordedBy: z.string().nullable(),
  createdAt: z.string(),
});
export type MaintenanceEvent = z.infer<typeof maintenanceEventSchema>;

export const staggerInputSchema = z
  .object({
    untilDate: isoDate,
    minGapDays: z.number({ message: 'Enter the gap in days' }).int('Whole days').min(0).max(365),
    /** Recent-usage window that sets the baseline and the default plant need. */
    windowDays: usageWindowDays(z.number()),
    /** Set-hours per day the plant needs; default the sets' recent usage added up. */
    requiredSetHoursPerDay: z.number().min(0).max(24 * 20).nullable().default(null),
    /** Most hours per day any set may run. */
    maxHPerDay: z.number().positive().max(24).default(24),
    /** Sets that may stay short of their due until the date (they then need no window). */
    allowDueAfterDate: z.boolean().default(false),
    /** Sets to stagger (default every service set with a maintenance kind). */
    gensetIds: z.array(z.uuid()).optional(),
  });
export type StaggerRequest = z.input<typeof staggerInputSchema>;

export const setBudgetSchema = z.object({
  gensetId: z.string(),
  designation: z.string(),
  kind: z.string().nullable(),
  hoursLeftH: num,
  budgetH: num,
  hPerDay: num,
  dueDate: z.string().nullable(),
  windowId: z.string().nullable(),
  windowLabel: z.string().nullable(),
  daysFromWindow: numOrNull,
  baselineBudgetH: num,
  fuelKgPerH: num,
  fuelKg: num,
  baselineFuelKg: num,
});

export const staggerResultSchema = z.object({
  status: z.enum(['in-windows', 'nearest', 'infeasible']),
  reasons: z.array(z.string()),
  fromDate: z.string(),
  untilDate: z.string(),
  horizonDays: num,
  minGapDays: num,
  requiredSetHoursPerDay: num,
  budgets: z.array(setBudgetSchema),
  /** Budget per genset id over horizonDays, h: what a voyage plan reads as its running-hour limits. */
  hourBudgets: z.record(z.string(), num),
  totalDaysFromWindows: num,
  fuelKg: num,
  baselineFuelKg: num,
  fuelDeltaKg: num,
  /** Fuel delta priced with the company's fuel price of the vessel's main grade; null when none is set. */
  fuelGrade: z.string().nullable(),
  pricePerT: numOrNull,
  currency: z.string(),
  costDelta: numOrNull,
  /** Sets left out and why (no readings, nothing due, emergency set). */
  leftOut: z.array(z.object({ gensetId: z.string(), designation: z.string(), reason: z.string() })),
  caution: z.string(),
});
export type StaggerResult = z.infer<typeof staggerResultSchema>;

export const HOUR_BUDGET_STATUSES = ['proposed', 'approved', 'superseded'] as const;

export const hourBudgetPlanSchema = z.object({
  id: z.uuid(),
  vesselId: z.uuid(),
  untilDate: z.string(),
  status: z.enum(HOUR_BUDGET_STATUSES),
  inputs: staggerInputSchema,
  result: staggerResultSchema,
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  approvedAt: z.string().nullable(),
  approvedBy: z.string().nullable(),
});
export type HourBudgetPlan = z.infer<typeof hourBudgetPlanSchema>;

export const alertCheckResultSchema = z.object({ sent: num, alreadySent: num, skipped: num });
export type AlertCheckResult = z.infer<typeof alertCheckResultSchema>;
