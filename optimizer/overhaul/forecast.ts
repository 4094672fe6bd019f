/**
 * Forecasts of maintenance due dates: recent usage of a set, calendar intervals, planned hours per day.
 */
import { dateOfDayNumber, dayNumber } from '../logs/series-checks';
import { equivalentReadings } from './running-hours';
import type { DatedMeterReplacement, HourMeterReading, MaintenanceStatus } from './types';

export type UsageRate =
  | {
      ok: true;
      hPerDay: number;
      /** Dates of the two readings the rate is taken between. */
      fromDate: string;
      toDate: string;
      spanDays: number;
      /** Calendar days in the span with no reading (their hours are in the meter difference all the same). */
      daysWithoutReading: number;
      /** true when no reading reaches back to the window's start, so the span is shorter than the window. */
      shortWindow: boolean;
    }
  | { ok: false; reason: string };

/**
 * Running hours per day over the last `windowDays` days up to the latest reading on or before asOfDate.
 *
 * Method: (equivalent reading at the end − equivalent reading at the start) / calendar days between them, where the
 * start is the latest reading on or before the window's first day, or failing that the earliest reading inside
 * the window. Because the meter is cumulative, a missing day is NOT lost and NOT counted as zero: its hours show in
 * the next reading, and the day counts as elapsed time. Meter replacements are handled by `equivalentReadings`.
 *
 * Cost O(n log n + n·m). Throws on the problems `equivalentReadings` refuses and on a window that is not a
 * positive whole number of days. Fewer than two readings a day apart is a result { ok: false, reason }.
 *
 * @example usageRate([{ date: '2026-01-01', readingH: 100 }, { date: '2026-01-31', readingH: 460 }], [], { windowDays: 30 })
 *   // { ok: true, hPerDay: 12, fromDate: '2026-01-01', toDate: '2026-01-31', spanDays: 30, daysWithoutReading: 29, shortWindow: false }
 */
export function usageRate(
  readings: HourMeterReading[],
  replacements: DatedMeterReplacement[],
  options: { windowDays: number; asOfDate?: string },
): UsageRate {
  const { windowDays } = options;
  if (!(Number.isInteger(windowDays) && windowDays > 0)) throw new Error('usageRate requires windowDays to be a positive whole number');
  const asOf = options.asOfDate === undefined ? Infinity : dayNumber(options.asOfDate);
  const eq = equivalentReadings(readings, replacements).filter((r) => dayNumber(r.date) <= asOf);
  if (eq.length < 2) return { ok: false, reason: 'fewer than two hour-meter readings' };
  const end = eq[eq.length - 1];
  const endDay = dayNumber(end.date);
  const windowStart = endDay - windowDays;
  const before = eq.filter((r) => dayNumber(r.date) <= windowStart);
  const start = before.length > 0 ? before[before.length - 1] : eq.find((r) => dayNumber(r.date) > windowStart)!;
  const spanDays = endDay - dayNumber(start.date);
  if (spanDays === 0) return { ok: false, reason: `only one reading in the last ${windowDays} days (${end.date})` };
  const inside = eq.filter((r) => dayNumber(r.date) > dayNumber(start.date) && dayNumber(r.date) <= endDay).length;
  return {
    ok: true,
    hPerDay: (end.equivalentH - start.equivalentH) / spanDays,
    fromDate: start.date,
    toDate: end.date,
    spanDays,
    daysWithoutReading: spanDays - inside,
    shortWindow: before.length === 0,
  };
}

/**
 * A date plus a number of calendar months; a day past the end of the target month is clamped to its last day
 * (31 Jan + 1 month = 28 or 29 Feb), the usual reading of "every n months" (common practice).
 *
 * Cost O(1). Throws on a bad date or a months value that is not a whole number.
 *
 * @example addCalendarMonths('2026-01-31', 1) // '2026-02-28'
 */
