import { describe, expect, it } from 'vitest';
import { fuelPriceOn, vesselSavings } from '../../optimizer/savings/index';
import type { FuelPrice, SavingsDay } from '../../optimizer/savings/index';
import { plainRule, twinUnits } from '../fixtures/savings/plants';

// MEPC.364(79) Cf, t CO2 / t fuel: diesel/gas oil 3.206, light fuel oil 3.151, heavy fuel oil 3.114 (resolution table).
const CF_DIESEL = 3.206;
const CF_LFO = 3.151;
const TOL_T = 1e-9; // tonnes; all figures below are exact sums of a few terms

/**
 * Small fixture, three logged days over two months. Each day: both twin sets 24 h at half the plant load L; the
 * recommendation runs one set, so avoidable = (a − c·L²/2) · 24 = (30 − 2.5e-5·L²) · 24 kg by hand.
 * 2024-01-31 MGO, L = 500 kW: avoidable 570 kg. 2024-02-01 MGO, L = 400 kW: (30 − 4) · 24 = 624 kg.
 * 2024-02-02 VLSFO of viscosity 45 mm²/s (→ LFO), L = 600 kW: (30 − 9) · 24 = 504 kg.
 */
const days: SavingsDay[] = [
  { date: '2024-01-31', loadKw: 500, grade: 'MGO' as const, measuredKg: 4100 },
  { date: '2024-02-01', loadKw: 400, grade: 'MGO' as const, measuredKg: 3500 },
  { date: '2024-02-02', loadKw: 600, grade: 'VLSFO' as const, measuredKg: 4600 },
].map((d) => ({
  date: d.date,
  modeHours: { sea: 24 },
  sets: ['DG1', 'DG2'].map((unitId) => ({ unitId, hoursRun: 24, kwh: (d.loadKw / 2) * 24, measuredFuelKg: d.measuredKg / 2 })),
  fuel: { grade: d.grade, lot: { viscosity50Cst: 45 } },
}));

const prices: FuelPrice[] = [
  { grade: 'MGO', pricePerT: 800, currency: 'USD', validFrom: '2024-01-01', validTo: '2024-01-31' },
  { grade: 'MGO', pricePerT: 750, currency: 'USD', validFrom: '2024-02-01' },
  { grade: 'VLSFO', pricePerT: 600, currency: 'USD', validFrom: '2024-01-01' },
];

describe('vesselSavings totals: small fixture checked by hand', () => {
  const result = vesselSavings({ units: twinUnits, rules: { sea: plainRule(1) }, days }, { prices });

  it('avoidable fuel by day, month and period (hand: 570, 624, 504 kg)', () => {
    expect(result.byDay.map((d) => d.avoidableFuelT.value)).toEqual([expect.closeTo(0.57, 9), expect.closeTo(0.624, 9), expect.closeTo(0.504, 9)]);
    expect(result.byMonth.map((m) => m.label)).toEqual(['2024-01', '2024-02']);
    expect(Math.abs(result.byMonth[1].avoidableFuelT.value - 1.128)).toBeLessThan(TOL_T);
    expect(Math.abs(result.period.avoidableFuelT.value - 1.698)).toBeLessThan(TOL_T);
    expect(Math.abs(result.period.measuredFuelT! - 12.2)).toBeLessThan(TOL_T);
  });

  it('CO2 against the MEPC.364(79) factors of the grade burned', () => {
    // Measured: 4.1·3.206 + 3.5·3.206 + 4.6·3.151 t; avoidable: 0.570·3.206 + 0.624·3.206 + 0.504·3.151 t.
    expect(Math.abs(result.period.co2.measuredT! - (7.6 * CF_DIESEL + 4.6 * CF_LFO))).toBeLessThan(TOL_T);
    expect(Math.abs(result.period.co2.avoidableT.value - (1.194 * CF_DIESEL + 0.504 * CF_LFO))).toBeLessThan(TOL_T);
    expect(Math.abs(result.byMonth[0].co2.avoidableT.value - 0.57 * CF_DIESEL)).toBeLessThan(TOL_T);
  });

  it('cost with the price valid on each day (hand: 4.1·800 + 3.5·750 + 4.6·600 = 3280 + 2625 + 2760 = 8665 USD measured)', () => {
    expect(result.period.cost!.currency).toBe('USD');
    expect(Math.abs(result.period.cost!.measured! - 8665)).toBeLessThan(1e-6);
    // Avoidable: 0.570·800 + 0.624·750 + 0.504·600 = 456 + 468 + 302.4 = 1226.4 USD.
    expect(Math.abs(result.period.cost!.avoidable.value - 1226.4)).toBeLessThan(1e-6);
    expect(result.period.cost!.daysWithoutPrice).toEqual([]);
  });

  it('a day without a valid price is listed and left out of the cost', () => {
    const partial = vesselSavings({ units: twinUnits, rules: { sea: plainRule(1) }, days }, { prices: prices.slice(0, 2) });
    expect(partial.period.cost!.daysWithoutPrice).toEqual(['2024-02-02']);
    expect(Math.abs(partial.period.cost!.measured! - (4.1 * 800 + 3.5 * 750))).toBeLessThan(1e-6);
  });

  it('chosen period and price lookup', () => {
    const feb = vesselSavings({ units: twinUnits, rules: { sea: plainRule(1) }, days }, { from: '2024-02-01', to: '2024-02-29' });
    expect(feb.period.days).toBe(2);
    expect(feb.period.cost).toBeNull();
    expect(fuelPriceOn(prices, 'MGO', '2024-01-31')).toBe(800);
    expect(fuelPriceOn(prices, 'MGO', '2024-02-01')).toBe(750);
    expect(fuelPriceOn(prices, 'MDO', '2024-02-01')).toBeNull();
  });

  it('without fits the curves count as exact: zero-width intervals and a warning', () => {
    expect(result.period.avoidableFuelT.sd).toBe(0);
    expect(result.warnings[0]).toMatch(/no fit covariance/);
  });

  it('bad prices throw', () => {
    const input = { units: twinUnits, rules: { sea: plainRule(1) }, days };
    expect(() => vesselSavings(input, { prices: [...prices, { ...prices[2], currency: 'EUR' }] })).toThrow(/one currency/);
    expect(() => vesselSavings(input, { prices: [{ ...prices[0], validTo: '2023-01-01' }] })).toThrow(/validTo ≥ validFrom/);
  });
});
