/**
 * Calendar of the demo scenario: a fixed window of ship's dates (no clock is read), indexed from 0.
 * Pure: no I/O. Dates are 'YYYY-MM-DD' strings computed in UTC so the result does not depend on the machine's zone.
 */

/** First logged date of the demo scenario. */
export const SCENARIO_FIRST_DATE = '2024-11-01';
/** Last logged date of the demo scenario (inclusive): two full years. */
export const SCENARIO_LAST_DATE = '2026-10-31';

const DAY_MS = 86_400_000;
const FIRST_MS = Date.parse(`${SCENARIO_FIRST_DATE}T00:00:00Z`);

/**
 * The date `dayIndex` days after SCENARIO_FIRST_DATE (negative indexes give earlier dates).
 *
 * Cost O(1). Throws when dayIndex is not a whole number.
 *
 * @example dateOfDayIndex(0) // '2024-11-01'
 */
export function dateOfDayIndex(dayIndex: number): string {
  if (!Number.isInteger(dayIndex)) throw new Error(`dateOfDayIndex requires a whole number of days (got ${dayIndex})`);
  return new Date(FIRST_MS + dayIndex * DAY_MS).toISOString().slice(0, 10);
}

/**
 * Days from SCENARIO_FIRST_DATE to a date (negative before it).
 *
 * Cost O(1). Throws when the date is not 'YYYY-MM-DD'.
 *
 * @example dayIndexOfDate('2024-11-03') // 2
 */
export function dayIndexOfDate(date: string): number {
  const ms = /^\d{4}-\d{2}-\d{2}$/.test(date) ? Date.parse(`${date}T00:00:00Z`) : Number.NaN;
  if (!Number.isFinite(ms)) throw new Error(`dayIndexOfDate requires a date as YYYY-MM-DD (got ${date})`);
  return Math.round((ms - FIRST_MS) / DAY_MS);
}

/** Number of days in the scenario (730). */
export const SCENARIO_DAY_COUNT = dayIndexOfDate(SCENARIO_LAST_DATE) + 1;

/**
 * Day of the year (1 to 366) of a scenario day, for seasonal load patterns.
 *
 * Cost O(1).
 *
 * @example dayOfYear(0) // 306 (1 November 2024, a leap year)
 */
export function dayOfYear(dayIndex: number): number {
  const date = dateOfDayIndex(dayIndex);
  const startOfYear = Date.parse(`${date.slice(0, 4)}-01-01T00:00:00Z`);
  return Math.round((Date.parse(`${date}T00:00:00Z`) - startOfYear) / DAY_MS) + 1;
}
