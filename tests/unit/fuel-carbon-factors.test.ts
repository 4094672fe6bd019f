import { describe, expect, it } from 'vitest';
import { CF_FUEL_TYPES, CF_TABLE, FUEL_GRADES, cfFuelTypeForGrade, co2Kg } from '../../optimizer/fuel';
import type { CfFuelType, FuelGrade } from '../../optimizer/fuel';

describe('Cf table (IMO resolution MEPC.364(79), 2022 EEDI calculation guidelines)', () => {
  // Values as printed in the resolution's Cf table (t CO2 / t fuel).
  const mepc364: Record<CfFuelType, number> = {
    'diesel-gas-oil': 3.206,
    'light-fuel-oil': 3.151,
    'heavy-fuel-oil': 3.114,
    'lpg-propane': 3.0,
    'lpg-butane': 3.03,
    ethane: 2.927,
    lng: 2.75,
    methanol: 1.375,
    ethanol: 1.913,
  };
  it('holds the resolution values exactly', () => {
    for (const type of CF_FUEL_TYPES) expect(CF_TABLE[type].cfTCo2PerTFuel).toBe(mepc364[type]);
  });

  // Stoichiometry: Cf = carbon mass fraction × M(CO2)/M(C) = × 44.0095/12.011 (IUPAC standard atomic weights).
  // The resolution rounds and mixes 44/12 with exact masses, so we allow 0.003 t/t.
  it('is consistent with the listed carbon contents', () => {
    for (const type of CF_FUEL_TYPES) {
      const e = CF_TABLE[type];
      expect(Math.abs(e.carbonMassFraction * (44.0095 / 12.011) - e.cfTCo2PerTFuel)).toBeLessThan(0.003);
    }
  });
});

describe('co2Kg of 1 t of each grade', () => {
  // Hand: 1000 kg × Cf of the mapped fuel type.
  const expected: Record<FuelGrade, number> = {
    MGO: 3206,
    LSMGO: 3206,
    MDO: 3206,
    ULSFO: 3114,
    VLSFO: 3114,
    LSFO: 3114,
    HSFO: 3114,
    HFO: 3114,
    IFO180: 3114,
    IFO380: 3114,
    LNG: 2750,
    LPG_PROPANE: 3000,
    LPG_BUTANE: 3030,
    ETHANE: 2927,
    METHANOL: 1375,
    ETHANOL: 1913,
  };
  for (const grade of FUEL_GRADES) {
    it(`${grade}`, () => {
      expect(co2Kg(1000, grade)).toBeCloseTo(expected[grade], 9);
    });
  }
  it('follows the lot for VLSFO-type residual blends', () => {
    expect(co2Kg(1000, 'VLSFO', { viscosity50Cst: 45 })).toBeCloseTo(3151, 9);
    expect(co2Kg(1000, 'VLSFO', { viscosity50Cst: 180 })).toBeCloseTo(3114, 9);
  });
  it('throws on negative fuel or an unknown grade', () => {
    expect(() => co2Kg(-1, 'MGO')).toThrow(/fuelKg/);
    expect(() => co2Kg(1, 'GASOLINE' as FuelGrade)).toThrow(/grade/);
  });
});

describe('cfFuelTypeForGrade (ISO 8217 grade families: RMA–RMD up to 80 mm²/s at 50 °C and 975 kg/m³)', () => {
  it('maps by viscosity, then density, then defaults to HFO', () => {
    expect(cfFuelTypeForGrade('VLSFO', { viscosity50Cst: 80 })).toEqual({ fuelType: 'light-fuel-oil', basis: 'viscosity' });
    expect(cfFuelTypeForGrade('VLSFO', { viscosity50Cst: 80.1 })).toEqual({ fuelType: 'heavy-fuel-oil', basis: 'viscosity' });
    expect(cfFuelTypeForGrade('LSFO', { density15KgPerM3: 985 })).toEqual({ fuelType: 'heavy-fuel-oil', basis: 'density' });
    expect(cfFuelTypeForGrade('ULSFO', { density15KgPerM3: 930 })).toEqual({ fuelType: 'heavy-fuel-oil', basis: 'default-hfo' });
    expect(cfFuelTypeForGrade('MDO')).toEqual({ fuelType: 'diesel-gas-oil', basis: 'grade' });
    expect(cfFuelTypeForGrade('MGO', { viscosity50Cst: 500 })).toEqual({ fuelType: 'diesel-gas-oil', basis: 'grade' });
  });
  it('throws on a bad property', () => {
    expect(() => cfFuelTypeForGrade('VLSFO', { viscosity50Cst: -3 })).toThrow(/viscosity50Cst/);
  });
});
