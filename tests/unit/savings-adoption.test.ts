import { linearRegression, tTestTwoSample } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { createRng } from '../../optimizer/random';
import { adoptionEffect, adoptionPointsFromDays, vesselSavings } from '../../optimizer/savings/index';
import type { AdoptionPoint, SavingsDay } from '../../optimizer/savings/index';
import { plainRule, twinUnits } from '../fixtures/savings/plants';

const TOL = 1e-9;

/** Seeded daily plant points: SFOC = 260 − 120·x + 70·x² + δ·after + N(0, 3²) g/kWh, x the load fraction. */
function generatedPoints(seed: number, deltaGPerKwh: number, days = 80): AdoptionPoint[] {
  const rng = createRng(seed);
  const out: AdoptionPoint[] = [];
  for (let i = 0; i < days; i++) {
    const date = new Date(Date.UTC(2024, 0, 1 + i)).toISOString().slice(0, 10);
    const after = i >= days / 2 ? 1 : 0;
    const x = 0.3 + 0.5 * rng.uniform();
    const sfoc = 260 - 120 * x + 70 * x * x + deltaGPerKwh * after + rng.normal(0, 3);
    const energyKwh = 20_000 * x;
    out.push({ date, energyKwh, fuelKg: (sfoc * energyKwh) / 1000, loadFraction: x });
  }
  return out;
}

describe('adoptionEffect: regression with a before/after indicator', () => {
  it('linear model: δ and its SE checked by Frisch–Waugh–Lovell with simple-statistics linearRegression', () => {
    // FWL theorem (Davidson & MacKinnon, Econometric Theory and Methods, §2.4): δ equals the slope of the
    // residuals of SFOC on (1, x) against the residuals of the indicator on (1, x).
    const points = generatedPoints(11, -5);
    const r = adoptionEffect(points, '2024-02-10', { loadModel: 'linear' });
    const sfoc = points.map((p) => (1000 * p.fuelKg) / p.energyKwh);
    const after = points.map((p) => (p.date >= '2024-02-10' ? 1 : 0));
    const residualsOn = (ys: number[]) => {
      const { m, b } = linearRegression(points.map((p, i) => [p.loadFraction, ys[i]]));
      return ys.map((y, i) => y - (m * points[i].loadFraction + b));
    };
    const ry = residualsOn(sfoc);
    const rd = residualsOn(after);
    const slope = linearRegression(rd.map((d, i) => [d, ry[i]])).m;
    expect(Math.abs(r.changeGPerKwh - slope)).toBeLessThan(1e-8);
    // FWL also gives the full model's residuals, so se(δ) = s / √Σ rd², s² = Σ (ry − δ·rd)² / (n − 3).
    const rss = ry.reduce((sum, y, i) => sum + (y - slope * rd[i]) ** 2, 0);
    const se = Math.sqrt(rss / (points.length - 3) / rd.reduce((sum, d) => sum + d * d, 0));
    expect(Math.abs(r.changeSdGPerKwh / se - 1)).toBeLessThan(1e-8);
  });

  it('no difference in load between the groups: δ equals the difference of mean SFOC (simple-statistics tTestTwoSample)', () => {
    // Same two load fractions, equally often, before and after: the load term is orthogonal to the indicator,
    // so δ is the raw difference of means and its t statistic is the pooled two-sample t, whose SE uses n − 2
    // dof against the regression's n − 3: t_reg = t_pooled · √(RSS_pooled/(n−2)) / √(RSS_reg/(n−3)).
    const rng = createRng(5);
    const n = 40;
    const points: AdoptionPoint[] = Array.from({ length: n }, (_, i) => {
      const x = i % 2 === 0 ? 0.5 : 0.7;
      const sfoc = 240 - 30 * x + (i >= n / 2 ? -4 : 0) + rng.normal(0, 3);
      return { date: new Date(Date.UTC(2024, 0, 1 + i)).toISOString().slice(0, 10), energyKwh: 10_000, fuelKg: sfoc * 10, loadFraction: x };
    });
    const r = adoptionEffect(points, points[n / 2].date, { loadModel: 'linear' });
    const sfoc = points.map((p) => p.fuelKg / 10);
    const before = sfoc.slice(0, n / 2);
    const after = sfoc.slice(n / 2);
    const mean = (v: number[]) => v.reduce((s2, x) => s2 + x, 0) / v.length;
    expect(Math.abs(r.changeGPerKwh - (mean(after) - mean(before)))).toBeLessThan(1e-8);
    const ss = (v: number[]) => v.reduce((s2, x) => s2 + (x - mean(v)) ** 2, 0);
    const rssPooled = ss(before) + ss(after);
    const rssRegression = r.residualSdGPerKwh ** 2 * (n - 3);
    const tPooled = tTestTwoSample(after, before, 0)!;
    const expected = (tPooled * Math.sqrt(rssPooled / (n - 2))) / Math.sqrt(rssRegression / (n - 3));
    expect(Math.abs(r.changeGPerKwh / r.changeSdGPerKwh / expected - 1)).toBeLessThan(1e-8);
  });

  it('the 95 % interval of δ covers the true change in 200 seeded trials at 0.91–0.99', () => {
    // OLS t interval is exact under normal noise; binomial SD over 200 trials ≈ 0.015, range ≈ ±3 SD.
    let hits = 0;
    for (let trial = 0; trial < 200; trial++) {
      const r = adoptionEffect(generatedPoints(500 + trial, -4), '2024-02-10');
      if (r.changeLowerGPerKwh <= -4 && -4 <= r.changeUpperGPerKwh) hits++;
    }
    expect(hits / 200).toBeGreaterThanOrEqual(0.91);
    expect(hits / 200).toBeLessThanOrEqual(0.99);
  });

  it('fuel saved after adoption is −δ × energy after, in tonnes', () => {
    const points = generatedPoints(8, -6);
    const r = adoptionEffect(points, '2024-02-10');
    const energyAfter = points.filter((p) => p.date >= '2024-02-10').reduce((s, p) => s + p.energyKwh, 0);
    expect(Math.abs(r.fuelSavedAfterT.value - (-r.changeGPerKwh * energyAfter) / 1e6)).toBeLessThan(TOL);
    expect(r.daysBefore).toBe(40);
  });

  it('points from costed days: load fraction on the installed capacity; bad input throws', () => {
    const days: SavingsDay[] = [400, 500].map((loadKw, i) => ({
      date: `2024-03-0${i + 1}`,
      modeHours: { sea: 24 },
      sets: [{ unitId: 'DG1', hoursRun: 24, kwh: loadKw * 24, measuredFuelKg: 2000 }],
      fuel: { grade: 'MGO' },
    }));
    const costed = vesselSavings({ units: twinUnits, rules: { sea: plainRule(1) }, days }).days;
    const pts = adoptionPointsFromDays(costed, twinUnits);
    expect(pts.map((p) => p.loadFraction)).toEqual([0.2, 0.25]); // 400 / 2000 kW and 500 / 2000 kW by hand
    expect(() => adoptionEffect(pts, '2024-03-02')).toThrow(/at least 2 days before and 2 days after/);
  });
});
