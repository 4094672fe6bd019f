import { describe, expect, it } from 'vitest';
import { checkLogSeries, dateOfDayNumber, dayNumber, deriveGensetSeries } from '../../optimizer/logs';
import type { DailyRowContext, RawDailyLog } from '../../optimizer/logs';
import { createRng } from '../../optimizer/random';

describe('dayNumber', () => {
  // Calendar facts (Gregorian calendar): 2024 is a leap year, 2026 is not; 1970-01-01 is day 0 of the Unix epoch.
  it('counts days across month ends and leap years', () => {
    expect(dayNumber('1970-01-01')).toBe(0);
    expect(dayNumber('2024-03-01') - dayNumber('2024-02-28')).toBe(2);
    expect(dayNumber('2026-03-01') - dayNumber('2026-02-28')).toBe(1);
    expect(dateOfDayNumber(dayNumber('2026-12-31') + 1)).toBe('2027-01-01');
  });
  it('throws on malformed or impossible dates', () => {
    expect(() => dayNumber('2026-02-30')).toThrow(/YYYY-MM-DD/);
    expect(() => dayNumber('02/03/2026')).toThrow(/YYYY-MM-DD/);
  });
});

describe('checkLogSeries: MISSING_DAY and DUPLICATE_DATE', () => {
  it('flags a gap and a duplicate, per genset', () => {
    const flags = checkLogSeries([
      { gensetId: 'DG1', date: '2026-02-27' },
      { gensetId: 'DG1', date: '2026-03-02' },
      { gensetId: 'DG1', date: '2026-03-02' },
      { gensetId: 'DG2', date: '2026-02-28' },
      { gensetId: 'DG2', date: '2026-03-01' },
    ]);
    // Hand: DG1 misses 02-28 and 03-01 (2026 is not a leap year) and has 03-02 twice; DG2 is complete.
    expect(flags.map((f) => [f.gensetId, f.date, f.flag.code])).toEqual([
      ['DG1', '2026-02-28', 'MISSING_DAY'],
      ['DG1', '2026-03-01', 'MISSING_DAY'],
      ['DG1', '2026-03-02', 'DUPLICATE_DATE'],
    ]);
    expect(flags[2].flag.severity).toBe('error');
    expect(flags[0].flag.field).toBe('date');
  });

  it('does not fire on a complete series, and widens to from/to', () => {
    const rows = ['2026-01-30', '2026-01-31', '2026-02-01'].map((date) => ({ gensetId: 'DG1', date }));
    expect(checkLogSeries(rows)).toEqual([]);
    expect(checkLogSeries(rows, { from: '2026-01-29', to: '2026-02-02' }).map((f) => f.date)).toEqual(['2026-01-29', '2026-02-02']);
  });

  // Seeded random check against a direct count: for a random subset of 60 days with random duplicates, the
  // number of MISSING_DAY flags equals (span − distinct days) and DUPLICATE_DATE equals days with > 1 row.
  it('agrees with a direct count on seeded random series', () => {
    const rng = createRng(20260301);
    for (let trial = 0; trial < 20; trial++) {
      const rows: { gensetId: string; date: string }[] = [];
      const counts = new Map<number, number>();
      for (let d = 0; d < 60; d++) {
        const n = rng.uniform() < 0.2 ? 0 : rng.uniform() < 0.1 ? 2 : 1;
        for (let k = 0; k < n; k++) rows.push({ gensetId: 'DG1', date: dateOfDayNumber(20_000 + d) });
        if (n) counts.set(d, n);
      }
      const days = [...counts.keys()];
      const span = Math.max(...days) - Math.min(...days) + 1;
      const flags = checkLogSeries(rows);
      expect(flags.filter((f) => f.flag.code === 'MISSING_DAY').length).toBe(span - days.length);
      expect(flags.filter((f) => f.flag.code === 'DUPLICATE_DATE').length).toBe([...counts.values()].filter((n) => n > 1).length);
    }
  });
});

describe('deriveGensetSeries', () => {
  const ctx: DailyRowContext = {
    ratedKw: 1000,
    minLoadPct: 30,
    lot: { grade: 'MGO', density15KgPerM3: 850, lcvKjPerKg: 42_700 },
    previous: { runningHoursReadingH: 100, energyReadingKwh: 50_000 },
  };
  const log = (date: string, h: number, kwh: number): RawDailyLog => ({
    date,
    gensetId: 'DG1',
    runningHours: { kind: 'cumulative', readingH: h },
    energy: { kind: 'cumulative', readingKwh: kwh },
    fuel: { kind: 'mass', value: 2.2, unit: 't' },
  });

  it('carries readings day to day (input order does not matter)', () => {
    const { rows, seriesFlags } = deriveGensetSeries([log('2026-03-02', 140, 70_000), log('2026-03-01', 120, 60_000)], ctx);
    // Hand: day 1: 120 − 100 = 20 h, 60 000 − 50 000 = 10 000 kWh; day 2: 20 h, 10 000 kWh; SFOC 220 g/kWh.
    expect(rows.map((r) => [r.date, r.hoursRun, r.kwh, r.sfocObservedGPerKwh])).toEqual([
      ['2026-03-01', 20, 10_000, 220],
      ['2026-03-02', 20, 10_000, 220],
    ]);
    expect(seriesFlags).toEqual([]);
  });

  it('does not charge two days to one after a gap, and marks duplicates', () => {
    const { rows, seriesFlags } = deriveGensetSeries(
      [log('2026-03-01', 120, 60_000), log('2026-03-03', 160, 80_000), log('2026-03-04', 180, 90_000), log('2026-03-04', 180, 90_000)],
      ctx,
    );
    expect(seriesFlags.map((s) => [s.date, s.flag.code])).toEqual([['2026-03-02', 'MISSING_DAY']]);
    expect(rows[1].flags.map((f) => f.code)).toEqual(['METER_PREVIOUS_MISSING', 'METER_PREVIOUS_MISSING']);
    expect(rows[2].flags.map((f) => f.code)).toEqual(['DUPLICATE_DATE']);
    expect(rows[2].usable).toBe(false);
    expect(rows[3].flags.map((f) => f.code)).toContain('DUPLICATE_DATE');
  });

  it('throws on logs of several gensets', () => {
    expect(() => deriveGensetSeries([log('2026-03-01', 1, 1), { ...log('2026-03-01', 1, 1), gensetId: 'DG2' }], ctx)).toThrow(/one genset/);
  });
});