export function addCalendarMonths(date: string, months: number): string {
  if (!Number.isInteger(months)) throw new Error('addCalendarMonths requires a whole number of months');
  dayNumber(date);
  const [y, m, d] = date.split('-').map(Number);
  const target = new Date(Date.UTC(y, m - 1 + months, 1));
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d, lastDay));
  return target.toISOString().slice(0, 10);
}

/** Planned running hours of one set on one date. */
export interface PlannedDay {
  date: string;
  hours: number;
}

/** How the set is expected to run from the day after its latest reading. */
export type UsageAssumption =
  | { hPerDay: number }
  | {
      /** Planned hours per date; a date inside the profile's span that is not listed counts 0 h. */
      profile: PlannedDay[];
      /** Rate after the profile's last date; absent: a due beyond the profile is not forecast (null). */
      afterHPerDay?: number;
    };

export interface DueForecast {
  gensetId: string;
  kind: string;
  hoursLeft: number;
  /** Date the running hours reach the due point; null when they never do under the assumption. */
  dueByHoursDate: string | null;
  /** Last work + interval in months; null without a calendar interval or without recorded work. */
  dueByMonthsDate: string | null;
  /** The earlier of the two. */
  dueDate: string | null;
  /** Which interval gives dueDate ('both' when the dates agree). */
  governedBy: 'hours' | 'months' | 'both' | null;
  /** dueDate − the status's asOfDate, days; negative when overdue. */
  daysLeft: number | null;
  overdue: boolean;
}

const HOURS_EPS = 1e-9;

function checkRate(fn: string, what: string, h: number): void {
  if (!(h >= 0 && h <= 24)) throw new Error(`${fn} requires ${what} between 0 and 24 h per day (got ${String(h)})`);
}

function daysToHours(fn: string, hoursLeft: number, asOfDay: number, usage: UsageAssumption): number | null {
  if ('hPerDay' in usage) {
    checkRate(fn, 'the usage rate', usage.hPerDay);
    return usage.hPerDay > 0 ? asOfDay + Math.max(1, Math.ceil(hoursLeft / usage.hPerDay - HOURS_EPS)) : null;
  }
  const byDay = new Map<number, number>();
  for (const p of usage.profile) {
    const day = dayNumber(p.date);
    checkRate(fn, `the planned hours on ${p.date}`, p.hours);
    if (byDay.has(day)) throw new Error(`${fn} requires one planned entry per date (${p.date} appears twice)`);
    byDay.set(day, p.hours);
  }
  const lastDay = Math.max(asOfDay, ...byDay.keys());
  let cumulative = 0;
  for (let day = asOfDay + 1; day <= lastDay; day++) {
    cumulative += byDay.get(day) ?? 0;
    if (cumulative >= hoursLeft - HOURS_EPS) return day;
  }
  if (usage.afterHPerDay === undefined) return null;
  checkRate(fn, 'the rate after the profile', usage.afterHPerDay);
  if (usage.afterHPerDay === 0) return null;
  return lastDay + Math.max(1, Math.ceil((hoursLeft - cumulative) / usage.afterHPerDay - HOURS_EPS));
}

/**
 * When a maintenance kind falls due: by running hours under a usage assumption, and by calendar months when an
 * interval in months is set; the earlier date wins (common practice: "whichever comes first").
 *
 * By hours, day d after the latest reading is the due date when the hours run by the end of day d first reach
 * the hours left (d = ⌈hoursLeft / rate⌉ at a constant rate). Overdue by hours: the date of the first reading at
 * or past the due point. By months: last work's date + interval months (addCalendarMonths).
 *
 * Cost O(1) at a rate; O(p + days of the profile) for a profile. Throws on rates or planned hours outside 0 to 24
 * h per day, duplicate profile dates and bad dates.
 *
 * @example forecastDue(status, { hPerDay: 12 }) // status with 120 h left on 2026-03-01: dueByHoursDate '2026-03-11'
 */
