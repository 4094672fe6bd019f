// Public API of the running-hours and overhaul planning computations (the lead wires this into optimizer/index.ts).
export { equivalentReadings, hoursSinceMaintenance } from './running-hours';
export type { EquivalentReading } from './running-hours';
export type {
  DatedMeterReplacement,
  GensetHoursRecord,
  HourMeterReading,
  MaintenanceDone,
  MaintenanceKind,
  MaintenanceStatus,
} from './types';
export { addCalendarMonths, dailyHoursFromPlan, forecastDue, usageRate } from './forecast';
export type { DueForecast, PlannedDay, UsageAssumption, UsageRate } from './forecast';
export {
  DEFAULT_OFF_WINDOW_STEP_DAYS,
  DEFAULT_TIME_LIMIT_MS,
  RATE_MARGIN_H_PER_DAY,
  buildStaggerModel,
  candidateSlots,
  dueSlots,
  prepareStagger,
  proposeHourBudgets,
  windowDistance,
} from './stagger';
export type { DueSlot, SetBudget, StaggerInput, StaggerModel, StaggerObjective, StaggerProblem, StaggerProposal, StaggerSet, WorkWindow } from './stagger';
export { highsSolver, linearModelToLp, solveLinearModel } from './linear-model';
export type { HighsLike, LinearColumn, LinearModel, LinearRow, LinearSolution } from './linear-model';
export { dueAlerts, dueKey } from './alerts';
export type { DueAlert } from './alerts';
