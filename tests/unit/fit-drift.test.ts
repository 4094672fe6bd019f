import { mean, sampleStandardDeviation, weightedLinearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { fitDrift, generateDailyLogs } from '../../optimizer/fit';
import type { QuadraticFuelCurve } from '../../optimizer/plant';
import { createRng } from '../../optimizer/random';

const CURVE: QuadraticFuelCurve = { kind: 'quadratic', a: 60, b: 0.045, c: 1e-4 };
const RATED_KW = 1000;
const EXACT_REL_TOL = 1e-9;
const TRIALS = 100;
/** binomial(100, 0.95): SD ≈ 2.2 %, so 88 % is −3.2 SD; the top is open (an interval may be slightly wide). */
const COVERAGE_MIN = 0.88;

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe('per-point drift slope', () => {
  const points = generateDailyLogs(createRng(31), { curve: CURVE, ratedKw: RATED_KW, days: 365, driftGPerKwhPer1000h: 2 });

  it('non-robust: the weighted regression of the moved SFOC on hours (simple-statistics weightedLinearRegression)', () => {
    const drift = fitDrift(points, { ratedKw: RATED_KW, shape: { curve: CURVE }, robust: 'none' });
    const line = weightedLinearRegression(
      drift.daySfoc.map((d) => [d.hoursSinceOverhaul / 1000, d.sfocGPerKwh]),
      drift.daySfoc.map((d) => d.weight),
    );
    expect(rel(drift.slopeGPerKwhPer1000h, line.m)).toBeLessThan(EXACT_REL_TOL);
    expect(rel(drift.interceptGPerKwh, line.b)).toBeLessThan(EXACT_REL_TOL);
    expect(drift.referenceLoadKw).toBe(750);
  });

  it(`95 % interval covers the simulated drift (2 g/kWh per 1000 h) in ≥ 88 % of ${TRIALS} seeded trials`, () => {
    let hits = 0;
    for (let s = 0; s < TRIALS; s++) {
      const pts = generateDailyLogs(createRng(5000 + s), { curve: CURVE, ratedKw: RATED_KW, days: 300, driftGPerKwhPer1000h: 2 });
      const r = fitDrift(pts, { ratedKw: RATED_KW });
      if (r.slopeInterval.lower <= 2 && 2 <= r.slopeInterval.upper) hits++;
    }
    expect(hits / TRIALS).toBeGreaterThanOrEqual(COVERAGE_MIN);
  });
});

describe('drift with gross logging errors late in the cycle (truth of the simulation as reference)', () => {
  it('robust slopes stay within 3 SE (Huber) and 1 SE (Tukey) of the clean slope; the plain one moves > 10 SE', () => {
    const clean = generateDailyLogs(createRng(38), { curve: CURVE, ratedKw: RATED_KW, days: 365, driftGPerKwhPer1000h: 2 });
    // A meter fault: every third day of the last 64 logged 40 % high (6 % of all days, a third of the late ones,
    // where they have the most leverage on a slope).
    const dirty = clean.map((p, i) => (i > 300 && i % 3 === 0 ? { ...p, fuelKgPerH: p.fuelKgPerH * 1.4 } : p));
    const reference = fitDrift(clean, { ratedKw: RATED_KW, shape: { curve: CURVE }, robust: 'none' });
    const se = reference.slopeStandardError;
    const slope = (robust: 'huber' | 'tukey' | 'none') => fitDrift(dirty, { ratedKw: RATED_KW, robust }).slopeGPerKwhPer1000h;
    expect(Math.abs(slope('huber') - reference.slopeGPerKwhPer1000h)).toBeLessThan(3 * se);
    expect(Math.abs(slope('tukey') - reference.slopeGPerKwhPer1000h)).toBeLessThan(1 * se);
    expect(Math.abs(slope('none') - reference.slopeGPerKwhPer1000h)).toBeGreaterThan(10 * se);
  });
});

describe('windows and alert', () => {
  it('window mean and standard error with equal hours are the sample mean and s/√n (simple-statistics)', () => {
    const pts = generateDailyLogs(createRng(32), { curve: CURVE, ratedKw: RATED_KW, days: 120, minHoursRun: 24, maxHoursRun: 24 });
    const r = fitDrift(pts, { ratedKw: RATED_KW, shape: { curve: CURVE } });
    for (const w of r.windows) {
      const values = r.daySfoc.filter((d) => d.hoursSinceOverhaul >= w.fromHours && d.hoursSinceOverhaul < w.toHours).map((d) => d.sfocGPerKwh);
      expect(w.days).toBe(values.length);
      expect(rel(w.sfocGPerKwh, mean(values))).toBeLessThan(EXACT_REL_TOL);
      expect(rel(w.standardErrorGPerKwh, sampleStandardDeviation(values) / Math.sqrt(values.length))).toBeLessThan(1e-9);
    }
  });

  it('raises the alert for a drift of 4 g/kWh per 1000 h over ~5000 h (≈ 20 g/kWh, far above 2 %)', () => {
    const pts = generateDailyLogs(createRng(33), { curve: CURVE, ratedKw: RATED_KW, days: 365, driftGPerKwhPer1000h: 4 });
    const r = fitDrift(pts, { ratedKw: RATED_KW });
    expect(r.alert).toBe(true);
    expect(r.excessLowerBoundGPerKwh!).toBeGreaterThan(r.thresholdGPerKwh!);
    expect(r.thresholdGPerKwh!).toBeCloseTo(0.02 * r.baseline!.sfocGPerKwh, 10);
  });

  it('the latest window holds the days of the last 500 running hours', () => {
    const pts = generateDailyLogs(createRng(37), { curve: CURVE, ratedKw: RATED_KW, days: 365 });
    const r = fitDrift(pts, { ratedKw: RATED_KW });
    const last = Math.max(...pts.map((p) => p.hoursSinceOverhaul!));
    expect(r.latest!.days).toBe(pts.filter((p) => p.hoursSinceOverhaul! > last - 500).length);
    expect(r.latest!.days).toBeGreaterThan(10);
  });

  it('stays silent without drift in every one of 50 seeded records', () => {
    for (let s = 0; s < 50; s++) {
      const pts = generateDailyLogs(createRng(7000 + s), { curve: CURVE, ratedKw: RATED_KW, days: 365 });
      const r = fitDrift(pts, { ratedKw: RATED_KW });
      expect(r.alertUnavailable).toBeNull();
      expect(r.alert).toBe(false);
    }
  });

  it('uses only the cycle after the last overhaul (hours since overhaul fall back)', () => {
    const before = generateDailyLogs(createRng(34), { curve: CURVE, ratedKw: RATED_KW, days: 200, startDate: '2021-01-01' });
    const after = generateDailyLogs(createRng(35), { curve: CURVE, ratedKw: RATED_KW, days: 100, startDate: '2021-07-20' });
    const r = fitDrift([...after, ...before], { ratedKw: RATED_KW }); // out of order on purpose: sorted by date
    expect(r.days).toBe(100);
    expect(r.skippedPoints).toBe(200);
    expect(new Set(r.daySfoc.map((d) => d.index)).size).toBe(100);
    expect(Math.min(...r.daySfoc.map((d) => d.index))).toBe(0);
  });

  it('throws with too few days', () => {
    const pts = generateDailyLogs(createRng(36), { curve: CURVE, ratedKw: RATED_KW, days: 2 });
    expect(() => fitDrift(pts, { ratedKw: RATED_KW })).toThrow('fitDrift requires at least 3 days with load and hoursSinceOverhaul');
  });
});