export function forecastDue(status: MaintenanceStatus, usage: UsageAssumption): DueForecast {
  const fn = 'forecastDue';
  const asOfDay = dayNumber(status.asOfDate);
  const overdueByHours = status.hoursLeft <= HOURS_EPS;
  let byHoursDay: number | null;
  if (overdueByHours) byHoursDay = status.dueReachedOn ? dayNumber(status.dueReachedOn) : asOfDay;
  else byHoursDay = daysToHours(fn, status.hoursLeft, asOfDay, usage);
  const byMonths =
    status.intervalMonths !== null && status.lastDoneOn !== null ? addCalendarMonths(status.lastDoneOn, status.intervalMonths) : null;
  const byMonthsDay = byMonths === null ? null : dayNumber(byMonths);
  let dueDay: number | null = null;
  let governedBy: DueForecast['governedBy'] = null;
  if (byHoursDay !== null && (byMonthsDay === null || byHoursDay < byMonthsDay)) [dueDay, governedBy] = [byHoursDay, 'hours'];
  else if (byMonthsDay !== null && (byHoursDay === null || byMonthsDay < byHoursDay)) [dueDay, governedBy] = [byMonthsDay, 'months'];
  else if (byHoursDay !== null) [dueDay, governedBy] = [byHoursDay, 'both'];
  return {
    gensetId: status.gensetId,
    kind: status.kind,
    hoursLeft: status.hoursLeft,
    dueByHoursDate: byHoursDay === null ? null : dateOfDayNumber(byHoursDay),
    dueByMonthsDate: byMonths,
    dueDate: dueDay === null ? null : dateOfDayNumber(dueDay),
    governedBy,
    daysLeft: dueDay === null ? null : dueDay - asOfDay,
    overdue: overdueByHours || (byMonthsDay !== null && byMonthsDay <= asOfDay),
  };
}

/**
 * Planned running hours per set and date from a voyage plan: each period's hours (split at midnight) go to the
 * sets running in it. Takes the plan problem's periods (durations) and the solved plan's periods (running ids);
 * optimizer/plan's PlanProblem.periods and VoyagePlan.periods fit these shapes.
 *
 * Cost O(periods + days). Throws when the two period lists differ in length, on negative durations, a bad start
 * date or a start hour outside [0, 24).
 *
 * @example dailyHoursFromPlan([{ durationH: 30 }], [{ runningIds: ['DG1'] }], '2026-05-01', 0)
 *   // { DG1: [{ date: '2026-05-01', hours: 24 }, { date: '2026-05-02', hours: 6 }] }
 */
export function dailyHoursFromPlan(
  periods: { durationH: number }[],
  planned: { runningIds: string[] }[],
  startDate: string,
  startHourOfDay = 0,
): Record<string, PlannedDay[]> {
  const fn = 'dailyHoursFromPlan';
  if (periods.length !== planned.length) throw new Error(`${fn} requires one planned period per plan period (${planned.length} for ${periods.length})`);
  if (!(startHourOfDay >= 0 && startHourOfDay < 24)) throw new Error(`${fn} requires a start hour in [0, 24)`);
  const day0 = dayNumber(startDate);
  const perSet = new Map<string, Map<number, number>>();
  let t = startHourOfDay;
  periods.forEach((p, i) => {
    if (!(p.durationH >= 0) || !Number.isFinite(p.durationH)) throw new Error(`${fn} requires non-negative period durations (period ${i})`);
    const end = t + p.durationH;
    for (const id of planned[i].runningIds) {
      const days = perSet.get(id) ?? new Map<number, number>();
      perSet.set(id, days);
      for (let from = t; from < end; ) {
        const day = Math.floor(from / 24);
        const to = Math.min(end, (day + 1) * 24);
        days.set(day, (days.get(day) ?? 0) + (to - from));
        from = to;
      }
    }
    t = end;
  });
  const out: Record<string, PlannedDay[]> = {};
  for (const [id, days] of perSet) {
    out[id] = [...days.entries()].sort((a, b) => a[0] - b[0]).map(([d, hours]) => ({ date: dateOfDayNumber(day0 + d), hours }));
  }
  return out;
}
