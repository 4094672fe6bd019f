import { describe, expect, it } from 'vitest';
import {
  CF_TABLE,
  ISO_3046_REFERENCE_LCV_KJ_PER_KG,
  estimateLcvMjPerKg,
  fuelCorrectedToIsoLcvKg,
} from '../../optimizer/fuel';

/** Hand computations below carry 6+ significant decimals; the formula is closed-form. */
const HAND_TOL_MJ_PER_KG = 1e-6;

describe('estimateLcvMjPerKg (ISO 8217 informative annex, net specific energy)', () => {
  // Hand computation, distillate formula, rho = 0.850 t/m³, no water/ash/sulphur:
  // 46.423 − 8.792 × 0.7225 + 3.170 × 0.850 = 46.423 − 6.35222 + 2.6945 = 42.76528 MJ/kg.
  it('distillate, density only', () => {
    expect(Math.abs(estimateLcvMjPerKg({ density15KgPerM3: 850 }) - 42.76528)).toBeLessThan(HAND_TOL_MJ_PER_KG);
  });

  // Hand computation, distillate formula, rho = 0.860, S = 0.1 % (s = 0.001):
  // (46.423 − 8.792 × 0.7396 + 3.170 × 0.86) × 0.999 + 9.420 × 0.001
  // = 42.6466368 × 0.999 + 0.00942 = 42.6039901632 + 0.00942 = 42.6134101632 MJ/kg.
  it('distillate with sulphur', () => {
    const lcv = estimateLcvMjPerKg({ density15KgPerM3: 860, sulphurPct: 0.1, family: 'distillate' });
    expect(Math.abs(lcv - 42.6134101632)).toBeLessThan(HAND_TOL_MJ_PER_KG);
  });

  // Hand computation, residual formula, rho = 0.991, water 0.5 %, ash 0.05 %, S 2.5 %:
  // base = 46.704 − 8.802 × 0.982081 + 3.167 × 0.991 = 46.704 − 8.644276962 + 3.138497 = 41.198220038
  // × (1 − 0.0305) = 39.941674327; + 9.420 × 0.025 = 0.2355; − 2.449 × 0.005 = 0.012245 → 40.164929327 MJ/kg.
  it('residual with water, ash and sulphur', () => {
    const lcv = estimateLcvMjPerKg({ density15KgPerM3: 991, waterPct: 0.5, ashPct: 0.05, sulphurPct: 2.5, family: 'residual' });
    expect(Math.abs(lcv - 40.164929327)).toBeLessThan(HAND_TOL_MJ_PER_KG);
  });

  // Plausibility against the default LCVs of MEPC.364(79) (diesel/gas oil 42 700 kJ/kg, HFO 40 200 kJ/kg) for
  // typical lots (MGO 860 kg/m³ 0.1 % S; HFO 991 kg/m³ 2.5 % S, 0.2 % water, 0.05 % ash). Tolerance 0.5 MJ/kg:
  // the IMO value is a fleet default, not the same lot.
  it('is close to the IMO default LCVs for typical lots', () => {
    const mgo = estimateLcvMjPerKg({ density15KgPerM3: 860, sulphurPct: 0.1, family: 'distillate' });
    const hfo = estimateLcvMjPerKg({ density15KgPerM3: 991, sulphurPct: 2.5, waterPct: 0.2, ashPct: 0.05, family: 'residual' });
    expect(Math.abs(mgo * 1000 - CF_TABLE['diesel-gas-oil'].lcvKjPerKg)).toBeLessThan(500);
    expect(Math.abs(hfo * 1000 - CF_TABLE['heavy-fuel-oil'].lcvKjPerKg)).toBeLessThan(500);
  });

  it('decreases with water (water carries no energy and takes heat to evaporate)', () => {
    const dry = estimateLcvMjPerKg({ density15KgPerM3: 940, family: 'residual' });
    const wet = estimateLcvMjPerKg({ density15KgPerM3: 940, waterPct: 1, family: 'residual' });
    // Hand: d(LCV)/d(water %) = −base/100 − 0.02449 = −(46.704 − 8.802·0.8836 + 3.167·0.94)/100 − 0.02449
    //     = −(46.704 − 7.7774472 + 2.97698)/100 − 0.02449 = −0.419035328 − 0.02449 = −0.443525328 MJ/kg per %.
    expect(Math.abs(wet - dry - -0.443525328)).toBeLessThan(HAND_TOL_MJ_PER_KG);
  });

  it('throws naming the field on bad input', () => {
    expect(() => estimateLcvMjPerKg({ density15KgPerM3: 650 })).toThrow(/density15KgPerM3/);
    expect(() => estimateLcvMjPerKg({ density15KgPerM3: 900, waterPct: -1 })).toThrow(/waterPct/);
    expect(() => estimateLcvMjPerKg({ density15KgPerM3: 900, ashPct: 101 })).toThrow(/ashPct/);
    expect(() => estimateLcvMjPerKg({ density15KgPerM3: 900, sulphurPct: Number.NaN })).toThrow(/sulphurPct/);
    expect(() => estimateLcvMjPerKg({ density15KgPerM3: 900, waterPct: 60, sulphurPct: 40 })).toThrow(/below 100/);
  });
});

describe('ISO 3046-1 reference LCV', () => {
  it('is 42 700 kJ/kg (ISO 3046-1:2002 standard reference conditions)', () => {
    expect(ISO_3046_REFERENCE_LCV_KJ_PER_KG).toBe(42_700);
  });

  // Hand computation: 1000 kg × 40 200 / 42 700 = 941.4519906 kg; 1000 kg × 43 000 / 42 700 = 1007.0257611 kg.
  it('refers fuel mass to the reference LCV', () => {
    expect(Math.abs(fuelCorrectedToIsoLcvKg(1000, 40_200) - 941.4519906)).toBeLessThan(1e-6);
    expect(Math.abs(fuelCorrectedToIsoLcvKg(1000, 43_000) - 1007.0257611)).toBeLessThan(1e-6);
    expect(fuelCorrectedToIsoLcvKg(1234.5, 42_700)).toBe(1234.5);
  });

  it('throws on negative fuel or an implausible LCV', () => {
    expect(() => fuelCorrectedToIsoLcvKg(-1, 42_700)).toThrow(/fuelKg/);
    expect(() => fuelCorrectedToIsoLcvKg(1, 42.7)).toThrow(/lcvKjPerKg/);
  });
});
