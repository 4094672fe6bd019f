import { describe, expect, it } from 'vitest';
import {
  addCalendarMonths,
  dailyHoursFromPlan,
  equivalentReadings,
  forecastDue,
  hoursSinceMaintenance,
  usageRate,
} from '../../optimizer/overhaul';
import { DG1_HOURS } from '../fixtures/overhaul/dg1-hours';

/** Hours are sums and differences of logged figures: exact up to floating-point rounding. */
const HOURS_TOL = 1e-9;

/** Reference date arithmetic: the platform's Date in UTC (ECMAScript Date, a general reference library). */
function plusDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

describe('hoursSinceMaintenance (hand-computed fixture, tests/fixtures/overhaul/dg1-hours.ts)', () => {
  const byKind = Object.fromEntries(hoursSinceMaintenance(DG1_HOURS).map((s) => [s.kind, s]));

  it('counts the top overhaul across the meter replacement: 75 h on the old meter + 305 h on the new one', () => {
    const top = byKind.top;
    expect(top.asOfDate).toBe('2026-03-31');
    expect(top.basis).toBe('recorded');
    expect(top.lastDoneOn).toBe('2026-03-02');
    expect(top.hoursSince).toBeCloseTo(380, 9);
    expect(top.hoursLeft).toBeCloseTo(12000 - 380, 9);
    // Due point 9520 + 12000 = 21520 h equivalent; on the new meter 21520 − 9595 = 11925 h (hand).
    expect(Math.abs(top.dueAtEquivalentH - 21520)).toBeLessThan(HOURS_TOL);
    expect(Math.abs(top.dueAtMeterReadingH - 11925)).toBeLessThan(HOURS_TOL);
    expect(top.dueReachedOn).toBeNull();
  });

  it('uses the latest work of a kind, counts work before the log, on the new meter, and since new', () => {
    expect(byKind.major.hoursSince).toBeCloseTo(9800, 9);
    expect(byKind.inspection.hoursSince).toBeCloseTo(300, 9);
    expect(byKind.inspection.hoursLeft).toBeCloseTo(200, 9);
    expect(byKind.governor.basis).toBe('since-new');
    expect(byKind.governor.hoursSince).toBeCloseTo(9900, 9);
  });

  it('counts as of an earlier date, before the replacement (9580 − 9520 = 60 h, hand)', () => {
    const top = hoursSinceMaintenance(DG1_HOURS, { asOfDate: '2026-03-05' }).find((s) => s.kind === 'top')!;
    expect(top.hoursSince).toBeCloseTo(60, 9);
  });

  it('takes work marked on the old meter on the replacement day: (9595 − 9590) + 305 = 310 h (hand)', () => {
    const record = { ...DG1_HOURS, kinds: [{ kind: 'top', intervalHours: 12000 }], done: [{ kind: 'top', doneOn: '2026-03-06', readingH: 9590, onOldMeter: true }] };
    expect(hoursSinceMaintenance(record)[0].hoursSince).toBeCloseTo(310, 9);
    const unmarked = { ...record, done: [{ kind: 'top', doneOn: '2026-03-06', readingH: 9590 }] };
    expect(() => hoursSinceMaintenance(unmarked)).toThrow('hoursSinceMaintenance: the top done on 2026-03-06 does not fit the reading 305 h on 2026-03-31');
  });

  it('reports the date an overdue due was reached (first reading at or past it)', () => {
    const record = { ...DG1_HOURS, kinds: [{ kind: 'inspection', intervalHours: 50 }], done: [{ kind: 'inspection', doneOn: '2026-03-01', readingH: 9500 }] };
    const s = hoursSinceMaintenance(record)[0];
    expect(s.hoursLeft).toBeCloseTo(50 - 400, 9);
    expect(s.dueReachedOn).toBe('2026-03-05'); // 9580 − 9500 = 80 ≥ 50; 03-02 had 20 (hand)
    expect(forecastDue(s, { hPerDay: 12 })).toMatchObject({ dueByHoursDate: '2026-03-05', overdue: true, daysLeft: -26 });
  });

  it('refuses a fall of the meter that no replacement explains, and work that does not fit the readings', () => {
    const fall = { ...DG1_HOURS, replacements: [] };
    expect(() => hoursSinceMaintenance(fall)).toThrow('equivalentReadings: the reading 5 h on 2026-03-06 is below the reading 9580 h on 2026-03-05 with no meter replacement recorded between them');
    const misfit = { ...DG1_HOURS, done: [{ kind: 'top', doneOn: '2026-03-02', readingH: 9590 }] };
    expect(() => hoursSinceMaintenance(misfit)).toThrow('hoursSinceMaintenance: the top done on 2026-03-02 does not fit the reading 9580 h on 2026-03-05');
    expect(() => hoursSinceMaintenance({ ...DG1_HOURS, readings: [] })).toThrow('hoursSinceMaintenance requires at least one hour-meter reading for DG1');
    expect(() => hoursSinceMaintenance({ ...DG1_HOURS, kinds: [{ kind: 'x', intervalHours: 0 }] })).toThrow(/positive interval/);
  });

  it('places readings on one scale: the equivalent readings (hand: 9500, 9520, 9580, 9600, 9900)', () => {
    expect(equivalentReadings(DG1_HOURS.readings, DG1_HOURS.replacements).map((r) => r.equivalentH)).toEqual([9500, 9520, 9580, 9600, 9900]);
    // Two replacements between two readings: 90 → 100 | 0 → 50 | 10 → 20: 10 + 50 + 10 = 70 h (hand).
    const twice = equivalentReadings(
      [{ date: '2026-01-01', readingH: 90 }, { date: '2026-01-05', readingH: 20 }],
      [{ date: '2026-01-02', oldFinalReading: 100, newStartReading: 0 }, { date: '2026-01-04', oldFinalReading: 50, newStartReading: 10 }],
    );
    expect(twice[1].equivalentH - twice[0].equivalentH).toBe(70);
  });
});

