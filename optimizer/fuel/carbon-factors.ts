/**
 * CO2 conversion factors Cf (t CO2 per t fuel) of IMO resolution MEPC.364(79), "2022 Guidelines on the method of
 * calculation of the attained Energy Efficiency Design Index (EEDI) for new ships", and the mapping of bunker grade
 * names to its fuel types.
 */

import type { Iso8217Family } from './calorific-value';

export const CF_FUEL_TYPES = [
  'diesel-gas-oil',
  'light-fuel-oil',
  'heavy-fuel-oil',
  'lpg-propane',
  'lpg-butane',
  'ethane',
  'lng',
  'methanol',
  'ethanol',
] as const;
export type CfFuelType = (typeof CF_FUEL_TYPES)[number];

export interface CfEntry {
  /** Fuel type as the resolution names it. */
  label: string;
  /** Cf, t CO2 / t fuel. */
  cfTCo2PerTFuel: number;
  /** Lower calorific value listed beside Cf, kJ/kg (a default when the lot has no LCV). */
  lcvKjPerKg: number;
  /** Carbon content, mass fraction, listed beside Cf. */
  carbonMassFraction: number;
  /** Which ISO 8217 annex formula estimates the LCV of this type from density; null for gases and alcohols. */
  iso8217Family: Iso8217Family | null;
}

/**
 * MEPC.364(79) table of Cf. The Cf values of diesel/gas oil, LFO, HFO, LPG propane and butane, LNG, methanol and
 * ethanol were confirmed by search; ethane's Cf, all LCVs and all carbon contents are from memory.
 */
export const CF_TABLE: Readonly<Record<CfFuelType, CfEntry>> = {
  'diesel-gas-oil': { label: 'Diesel/Gas oil (ISO 8217 grades DMX to DMB)', cfTCo2PerTFuel: 3.206, lcvKjPerKg: 42_700, carbonMassFraction: 0.8744, iso8217Family: 'distillate' },
  'light-fuel-oil': { label: 'Light fuel oil, LFO (ISO 8217 grades RMA to RMD)', cfTCo2PerTFuel: 3.151, lcvKjPerKg: 41_200, carbonMassFraction: 0.8594, iso8217Family: 'residual' },
  'heavy-fuel-oil': { label: 'Heavy fuel oil, HFO (ISO 8217 grades RME to RMK)', cfTCo2PerTFuel: 3.114, lcvKjPerKg: 40_200, carbonMassFraction: 0.8493, iso8217Family: 'residual' },
  'lpg-propane': { label: 'Liquefied petroleum gas, propane', cfTCo2PerTFuel: 3.0, lcvKjPerKg: 46_300, carbonMassFraction: 0.8182, iso8217Family: null },
  'lpg-butane': { label: 'Liquefied petroleum gas, butane', cfTCo2PerTFuel: 3.03, lcvKjPerKg: 45_700, carbonMassFraction: 0.8264, iso8217Family: null },
  ethane: { label: 'Ethane', cfTCo2PerTFuel: 2.927, lcvKjPerKg: 46_400, carbonMassFraction: 0.7989, iso8217Family: null },
  lng: { label: 'Liquefied natural gas, LNG', cfTCo2PerTFuel: 2.75, lcvKjPerKg: 48_000, carbonMassFraction: 0.75, iso8217Family: null },
  methanol: { label: 'Methanol', cfTCo2PerTFuel: 1.375, lcvKjPerKg: 19_900, carbonMassFraction: 0.375, iso8217Family: null },
  ethanol: { label: 'Ethanol', cfTCo2PerTFuel: 1.913, lcvKjPerKg: 26_800, carbonMassFraction: 0.5217, iso8217Family: null },
};

/** Bunker grade codes as logged on board. */
export const FUEL_GRADES = [
  'MGO',
  'LSMGO',
  'MDO',
  'ULSFO',
  'VLSFO',
  'LSFO',
  'HSFO',
  'HFO',
  'IFO180',
  'IFO380',
  'LNG',
  'LPG_PROPANE',
  'LPG_BUTANE',
  'ETHANE',
  'METHANOL',
  'ETHANOL',
] as const;
export type FuelGrade = (typeof FUEL_GRADES)[number];

/** Lot properties that decide between LFO and HFO for residual blends of unstated ISO 8217 grade. */
export interface ResidualLotProperties {
  /** Kinematic viscosity at 50 °C, mm²/s (cSt). */
  viscosity50Cst?: number;
  density15KgPerM3?: number;
}

