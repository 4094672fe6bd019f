/**
 * Hours since each maintenance kind of a set, from its cumulative hour-meter readings, the recorded meter
 * replacements and the work done.
 */
import { meterDelta } from '../logs/meter-delta';
import { dayNumber } from '../logs/series-checks';
import type {
  DatedMeterReplacement,
  GensetHoursRecord,
  HourMeterReading,
  MaintenanceDone,
  MaintenanceStatus,
} from './types';

/** A reading placed on the set's continuous hour scale. */
export interface EquivalentReading extends HourMeterReading {
  /** readingH + the hours of all meters replaced on or before this date. */
  equivalentH: number;
}

function requireFinite(fn: string, what: string, v: number): void {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new Error(`${fn} requires ${what} to be a finite number (got ${String(v)})`);
}

function sortedByDate<T extends { date: string }>(fn: string, what: string, rows: T[]): T[] {
  const out = [...rows].sort((a, b) => dayNumber(a.date) - dayNumber(b.date));
  for (let i = 1; i < out.length; i++) {
    if (out[i].date === out[i - 1].date) throw new Error(`${fn} requires one ${what} per date (${out[i].date} appears twice)`);
  }
  return out;
}

/**
 * The continuous hour scale of one set: the offset each recorded meter replacement adds to later readings.
 * A reading dated on a replacement day is on the new meter unless `onOldMeter` is set.
 */
class HourScale {
  readonly replacements: DatedMeterReplacement[];

  constructor(fn: string, replacements: DatedMeterReplacement[]) {
    for (const r of replacements) {
      requireFinite(fn, 'replacement.oldFinalReading', r.oldFinalReading);
      requireFinite(fn, 'replacement.newStartReading', r.newStartReading);
    }
    this.replacements = sortedByDate(fn, 'meter replacement', replacements);
  }

  /** Hours of the replaced meters up to a date (inclusive, or exclusive with onOldMeter). */
  offsetH(date: string, onOldMeter = false): number {
    const day = dayNumber(date);
    let offset = 0;
    for (const r of this.replacements) {
      const rd = dayNumber(r.date);
      if (rd < day || (rd === day && !onOldMeter)) offset += r.oldFinalReading - r.newStartReading;
    }
    return offset;
  }

  /** Replacements dated after `fromDate` and on or before `toDate`. */
  between(fromDate: string, toDate: string): DatedMeterReplacement[] {
    const from = dayNumber(fromDate);
    const to = dayNumber(toDate);
    return this.replacements.filter((r) => dayNumber(r.date) > from && dayNumber(r.date) <= to);
  }

  /** The meter in place for a reading: its start reading and, when replaced later, its final reading. */
  meterRange(date: string, onOldMeter: boolean): { startH: number; finalH: number | null } {
    const day = dayNumber(date);
    let startH = 0;
    let finalH: number | null = null;
    for (const r of this.replacements) {
      const rd = dayNumber(r.date);
      if (rd < day || (rd === day && !onOldMeter)) startH = r.newStartReading;
      else {
        finalH = r.oldFinalReading;
        break;
      }
    }
    return { startH, finalH };
  }
}

/**
 * Each reading on the set's continuous hour scale (the first meter's scale), checked day to day.
 *
 * Between consecutive readings, the meters in turn (previous reading → old meter's final, new meter's start → next
 * final, ..., → the later reading) must each count up: every step is checked with `meterDelta` from
 * optimizer/logs, so a fall without a recorded replacement is refused here exactly as in log intake.
 *
 * Cost O((n + m) log n + n·m) for n readings and m replacements. Throws on duplicate dates, bad dates, non-finite
 * numbers, or a reading below the one before it that no recorded replacement explains.
 *
 * @example equivalentReadings(
 *   [{ date: '2026-01-01', readingH: 9990 }, { date: '2026-01-02', readingH: 14 }],
 *   [{ date: '2026-01-02', oldFinalReading: 10000, newStartReading: 0 }],
 * ).map((r) => r.equivalentH) // [9990, 10014]
 */