describe('usageRate (hand-computed, missing days count as elapsed time)', () => {
  it('30-day window: (9900 − 9500) / 30 days = 13.333 h/day', () => {
    const r = usageRate(DG1_HOURS.readings, DG1_HOURS.replacements ?? [], { windowDays: 30 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.hPerDay).toBeCloseTo(400 / 30, 12);
    expect(r).toMatchObject({ fromDate: '2026-03-01', toDate: '2026-03-31', spanDays: 30, daysWithoutReading: 26, shortWindow: false });
  });

  it('10-day window reaches back to the last reading before it: (9900 − 9600) / 25 = 12 h/day', () => {
    const r = usageRate(DG1_HOURS.readings, DG1_HOURS.replacements ?? [], { windowDays: 10 });
    expect(r).toMatchObject({ ok: true, fromDate: '2026-03-06', spanDays: 25 });
    if (r.ok) expect(r.hPerDay).toBeCloseTo(12, 12);
  });

  it('90-day window is short (no reading that far back) and one reading gives a reason', () => {
    const r = usageRate(DG1_HOURS.readings, DG1_HOURS.replacements ?? [], { windowDays: 90 });
    expect(r).toMatchObject({ ok: true, fromDate: '2026-03-01', shortWindow: true });
    expect(usageRate([{ date: '2026-03-01', readingH: 5 }], [], { windowDays: 30 })).toEqual({ ok: false, reason: 'fewer than two hour-meter readings' });
  });
});

describe('forecastDue (hand-computed dates; Date in UTC as reference)', () => {
  const byKind = Object.fromEntries(hoursSinceMaintenance(DG1_HOURS).map((s) => [s.kind, s]));

  it('top: 11 620 h at 12 h/day = 969 days → 2028-11-24, but 24 months after 2026-03-02 is earlier: months win', () => {
    const f = forecastDue(byKind.top, { hPerDay: 12 });
    expect(f.dueByHoursDate).toBe('2028-11-24');
    expect(f.dueByHoursDate).toBe(plusDays('2026-03-31', 969));
    expect(f).toMatchObject({ dueByMonthsDate: '2028-03-02', dueDate: '2028-03-02', governedBy: 'months', overdue: false });
  });

  it('major: 14 200 h at 12 h/day = ⌈1183.3⌉ = 1184 days → 2029-06-27, by hours only', () => {
    const f = forecastDue(byKind.major, { hPerDay: 12 });
    expect(f).toMatchObject({ dueByHoursDate: '2029-06-27', dueByMonthsDate: null, governedBy: 'hours', daysLeft: 1184 });
    expect(f.dueByHoursDate).toBe(plusDays('2026-03-31', 1184));
    expect(forecastDue(byKind.major, { hPerDay: 0 })).toMatchObject({ dueByHoursDate: null, dueDate: null, governedBy: null });
  });

  it('inspection under a planned profile: 200 h left, 20 h/day with 2026-04-03 not planned → 2026-04-11', () => {
    const profile = Array.from({ length: 12 }, (_, i) => ({ date: plusDays('2026-03-31', i + 1), hours: 20 })).filter((p) => p.date !== '2026-04-03');
    expect(forecastDue(byKind.inspection, { profile }).dueDate).toBe('2026-04-11');
    const short = profile.slice(0, 2); // 40 h by 04-02, then 160 h at 10 h/day = 16 days → 04-18
    expect(forecastDue(byKind.inspection, { profile: short, afterHPerDay: 10 }).dueDate).toBe('2026-04-18');
    expect(forecastDue(byKind.inspection, { profile: short }).dueDate).toBeNull();
    expect(() => forecastDue(byKind.inspection, { profile: [{ date: '2026-04-01', hours: 25 }] })).toThrow(/between 0 and 24/);
  });

  it('adds calendar months with the month-end clamp (31 Jan + 1 = 28 Feb; 2028 is a leap year)', () => {
    expect(addCalendarMonths('2026-01-31', 1)).toBe('2026-02-28');
    expect(addCalendarMonths('2028-01-31', 1)).toBe('2028-02-29');
    expect(addCalendarMonths('2026-11-15', 3)).toBe('2027-02-15');
  });
});

describe('dailyHoursFromPlan (hand-computed split at midnight)', () => {
  it('splits periods of 30, 10 and 8 h starting 20:00 across days', () => {
    const out = dailyHoursFromPlan(
      [{ durationH: 30 }, { durationH: 10 }, { durationH: 8 }],
      [{ runningIds: ['DG1', 'DG2'] }, { runningIds: ['DG1'] }, { runningIds: ['DG2'] }],
      '2026-05-01',
      20,
    );
    // DG1 runs hours 20–60: 4 + 24 + 12; DG2 runs 20–50 and 60–68: 4 + 24 + (2 + 8).
    expect(out.DG1).toEqual([{ date: '2026-05-01', hours: 4 }, { date: '2026-05-02', hours: 24 }, { date: '2026-05-03', hours: 12 }]);
    expect(out.DG2).toEqual([{ date: '2026-05-01', hours: 4 }, { date: '2026-05-02', hours: 24 }, { date: '2026-05-03', hours: 10 }]);
    expect(() => dailyHoursFromPlan([{ durationH: 1 }], [], '2026-05-01')).toThrow(/one planned period per plan period/);
  });
});
