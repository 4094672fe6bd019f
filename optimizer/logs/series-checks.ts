/**
 * Checks over a series of daily logs (missing days, duplicate dates) and the derivation of one genset's series with
 * meter readings carried from day to day.
 */

import { deriveDailyRow } from './derive-daily-row';
import type { DailyRowContext, DerivedDailyRow, RawDailyLog } from './derive-daily-row';
import { qualityFlag } from './quality-flags';
import type { QualityFlag } from './quality-flags';

const MS_PER_DAY = 86_400_000;

/**
 * Day number (days since 1970-01-01, UTC) of a YYYY-MM-DD date.
 *
 * Cost O(1). Throws on anything that is not a real calendar date in that form.
 *
 * @example dayNumber('1970-01-02') // 1
 */
export function dayNumber(date: string): number {
  const m = typeof date === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(date) : null;
  if (m) {
    const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
    const ms = Date.UTC(y, mo - 1, d);
    const back = new Date(ms);
    if (back.getUTCFullYear() === y && back.getUTCMonth() === mo - 1 && back.getUTCDate() === d) return ms / MS_PER_DAY;
  }
  throw new Error(`dayNumber requires a date as YYYY-MM-DD (got ${String(date)})`);
}

/**
 * YYYY-MM-DD of a day number (days since 1970-01-01, UTC); the inverse of dayNumber.
 *
 * Cost O(1). Throws (RangeError from Date) when the day number is beyond the range of dates.
 *
 * @example dateOfDayNumber(1) // '1970-01-02'
 */
export function dateOfDayNumber(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}

/** A flag about a set's series on a date (a missing day has no row to carry it). */
export interface SeriesFlag {
  gensetId: string;
  date: string;
  flag: QualityFlag;
}

/**
 * Missing days and duplicate dates per genset.
 *
 * For each gensetId, every calendar day from its first to its last logged date (widened to options.from / to when
 * given) without a row gives MISSING_DAY; every date with more than one row gives one DUPLICATE_DATE.
 * Results are ordered by gensetId, then date.
 *
 * Cost O(n log n + d) for n rows spanning d days. Throws on a malformed date, or when from is after to.
 *
 * @example checkLogSeries([{ gensetId: 'DG1', date: '2026-01-01' }, { gensetId: 'DG1', date: '2026-01-03' }])
 *   // [{ gensetId: 'DG1', date: '2026-01-02', flag: { code: 'MISSING_DAY', ... } }]
 */
export function checkLogSeries(
  rows: ReadonlyArray<{ gensetId: string; date: string }>,
  options: { from?: string; to?: string } = {},
): SeriesFlag[] {
  const fromDay = options.from !== undefined ? dayNumber(options.from) : undefined;
  const toDay = options.to !== undefined ? dayNumber(options.to) : undefined;
  if (fromDay !== undefined && toDay !== undefined && fromDay > toDay) throw new Error('checkLogSeries requires from ≤ to');
  const bySet = new Map<string, Map<number, number>>();
  for (const row of rows) {
    const day = dayNumber(row.date);
    let counts = bySet.get(row.gensetId);
    if (!counts) bySet.set(row.gensetId, (counts = new Map()));
    counts.set(day, (counts.get(day) ?? 0) + 1);
  }
  const out: SeriesFlag[] = [];
  for (const gensetId of [...bySet.keys()].sort()) {
    const counts = bySet.get(gensetId) as Map<number, number>;
    const days = [...counts.keys()];
    const first = Math.min(fromDay ?? Infinity, ...days);
    const last = Math.max(toDay ?? -Infinity, ...days);
    for (let day = first; day <= last; day++) {
      const n = counts.get(day) ?? 0;
      const date = dateOfDayNumber(day);
      if (n === 0) {
        out.push({ gensetId, date, flag: qualityFlag('MISSING_DAY', 'date', `No log of ${gensetId} for ${date}.`) });
      } else if (n > 1) {
        out.push({ gensetId, date, flag: qualityFlag('DUPLICATE_DATE', 'date', `${n} logs of ${gensetId} for ${date}; keep one.`) });
      }
    }
  }
  return out;
}

/**
 * Derives a series of one genset's days, carrying each day's cumulative readings to the next calendar day.
 *
 * Rows are sorted by date. A day's previous readings are those of the row of the day before; after a missing day
 * there are none (the next cumulative entry is flagged METER_PREVIOUS_MISSING rather than charging two days to
 * one); context.previous serves the first row only. Rows sharing a date all carry DUPLICATE_DATE, are marked not
 * usable and do not pass readings on. Missing days come back in seriesFlags.
 *
 * Cost O(n log n). Throws when the logs belong to more than one genset, and as deriveDailyRow / checkLogSeries.
 *
 * @example deriveGensetSeries(logs, { ratedKw: 1000, minLoadPct: 30, lot }).rows.length // logs.length
 */
export function deriveGensetSeries(
  logs: ReadonlyArray<RawDailyLog>,
  context: DailyRowContext,
): { rows: DerivedDailyRow[]; seriesFlags: SeriesFlag[] } {
  const ids = new Set(logs.map((l) => l.gensetId));
  if (ids.size > 1) throw new Error('deriveGensetSeries requires the logs of one genset');
  const sorted = [...logs].sort((a, b) => dayNumber(a.date) - dayNumber(b.date));
  const seriesFlags = checkLogSeries(sorted);
  const duplicates = new Set(seriesFlags.filter((s) => s.flag.code === 'DUPLICATE_DATE').map((s) => s.date));
  const rows: DerivedDailyRow[] = [];
  let previous: DailyRowContext['previous'] = context.previous;
  let previousDay: number | null = null;
  for (const log of sorted) {
    const day = dayNumber(log.date);
    const carried = previousDay === null ? previous : previousDay === day - 1 ? previous : undefined;
    const row = deriveDailyRow(log, { ...context, previous: carried });
    if (duplicates.has(log.date)) {
      const dup = seriesFlags.find((s) => s.date === log.date && s.flag.code === 'DUPLICATE_DATE') as SeriesFlag;
      row.flags.push(dup.flag);
      row.usable = false;
      previous = undefined;
    } else {
      previous = { runningHoursReadingH: row.readings.runningHoursH, energyReadingKwh: row.readings.energyKwh };
    }
    previousDay = day;
    rows.push(row);
  }
  return { rows, seriesFlags: seriesFlags.filter((s) => s.flag.code === 'MISSING_DAY') };
}