export function equivalentReadings(readings: HourMeterReading[], replacements: DatedMeterReplacement[] = []): EquivalentReading[] {
  const fn = 'equivalentReadings';
  for (const r of readings) requireFinite(fn, `the reading on ${r.date}`, r.readingH);
  const sorted = sortedByDate(fn, 'hour-meter reading', readings);
  const scale = new HourScale(fn, replacements);
  const out: EquivalentReading[] = [];
  sorted.forEach((r, i) => {
    if (i > 0) checkStep(fn, sorted[i - 1], r, scale.between(sorted[i - 1].date, r.date));
    out.push({ ...r, equivalentH: r.readingH + scale.offsetH(r.date) });
  });
  return out;
}

function checkStep(fn: string, prev: HourMeterReading, cur: HourMeterReading, replaced: DatedMeterReplacement[]): void {
  const pairs: [number, number][] = [];
  let from = prev.readingH;
  for (const r of replaced) {
    pairs.push([from, r.oldFinalReading]);
    from = r.newStartReading;
  }
  pairs.push([from, cur.readingH]);
  for (const [a, b] of pairs) {
    const step = meterDelta({ previousReading: a, currentReading: b });
    if (!step.ok) {
      const note = replaced.length === 0 ? 'with no meter replacement recorded between them' : 'and the recorded meter replacement does not explain it';
      throw new Error(`${fn}: the reading ${cur.readingH} h on ${cur.date} is below the reading ${prev.readingH} h on ${prev.date} ${note}`);
    }
  }
}

function latestDone(fn: string, done: MaintenanceDone[], kind: string, asOf: number, scale: HourScale): { done: MaintenanceDone; equivalentH: number } | null {
  let best: { done: MaintenanceDone; equivalentH: number } | null = null;
  for (const d of done) {
    if (d.kind !== kind || dayNumber(d.doneOn) > asOf) continue;
    requireFinite(fn, `the reading of the ${kind} done on ${d.doneOn}`, d.readingH);
    const onOld = d.onOldMeter === true;
    if (onOld && !scale.replacements.some((r) => r.date === d.doneOn)) {
      throw new Error(`${fn}: the ${kind} done on ${d.doneOn} is marked on the old meter, but no meter replacement is recorded that day`);
    }
    const { startH, finalH } = scale.meterRange(d.doneOn, onOld);
    if (d.readingH < startH || (finalH !== null && d.readingH > finalH)) {
      const range = finalH === null ? `at least ${startH} h` : `${startH} to ${finalH} h`;
      throw new Error(`${fn}: the ${kind} done on ${d.doneOn} at ${d.readingH} h lies outside the meter then fitted (${range})`);
    }
    const equivalentH = d.readingH + scale.offsetH(d.doneOn, onOld);
    const day = dayNumber(d.doneOn);
    if (!best || day > dayNumber(best.done.doneOn) || (day === dayNumber(best.done.doneOn) && equivalentH > best.equivalentH)) {
      best = { done: d, equivalentH };
    }
  }
  return best;
}

function checkAgainstReadings(fn: string, kind: string, doneOn: string, equivalentH: number, readings: EquivalentReading[]): void {
  const day = dayNumber(doneOn);
  for (const r of readings) {
    const rd = dayNumber(r.date);
    if ((rd < day && r.equivalentH > equivalentH + 1e-9) || (rd > day && r.equivalentH < equivalentH - 1e-9)) {
      throw new Error(`${fn}: the ${kind} done on ${doneOn} does not fit the reading ${r.readingH} h on ${r.date}`);
    }
  }
}

