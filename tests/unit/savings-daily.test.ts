import { describe, expect, it } from 'vitest';
import { daySavings } from '../../optimizer/savings/index';
import type { SavingsDay } from '../../optimizer/savings/index';
import { plainRule, SAADAT_74_COEFFICIENTS, saadat74Units, savingsSet, twinUnits } from '../fixtures/savings/plants';

const REL_TOL = 1e-9; // relative, for costs computed in closed form
const LOAD_TOL_KW = 1e-6; // dispatch bisection settles far below this

const bookCost = (i: number, p: number): number => {
  const [a, b, c] = SAADAT_74_COEFFICIENTS[i];
  return a + b * p + c * p * p;
};

/** Equal incremental cost without limits, in closed form (Saadat, Power System Analysis, §7.3, eq. for λ). */
function closedFormDispatch(members: number[], loadKw: number): { loads: number[]; cost: number } | null {
  let num = loadKw;
  let den = 0;
  for (const i of members) {
    const [, b, c] = SAADAT_74_COEFFICIENTS[i];
    num += b / (2 * c);
    den += 1 / (2 * c);
  }
  const lambda = num / den;
  const loads = members.map((i) => (lambda - SAADAT_74_COEFFICIENTS[i][1]) / (2 * SAADAT_74_COEFFICIENTS[i][2]));
  if (loads.some((p) => p < 0 || p > 1000)) return null;
  return { loads, cost: members.reduce((s, i, k) => s + bookCost(i, loads[k]), 0) };
}

function saadatDay(measuredFactor?: number): SavingsDay {
  const third = 800 / 3;
  return {
    date: '2024-03-01',
    modeHours: { sea: 24 },
    sets: saadat74Units.map((u, i) => ({
      unitId: u.id,
      hoursRun: 24,
      kwh: third * 24,
      measuredFuelKg: measuredFactor === undefined ? undefined : bookCost(i, third) * 24 * measuredFactor,
    })),
    fuel: { grade: 'MGO' },
  };
}

describe('daySavings: Saadat, Power System Analysis, Example 7.4 (MW read as kW, $/h as kg/h)', () => {
  const third = 800 / 3;
  const equalBook = bookCost(0, third) + bookCost(1, third) + bookCost(2, third); // 6877.78 $/h by hand
  const optimumBook = bookCost(0, 400) + bookCost(1, 250) + bookCost(2, 150); // published optimum 400 / 250 / 150 MW

  it('the published optimum costs 6682.5 $/h from the book cost functions', () => {
    expect(Math.abs(optimumBook - 6682.5)).toBeLessThan(1e-9 * 6682.5); // Saadat Example 7.4
  });

  it('equal thirds against the published optimum: avoidable and split savings equal the book cost difference', () => {
    const d = daySavings({ units: saadat74Units, rules: { sea: plainRule(3) } }, saadatDay());
    const bookDifferenceKg = (equalBook - optimumBook) * 24; // Saadat Example 7.4: (6877.78 − 6682.5) $/h × 24 h
    expect(d.recommendationFeasible).toBe(true);
    expect(Math.abs(d.modelledActualFuelKg - equalBook * 24)).toBeLessThan(REL_TOL * equalBook * 24);
    expect(Math.abs(d.avoidableFuelKg! - bookDifferenceKg)).toBeLessThan(REL_TOL * equalBook * 24);
    expect(Math.abs(d.splitSavingActualSetsKg! - bookDifferenceKg)).toBeLessThan(REL_TOL * equalBook * 24);
    expect(Math.abs(d.splitSavingRecommendedSetsKg! - bookDifferenceKg)).toBeLessThan(REL_TOL * equalBook * 24);
    expect(Math.abs(d.avoidableFuelKg! / 24 - 195.28)).toBeLessThan(0.005); // 6877.78 − 6682.5 by hand, book rounding
    const loads = d.modes[0].loadsKw;
    [400, 250, 150].forEach((p, i) => expect(Math.abs(loads[`G${i + 1}`] - p)).toBeLessThan(LOAD_TOL_KW)); // book loads
    expect(d.followedRecommendation).toBe(true); // same sets, different split
  });

  it('free commitment: the recommendation equals the cheapest subset by closed-form equal lambda (Saadat §7.3)', () => {
    const d = daySavings({ units: saadat74Units, rules: { sea: plainRule(1) } }, saadatDay());
    let best = Infinity;
    for (let mask = 1; mask < 8; mask++) {
      const members = [0, 1, 2].filter((i) => mask & (1 << i));
      const r = closedFormDispatch(members, 800);
      if (r) best = Math.min(best, r.cost);
    }
    expect(Math.abs(d.recommendedFuelKg! - best * 24)).toBeLessThan(REL_TOL * best * 24);
    expect(Math.abs(d.avoidableFuelKg! - (equalBook - best) * 24)).toBeLessThan(REL_TOL * equalBook * 24);
  });

  it('measured fuel beside the model: residual is measured − modelled actual (2 % by construction)', () => {
    const d = daySavings({ units: saadat74Units, rules: { sea: plainRule(3) } }, saadatDay(1.02));
    expect(Math.abs(d.measuredFuelKg! - 1.02 * equalBook * 24)).toBeLessThan(REL_TOL * equalBook * 24);
    expect(Math.abs(d.residualKg! - 0.02 * equalBook * 24)).toBeLessThan(REL_TOL * equalBook * 24);
    expect(Math.abs(d.residualPct! - 2)).toBeLessThan(1e-9);
  });
});