/**
 * Largest viscosity at 50 °C of the RMA–RMD grades (RMD 80), mm²/s, and largest density at 15 °C of those grades
 * (RMD 80), kg/m³; ISO 8217 Table 2 limits, from memory.
 */
export const LFO_MAX_VISCOSITY_50_CST = 80;
export const LFO_MAX_DENSITY_15_KG_PER_M3 = 975;

const FIXED_GRADE_TYPES: Partial<Record<FuelGrade, CfFuelType>> = {
  MGO: 'diesel-gas-oil',
  LSMGO: 'diesel-gas-oil',
  MDO: 'diesel-gas-oil',
  HSFO: 'heavy-fuel-oil',
  HFO: 'heavy-fuel-oil',
  IFO180: 'heavy-fuel-oil',
  IFO380: 'heavy-fuel-oil',
  LNG: 'lng',
  LPG_PROPANE: 'lpg-propane',
  LPG_BUTANE: 'lpg-butane',
  ETHANE: 'ethane',
  METHANOL: 'methanol',
  ETHANOL: 'ethanol',
};

/** How cfFuelTypeForGrade decided. */
export type CfMappingBasis = 'grade' | 'viscosity' | 'density' | 'default-hfo';

/**
 * MEPC.364(79) fuel type of a bunker grade.
 *
 * Mapping: MGO, LSMGO, MDO (ISO 8217 DMA/DMZ/DMB) → diesel/gas oil. IFO180, IFO380, HSFO, HFO (RME 180, RMG 180 to
 * 380 and heavier) → HFO. ULSFO, VLSFO and LSFO are residual blends sold under any RM grade, so they follow the
 * ISO 8217 grade family their properties fit: viscosity at 50 °C ≤ 80 mm²/s (the RMA–RMD viscosity range) → LFO,
 * above → HFO; without viscosity, density at 15 °C > 975 kg/m³ (above every RMA–RMD limit) → HFO; with neither
 * deciding → HFO (the common VLSFO offer is an RMG 380 or RME 180 specification; common practice). Gases and
 * alcohols map to their own type.
 *
 * Cost O(1). Throws on an unknown grade or a non-finite/negative property.
 *
 * @example cfFuelTypeForGrade('VLSFO', { viscosity50Cst: 45 }) // { fuelType: 'light-fuel-oil', basis: 'viscosity' }
 */
export function cfFuelTypeForGrade(grade: FuelGrade, props: ResidualLotProperties = {}): { fuelType: CfFuelType; basis: CfMappingBasis } {
  if (!(FUEL_GRADES as readonly string[]).includes(grade)) {
    throw new Error(`cfFuelTypeForGrade requires grade to be one of ${FUEL_GRADES.join(', ')} (got ${String(grade)})`);
  }
  const fixed = FIXED_GRADE_TYPES[grade];
  if (fixed) return { fuelType: fixed, basis: 'grade' };
  const { viscosity50Cst, density15KgPerM3 } = props;
  for (const [field, v] of [['viscosity50Cst', viscosity50Cst], ['density15KgPerM3', density15KgPerM3]] as const) {
    if (v !== undefined && (!Number.isFinite(v) || v <= 0)) {
      throw new Error(`cfFuelTypeForGrade requires ${field} to be a positive number (got ${String(v)})`);
    }
  }
  if (viscosity50Cst !== undefined) {
    return { fuelType: viscosity50Cst <= LFO_MAX_VISCOSITY_50_CST ? 'light-fuel-oil' : 'heavy-fuel-oil', basis: 'viscosity' };
  }
  if (density15KgPerM3 !== undefined && density15KgPerM3 > LFO_MAX_DENSITY_15_KG_PER_M3) {
    return { fuelType: 'heavy-fuel-oil', basis: 'density' };
  }
  return { fuelType: 'heavy-fuel-oil', basis: 'default-hfo' };
}

/**
 * CO2 from burning a fuel mass, kg: fuelKg × Cf of the grade's MEPC.364(79) fuel type.
 *
 * Reference: MEPC.364(79) Cf table. Cost O(1). Throws on negative or non-finite fuelKg and as cfFuelTypeForGrade.
 *
 * @example co2Kg(1000, 'MGO') // 3206
 */
export function co2Kg(fuelKg: number, grade: FuelGrade, props: ResidualLotProperties = {}): number {
  if (typeof fuelKg !== 'number' || !Number.isFinite(fuelKg) || fuelKg < 0) {
    throw new Error(`co2Kg requires fuelKg ≥ 0 (got ${String(fuelKg)})`);
  }
  return fuelKg * CF_TABLE[cfFuelTypeForGrade(grade, props).fuelType].cfTCo2PerTFuel;
}
