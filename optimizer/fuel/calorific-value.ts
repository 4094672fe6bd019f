/**
 * Calorific value of marine fuels: estimate from density (ISO 8217 informative annex) and correction of fuel mass to
 * the ISO 3046-1 reference lower calorific value.
 */

/**
 * Reference lower calorific value (LCV, net specific energy) of ISO 3046-1:2002 standard reference conditions,
 * 42 700 kJ/kg. Engine makers state SFOC at this LCV. (Value common practice; clause number not re-read.)
 */
export const ISO_3046_REFERENCE_LCV_KJ_PER_KG = 42_700;

/** Distillate (ISO 8217 DM grades) or residual (RM grades) formula of the ISO 8217 annex. */
export type Iso8217Family = 'distillate' | 'residual';

/** Constants of Qnet = (c0 − c2·rho² + c1·rho)·(1 − (x+y+s)) + 9.420·s − 2.449·x, rho in t/m³ (kg/L). */
export interface LcvFormulaConstants {
  c0: number;
  c1: number;
  c2: number;
}

/**
 * Constants of the ISO 8217 annex estimate of net specific energy (MJ/kg).
 * Distillate: 46.423, 3.170, 8.792. Residual: 46.704, 3.167, 8.802 (the residual set appears in later editions of
 * ISO 8217 for RM grades). Both sets from memory; the residual set was confirmed on a published marine-engineering
 * reference page, the distillate set could not be confirmed by search.
 */
export const ISO_8217_LCV_CONSTANTS: Readonly<Record<Iso8217Family, LcvFormulaConstants>> = {
  distillate: { c0: 46.423, c1: 3.17, c2: 8.792 },
  residual: { c0: 46.704, c1: 3.167, c2: 8.802 },
};

export interface LcvEstimateInput {
  /** Density at 15 °C, kg/m³ (700 to 1100). */
  density15KgPerM3: number;
  /** Water, % by mass (default 0). */
  waterPct?: number;
  /** Ash, % by mass (default 0). */
  ashPct?: number;
  /** Sulphur, % by mass (default 0). */
  sulphurPct?: number;
  /** Which annex formula; default 'distillate' (the DM-grade formula). */
  family?: Iso8217Family;
}

function pct(field: string, value: number | undefined): number {
  const v = value ?? 0;
  if (typeof v !== 'number' || !Number.isFinite(v) || v < 0 || v > 100) {
    throw new Error(`estimateLcvMjPerKg requires ${field} between 0 and 100 (got ${String(value)})`);
  }
  return v / 100;
}

/**
 * Lower calorific value (net specific energy) estimated from density, water, ash and sulphur, MJ/kg:
 *   LCV = (c0 − c2·rho² + c1·rho)·(1 − (x + y + s)) + 9.420·s − 2.449·x
 * with rho the density at 15 °C in t/m³ and x, y, s the mass fractions of water, ash and sulphur.
 *
 * Reference: ISO 8217 informative annex "Calculation of net specific energy" (constants from memory, see
 * ISO_8217_LCV_CONSTANTS). An estimate for when no bomb-calorimeter LCV is available. Cost O(1).
 * Throws when the density is outside 700 to 1100 kg/m³, a percentage is outside 0 to 100, or water + ash + sulphur
 * reach 100 %.
 *
 * @example estimateLcvMjPerKg({ density15KgPerM3: 850 }) // 42.76528
 */
export function estimateLcvMjPerKg(input: LcvEstimateInput): number {
  const { density15KgPerM3 } = input;
  if (typeof density15KgPerM3 !== 'number' || !Number.isFinite(density15KgPerM3) || density15KgPerM3 < 700 || density15KgPerM3 > 1100) {
    throw new Error(`estimateLcvMjPerKg requires density15KgPerM3 between 700 and 1100 kg/m³ (got ${String(density15KgPerM3)})`);
  }
  const x = pct('waterPct', input.waterPct);
  const y = pct('ashPct', input.ashPct);
  const s = pct('sulphurPct', input.sulphurPct);
  if (x + y + s >= 1) throw new Error('estimateLcvMjPerKg requires waterPct + ashPct + sulphurPct below 100');
  const k = ISO_8217_LCV_CONSTANTS[input.family ?? 'distillate'];
  if (!k) throw new Error(`estimateLcvMjPerKg requires family 'distillate' or 'residual' (got ${String(input.family)})`);
  const rho = density15KgPerM3 / 1000;
  return (k.c0 - k.c2 * rho * rho + k.c1 * rho) * (1 - (x + y + s)) + 9.42 * s - 2.449 * x;
}

/**
 * Fuel mass corrected to the ISO 3046-1 reference LCV, kg: fuelKg × LCV / 42 700. A fuel with a lower LCV than the
 * reference counts as less reference fuel, so SFOC computed from the result is comparable with makers' ISO SFOC.
 *
 * Reference: ISO 3046-1:2002 reference LCV 42 700 kJ/kg. Cost O(1).
 * Throws when fuelKg is negative or not finite, or lcvKjPerKg is outside 10 000 to 60 000 kJ/kg.
 *
 * @example fuelCorrectedToIsoLcvKg(1000, 40_200) // 941.4519906...
 */
export function fuelCorrectedToIsoLcvKg(fuelKg: number, lcvKjPerKg: number): number {
  if (typeof fuelKg !== 'number' || !Number.isFinite(fuelKg) || fuelKg < 0) {
    throw new Error(`fuelCorrectedToIsoLcvKg requires fuelKg ≥ 0 (got ${String(fuelKg)})`);
  }
  if (typeof lcvKjPerKg !== 'number' || !Number.isFinite(lcvKjPerKg) || lcvKjPerKg < 10_000 || lcvKjPerKg > 60_000) {
    throw new Error(`fuelCorrectedToIsoLcvKg requires lcvKjPerKg between 10000 and 60000 kJ/kg (got ${String(lcvKjPerKg)})`);
  }
  return (fuelKg * lcvKjPerKg) / ISO_3046_REFERENCE_LCV_KJ_PER_KG;
}