describe('daySavings: hand-computed twin plant (F = 30 + 0.2 P + 5e-5 P² kg/h per set)', () => {
  const units = twinUnits;
  const both = (loadKw: number, hours = 24): SavingsDay['sets'] => [
    { unitId: 'DG1', hoursRun: hours, kwh: (loadKw / 2) * hours },
    { unitId: 'DG2', hoursRun: hours, kwh: (loadKw / 2) * hours },
  ];

  it('two sets at 250 kW each against one set at 500 kW: (a − c·L²/2) per hour, 570 kg/day by hand', () => {
    const d = daySavings({ units, rules: { sea: plainRule(1) } }, { date: '2024-03-02', modeHours: { sea: 24 }, sets: both(500), fuel: { grade: 'MGO' } });
    // By hand: two sets 2·30 + 0.2·500 + 2·5e-5·250² = 166.25 kg/h; one set 30 + 100 + 12.5 = 142.5 kg/h.
    expect(Math.abs(d.modelledActualFuelKg - 166.25 * 24)).toBeLessThan(1e-9 * 4000);
    expect(Math.abs(d.recommendedFuelKg! - 142.5 * 24)).toBeLessThan(1e-9 * 4000);
    expect(Math.abs(d.avoidableFuelKg! - 570)).toBeLessThan(1e-9 * 4000);
    expect(d.modes[0].unitIds).toHaveLength(1);
    expect(d.splitSavingActualSetsKg!).toBeCloseTo(0, 9); // identical sets: equal split is optimal
    expect(d.followedRecommendation).toBe(false);
  });

  it('LCV of the lot: ISO fuel × 42 700 / LCV (ISO 3046-1 reference LCV)', () => {
    const day: SavingsDay = { date: '2024-03-02', modeHours: { sea: 24 }, sets: both(500), fuel: { grade: 'VLSFO', lcvKjPerKg: 41_000 } };
    const d = daySavings({ units, rules: { sea: plainRule(1) } }, day);
    expect(Math.abs(d.avoidableFuelKg! - (570 * 42_700) / 41_000)).toBeLessThan(1e-9 * 4000);
  });

  it('per-mode loads are a shape scaled to the metered energy (hand: 16 h at 2x, 8 h at x)', () => {
    // 9600 kWh; shape sea 600 kW / port 300 kW → scale 9600 / (600·16 + 300·8) = 0.8: sea 480 kW, port 240 kW.
    const day: SavingsDay = {
      date: '2024-03-03',
      modeHours: { sea: 16, port: 8 },
      modeLoadsKw: { sea: 600, port: 300 },
      sets: [{ unitId: 'DG1', hoursRun: 24, kwh: 9600 }],
      fuel: { grade: 'MGO' },
    };
    const d = daySavings({ units, rules: { sea: plainRule(1), port: plainRule(1) } }, day);
    expect(d.modes.map((m) => m.loadKw)).toEqual([expect.closeTo(480, 9), expect.closeTo(240, 9)]);
    const f = (p: number) => 30 + 0.2 * p + 5e-5 * p * p;
    expect(Math.abs(d.recommendedFuelKg! - (16 * f(480) + 8 * f(240)))).toBeLessThan(1e-9 * 4000);
    expect(Math.abs(d.modelledActualFuelKg - 24 * f(400))).toBeLessThan(1e-9 * 4000);
    // Without per-mode loads: both modes at the day's average, 400 kW, so the single set already is optimal.
    const flat = daySavings({ units, rules: { sea: plainRule(1), port: plainRule(1) } }, { ...day, modeLoadsKw: undefined });
    expect(flat.modes.map((m) => m.loadKw)).toEqual([expect.closeTo(400, 9), expect.closeTo(400, 9)]);
    expect(flat.avoidableFuelKg!).toBeCloseTo(0, 9);
    expect(flat.followedRecommendation).toBe(true);
  });

  it('low-load hours: a set whose daily average is below its minimum load counts all its hours', () => {
    const day: SavingsDay = {
      date: '2024-03-04',
      modeHours: { port: 10 },
      sets: [
        { unitId: 'DG1', hoursRun: 10, kwh: 900 },
        { unitId: 'DG2', hoursRun: 10, kwh: 1100 },
      ],
      fuel: { grade: 'MGO' },
    };
    const d = daySavings({ units, rules: { port: plainRule(1) } }, day);
    expect(d.lowLoadHours).toBe(10); // DG1 at 90 kW < 100 kW minimum; DG2 at 110 kW is not
    expect(d.actualSets.map((s) => s.lowLoadHours)).toEqual([10, 0]);
  });

  it('sets that ran different hours: no actual-sets split saving, with a reason', () => {
    const day: SavingsDay = {
      date: '2024-03-05',
      modeHours: { sea: 24 },
      sets: [
        { unitId: 'DG1', hoursRun: 24, kwh: 9600 },
        { unitId: 'DG2', hoursRun: 6, kwh: 1800 },
      ],
      fuel: { grade: 'MGO' },
    };
    const d = daySavings({ units, rules: { sea: plainRule(1) } }, day);
    expect(d.splitSavingActualSetsKg).toBeNull();
    expect(d.splitSavingActualSetsReason).toMatch(/different hours/);
    expect(d.avoidableFuelKg).not.toBeNull();
  });

  it('an infeasible recommendation is a result with reasons, not an exception', () => {
    const rule = { marginKw: 5000, marginPct: 0, minSets: 1, nMinus1: false, busTieClosed: true };
    const d = daySavings({ units, rules: { sea: rule } }, { date: '2024-03-06', modeHours: { sea: 24 }, sets: both(500), fuel: { grade: 'MGO' } });
    expect(d.recommendationFeasible).toBe(false);
    expect(d.avoidableFuelKg).toBeNull();
    expect(d.modes[0].reasons.length).toBeGreaterThan(0);
  });

  it('an unavailable set is not recommended', () => {
    const units3 = [...units, savingsSet('DG3', 10, 0.2, 5e-5, 1000, 10)];
    const day: SavingsDay = { date: '2024-03-07', modeHours: { sea: 24 }, sets: both(500), fuel: { grade: 'MGO' }, unavailableUnitIds: ['DG3'] };
    expect(daySavings({ units: units3, rules: { sea: plainRule(1) } }, day).modes[0].unitIds).not.toContain('DG3');
    expect(daySavings({ units: units3, rules: { sea: plainRule(1) } }, { ...day, unavailableUnitIds: [] }).modes[0].unitIds).toEqual(['DG3']);
  });

  it('bad input throws with the reason', () => {
    const input = { units, rules: { sea: plainRule(1) } };
    const day: SavingsDay = { date: '2024-03-02', modeHours: { sea: 24 }, sets: both(500), fuel: { grade: 'MGO' } };
    expect(() => daySavings(input, { ...day, modeHours: { port: 24 } })).toThrow(/reserve rule for every mode/);
    expect(() => daySavings(input, { ...day, modeHours: {} })).toThrow(/mode hours on a day with energy/);
    expect(() => daySavings(input, { ...day, sets: [{ unitId: 'DG9', hoursRun: 1, kwh: 1 }] })).toThrow(/unknown DG9/);
    expect(() => daySavings(input, { ...day, sets: [{ unitId: 'DG1', hoursRun: 0, kwh: 10 }] })).toThrow(/hoursRun > 0 for a set with kWh/);
    expect(() => daySavings(input, { ...day, date: '1 March' })).toThrow(/ISO date/);
  });
});
