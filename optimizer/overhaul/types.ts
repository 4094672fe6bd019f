/**
 * Types of the running-hours and overhaul computations: meter readings, maintenance kinds and their due status.
 *
 * Hours are counted on one continuous scale per set, the "equivalent reading": the reading the set's first hour
 * meter would show had it never been replaced. A replacement adds (old meter's final − new meter's start) to every
 * later reading. A due point on that scale does not move when a meter is replaced later, so it can key an alert.
 */
import type { MeterReplacement } from '../logs/meter-delta';

/** A cumulative running-hour meter reading logged on a date (YYYY-MM-DD). */
export interface HourMeterReading {
  date: string;
  readingH: number;
}

/**
 * A recorded meter replacement (or rollover) on a date. As in the daily logs, a reading dated on the replacement
 * day is on the new meter.
 */
export interface DatedMeterReplacement extends MeterReplacement {
  date: string;
}

/** A kind of maintenance of a set with the maker's interval (entered, never assumed). */
export interface MaintenanceKind {
  kind: string;
  intervalHours: number;
  /** Calendar interval, months; null or absent when only running hours count. */
  intervalMonths?: number | null;
}

/** Maintenance work done: its kind, the date and the hour-meter reading then. */
export interface MaintenanceDone {
  kind: string;
  doneOn: string;
  /** Reading of the meter fitted at the time, h. */
  readingH: number;
  /**
   * Only for work done on a meter-replacement day: true when the reading is the OLD meter's (work done before the
   * meter was changed). Otherwise a reading on a replacement day is on the new meter.
   */
  onOldMeter?: boolean;
}

/** Everything known about one set's hours. */
export interface GensetHoursRecord {
  gensetId: string;
  readings: HourMeterReading[];
  replacements?: DatedMeterReplacement[];
  kinds: MaintenanceKind[];
  /** Work done (recorded last overhauls and maintenance events); the latest per kind resets its interval. */
  done?: MaintenanceDone[];
}

/** Where one maintenance kind of one set stands on the date of its latest reading. */
export interface MaintenanceStatus {
  gensetId: string;
  kind: string;
  intervalHours: number;
  intervalMonths: number | null;
  /** 'recorded': counted from the latest work done; 'since-new': none recorded, counted from equivalent reading 0. */
  basis: 'recorded' | 'since-new';
  lastDoneOn: string | null;
  /** Date of the latest reading (the "today" of the count). */
  asOfDate: string;
  lastDoneEquivalentH: number;
  currentEquivalentH: number;
  /** Equivalent reading at which the kind falls due: lastDone + interval. */
  dueAtEquivalentH: number;
  /** The same due point on the meter fitted now, h. */
  dueAtMeterReadingH: number;
  hoursSince: number;
  /** interval − hoursSince; ≤ 0 when overdue by hours. */
  hoursLeft: number;
  /** Date of the first reading at or past the due point; null while it is not reached. */
  dueReachedOn: string | null;
}
