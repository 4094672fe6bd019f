/**
 * Exact load sharing of the planner's inner loop against HiGHS (general-purpose LP/QP solver, npm `highs`):
 * convex quadratic curves as a QP, chord-segment curves as an LP.
 */
import { describe, expect, it } from 'vitest';
import { chordCurve, type GensetUnit } from '../../optimizer/plant';
import { createRng } from '../../optimizer/random';
import { modelFuelKgPerH, shareLoad, unitCostModel } from '../../optimizer/plan/load-sharing';
import { loadHighs } from '../../optimizer/plan/plan-milp';

/** Relative tolerance between our fuel rate and HiGHS's optimum. */
const FUEL_REL_TOL = 1e-6;

function randomUnits(seed: number, count: number, segments: number): GensetUnit[] {
  const rng = createRng(seed);
  return Array.from({ length: count }, (_, i) => {
    const ratedKw = [500, 800, 1200][rng.int(0, 2)];
    const quad = { kind: 'quadratic' as const, a: 10 + 30 * rng.uniform(), b: 0.15 + 0.05 * rng.uniform(), c: (2e-5 + 6e-5 * rng.uniform()) * (1000 / ratedKw) };
    const minLoadPct = rng.int(15, 40);
    const maxLoadPct = rng.int(85, 100);
    return {
      id: `u${i}`,
      name: `U${i}`,
      ratedKw,
      minLoadPct,
      maxLoadPct,
      curve: segments ? chordCurve(quad, (ratedKw * minLoadPct) / 100, (ratedKw * maxLoadPct) / 100, segments) : quad,
      busSection: 'A',
      available: true,
      mustRun: false,
      startCostKg: 0,
      minUpH: 0,
      minDownH: 0,
    };
  });
}

describe('shareLoad against HiGHS', () => {
  it('quadratic curves: 60 seeded cases match the HiGHS QP optimum', async () => {
    const highs = await loadHighs();
    for (let seed = 1; seed <= 60; seed++) {
      const units = randomUnits(seed, 1 + (seed % 6), 0);
      const models = units.map(unitCostModel);
      const lo = models.reduce((s, m) => s + m.minKw, 0);
      const hi = models.reduce((s, m) => s + m.maxKw, 0);
      const loadKw = lo + (hi - lo) * createRng(seed + 99).uniform();
      const ours = shareLoad(models, loadKw)!;
      // The QP is written in MW (p = load / 1000): in kW the tiny quadratic coefficients made HiGHS's QP
      // solver cycle on some cases.
      const lin = models.map((m, i) => `+ ${m.b * 1e3} p${i}`).join(' ');
      const quad = models.map((m, i) => `+ ${2 * m.c * 1e6} p${i}^2`).join(' ');
      const lp = `Minimize\n obj: ${lin} + [ ${quad} ] / 2\nSubject To\n bal: ${models.map((_, i) => `+ p${i}`).join(' ')} = ${loadKw / 1e3}\nBounds\n${models.map((m, i) => ` ${m.minKw / 1e3} <= p${i} <= ${m.maxKw / 1e3}`).join('\n')}\nEnd\n`;
      const ref = highs.solve(lp, { output_flag: false, time_limit: 5 });
      expect(ref.Status, `seed ${seed}`).toBe('Optimal');
      const refFuel = models.reduce((s, m, i) => s + modelFuelKgPerH(m, 1e3 * (ref.Columns[`p${i}`] as { Primal: number }).Primal), 0);
      expect(Math.abs(ours.fuelKgPerH - refFuel) / refFuel, `seed ${seed}`).toBeLessThan(FUEL_REL_TOL);
      expect(Math.abs(ours.loadsKw.reduce((a, b) => a + b, 0) - loadKw)).toBeLessThan(1e-6 * loadKw);
    }
  });

  it('chord-segment curves: 60 seeded cases match the HiGHS LP optimum', async () => {
    const highs = await loadHighs();
    for (let seed = 1; seed <= 60; seed++) {
      const units = randomUnits(seed, 1 + (seed % 6), 4 + (seed % 3));
      const models = units.map(unitCostModel);
      const lo = models.reduce((s, m) => s + m.minKw, 0);
      const hi = models.reduce((s, m) => s + m.maxKw, 0);
      const loadKw = lo + (hi - lo) * createRng(seed + 99).uniform();
      const ours = shareLoad(models, loadKw)!;
      const obj: string[] = [];
      const bal: string[] = [];
      const bounds: string[] = [];
      let constant = 0;
      models.forEach((m, i) => {
        constant += m.fuelAtMinKgPerH;
        m.widthsKw.forEach((w, k) => {
          obj.push(`+ ${m.slopesKgPerKwh[k]} x${i}_${k}`);
          bal.push(`+ x${i}_${k}`);
          bounds.push(` 0 <= x${i}_${k} <= ${w}`);
        });
      });
      const lp = `Minimize\n obj: ${obj.join(' ')}\nSubject To\n bal: ${bal.join(' ')} = ${loadKw - lo}\nBounds\n${bounds.join('\n')}\nEnd\n`;
      const ref = highs.solve(lp, { output_flag: false, time_limit: 5 });
      expect(ref.Status, `seed ${seed}`).toBe('Optimal');
      const refFuel = constant + ref.ObjectiveValue;
      expect(Math.abs(ours.fuelKgPerH - refFuel) / refFuel, `seed ${seed}`).toBeLessThan(FUEL_REL_TOL);
    }
  });

  it('returns null outside the combined range and throws on a concave curve', () => {
    const models = randomUnits(3, 2, 0).map(unitCostModel);
    const hi = models.reduce((s, m) => s + m.maxKw, 0);
    expect(shareLoad(models, hi * 1.01)).toBeNull();
    const bad = { ...randomUnits(3, 1, 0)[0], curve: { kind: 'quadratic' as const, a: 1, b: 0.2, c: -1e-5 } };
    expect(() => unitCostModel(bad)).toThrow('convex');
  });
});