/**
 * Hours since each maintenance kind of a set, and hours left to its due, on the date of the latest reading.
 *
 * Method: every reading and every recorded piece of work is placed on the set's continuous hour scale
 * (`equivalentReadings`); hours since = current equivalent − equivalent at the latest work of that kind. So with a
 * meter replaced between the work and today, the count is the old meter's hours after the work up to its final
 * reading plus the new meter's hours from its start reading. Due point = work + interval; hours left = interval −
 * hours since. A kind with no work recorded counts from equivalent reading 0 (basis 'since-new').
 * Counting rule: common practice (running hours since the last overhaul, by the hour meter).
 *
 * Cost O(k·(w + n) + n·m) for k kinds, w pieces of work, n readings, m replacements. Throws when there is no
 * reading on or before asOfDate, on the problems `equivalentReadings` refuses, on an interval that is not positive
 * (months: a positive whole number), and on work whose reading lies outside the meter then fitted or does not fit
 * the readings before and after it.
 *
 * @example hoursSinceMaintenance({
 *   gensetId: 'DG1', kinds: [{ kind: 'top', intervalHours: 12000 }],
 *   readings: [{ date: '2026-06-30', readingH: 9990 }, { date: '2026-07-01', readingH: 14 }],
 *   replacements: [{ date: '2026-07-01', oldFinalReading: 10000, newStartReading: 0 }],
 *   done: [{ kind: 'top', doneOn: '2026-01-10', readingH: 6000 }],
 * })[0] // { hoursSince: 4014, hoursLeft: 7986, dueAtMeterReadingH: 8000, ... }
 */
export function hoursSinceMaintenance(record: GensetHoursRecord, options: { asOfDate?: string } = {}): MaintenanceStatus[] {
  const fn = 'hoursSinceMaintenance';
  const all = equivalentReadings(record.readings, record.replacements ?? []);
  const asOf = options.asOfDate === undefined ? Infinity : dayNumber(options.asOfDate);
  const readings = all.filter((r) => dayNumber(r.date) <= asOf);
  if (readings.length === 0) {
    throw new Error(`${fn} requires at least one hour-meter reading${options.asOfDate ? ` on or before ${options.asOfDate}` : ''} for ${record.gensetId}`);
  }
  const scale = new HourScale(fn, record.replacements ?? []);
  const current = readings[readings.length - 1];
  const meterOffsetNowH = scale.offsetH(current.date);
  const seen = new Set<string>();
  return record.kinds.map((k) => {
    if (seen.has(k.kind)) throw new Error(`${fn} requires each maintenance kind once (${k.kind} appears twice)`);
    seen.add(k.kind);
    if (!(k.intervalHours > 0) || !Number.isFinite(k.intervalHours)) throw new Error(`${fn} requires a positive interval in hours for ${k.kind}`);
    const months = k.intervalMonths ?? null;
    if (months !== null && !(Number.isInteger(months) && months > 0)) throw new Error(`${fn} requires the interval in months of ${k.kind} to be a positive whole number`);
    const last = latestDone(fn, record.done ?? [], k.kind, dayNumber(current.date), scale);
    if (last) {
      checkAgainstReadings(fn, k.kind, last.done.doneOn, last.equivalentH, readings);
      if (last.equivalentH > current.equivalentH + 1e-9) {
        throw new Error(`${fn}: the ${k.kind} done on ${last.done.doneOn} lies past the latest reading (${current.readingH} h on ${current.date})`);
      }
    }
    const lastDoneEquivalentH = last ? last.equivalentH : 0;
    const dueAtEquivalentH = lastDoneEquivalentH + k.intervalHours;
    const hoursSince = current.equivalentH - lastDoneEquivalentH;
    const fromDay = last ? dayNumber(last.done.doneOn) : -Infinity;
    const reached = readings.find((r) => dayNumber(r.date) >= fromDay && r.equivalentH >= dueAtEquivalentH);
    return {
      gensetId: record.gensetId,
      kind: k.kind,
      intervalHours: k.intervalHours,
      intervalMonths: months,
      basis: last ? 'recorded' : 'since-new',
      lastDoneOn: last ? last.done.doneOn : null,
      asOfDate: current.date,
      lastDoneEquivalentH,
      currentEquivalentH: current.equivalentH,
      dueAtEquivalentH,
      dueAtMeterReadingH: dueAtEquivalentH - meterOffsetNowH,
      hoursSince,
      hoursLeft: k.intervalHours - hoursSince,
      dueReachedOn: reached ? reached.date : null,
    };
  });
}
