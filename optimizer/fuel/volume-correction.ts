/**
 * Volume correction of generalized petroleum products to 15 °C, ASTM D1250-80 / IP 200 / ISO 91-1:1982,
 * Table 54B ("Generalized products, correction of volume to 15 °C against density at 15 °C").
 *
 * Form implemented: the 1980 table form, evaluated in unrounded double precision:
 *   alpha15 = K0 / rho15² + K1 / rho15         (gasolines, jet group, fuel oils)
 *   alpha15 = A + B / rho15²                   (transition zone)
 *   VCF     = exp(-alpha15 · dT · (1 + 0.8 · alpha15 · dT)),  dT = t − 15 °C
 * The intermediate roundings/truncations of the 1980 implementation procedure and the 4-decimal rounding of the
 * printed table are NOT applied; the unrounded value differs from the printed entry by at most half a unit in the
 * 4th decimal (5e-5) plus the effect of the intermediate roundings (order 1e-6). The 2004 revision (API MPMS
 * 11.1-2004, 60 °F base, ITS-90 temperature conversion) is not implemented.
 *
 * Band constants (kg/m³ based, per °C): the metric constants of Table 54B. They equal the 60 °F constants of the
 * 2004 revision times 1.8 (e.g. 103.8720 × 1.8 = 186.9696), which cross-checks them.
 */

/** One density band of Table 54B. `kind: 'k'`: alpha = k0/rho² + k1/rho; `kind: 'ab'`: alpha = a + b/rho². */
export interface Table54BBand {
  name: 'gasolines' | 'transition zone' | 'jet group' | 'fuel oils';
  /** Lower density limit, kg/m³ at 15 °C (inclusive). */
  fromKgPerM3: number;
  /** Upper density limit, kg/m³ at 15 °C (exclusive, except the last band which includes it). */
  toKgPerM3: number;
  kind: 'k' | 'ab';
  k0: number;
  k1: number;
  a: number;
  b: number;
}

/**
 * Density bands of Table 54B (1980). Constants: gasolines K0 346.4228, K1 0.4388; transition zone A −0.00336312,
 * B 2680.3206; jet group K0 594.5418, K1 0; fuel oils K0 186.9696, K1 0.4862 (confirmed against several independent
 * implementations of the table and against the 2004 60 °F constants × 1.8).
 * Band limits 653 / 770.5 / 787.5 / 838.5 / 1075 kg/m³: the printed table's density steps put the band changes
 * between 770.0 and 770.5, 787.5 and 788.0, 838.5 and 839.0; we place each limit at the printed step where the band
 * changes and treat intervals as half-open [from, to). The two alphas differ by less than 0.2 % at every limit,
 * so the choice moves VCF by less than 1e-5 at 60 °C. (Limits from memory, consistent with the printed steps.)
 */
export const TABLE_54B_BANDS: readonly Table54BBand[] = [
  { name: 'gasolines', fromKgPerM3: 653.0, toKgPerM3: 770.5, kind: 'k', k0: 346.4228, k1: 0.4388, a: 0, b: 0 },
  { name: 'transition zone', fromKgPerM3: 770.5, toKgPerM3: 787.5, kind: 'ab', k0: 0, k1: 0, a: -0.00336312, b: 2680.3206 },
  { name: 'jet group', fromKgPerM3: 787.5, toKgPerM3: 838.5, kind: 'k', k0: 594.5418, k1: 0, a: 0, b: 0 },
  { name: 'fuel oils', fromKgPerM3: 838.5, toKgPerM3: 1075.0, kind: 'k', k0: 186.9696, k1: 0.4862, a: 0, b: 0 },
];

/** Lowest temperature of Table 54B, °C (from memory). */
export const TABLE_54B_MIN_TEMP_C = -18;

/**
 * Highest temperature of Table 54B for a density, °C: 95 °C below 778 kg/m³, 125 °C below 824 kg/m³, 150 °C up to
 * 1075 kg/m³ (the stepped upper limits of the printed table; from memory).
 *
 * Cost O(1). Does not throw (the density range is checked by table54BBand).
 *
 * @example table54BMaxTempC(990) // 150
 */
export function table54BMaxTempC(density15KgPerM3: number): number {
  if (density15KgPerM3 < 778) return 95;
  if (density15KgPerM3 < 824) return 125;
  return 150;
}

function assertFinite(fn: string, field: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new Error(`${fn} requires ${field} to be a finite number (got ${String(value)})`);
  }
}

/**
 * The Table 54B band a density at 15 °C falls in.
 *
 * Cost O(1). Throws when the density lies outside 653 to 1075 kg/m³.
 *
 * @example table54BBand(990).name // 'fuel oils'
 */
export function table54BBand(density15KgPerM3: number): Table54BBand {
  assertFinite('table54BBand', 'density15KgPerM3', density15KgPerM3);
  const first = TABLE_54B_BANDS[0];
  const last = TABLE_54B_BANDS[TABLE_54B_BANDS.length - 1];
  if (density15KgPerM3 < first.fromKgPerM3 || density15KgPerM3 > last.toKgPerM3) {
    throw new Error(
      `Table 54B requires density15KgPerM3 between ${first.fromKgPerM3} and ${last.toKgPerM3} kg/m³ (got ${density15KgPerM3})`,
    );
  }
  for (const band of TABLE_54B_BANDS) if (density15KgPerM3 < band.toKgPerM3) return band;
  return last;
}

/**
 * Thermal expansion coefficient alpha15 of Table 54B, 1/°C.
 *
 * Reference: ASTM D1250-80 / ISO 91-1 Table 54B (see module note). Cost O(1).
 * Throws when the density lies outside 653 to 1075 kg/m³.
 *
 * @example thermalExpansion54BPerC(990) // ≈ 6.8188e-4
 */
export function thermalExpansion54BPerC(density15KgPerM3: number): number {
  const band = table54BBand(density15KgPerM3);
  const rho2 = density15KgPerM3 * density15KgPerM3;
  return band.kind === 'ab' ? band.a + band.b / rho2 : band.k0 / rho2 + band.k1 / density15KgPerM3;
}

/**
 * Volume correction factor (VCF, "CTL") of Table 54B: volume at 15 °C = observed volume × VCF.
 *
 * Reference: ASTM D1250-80 / IP 200 / ISO 91-1 Table 54B, 1980 form, unrounded (module note).
 * Cost O(1). Throws when density15KgPerM3 is outside 653 to 1075 kg/m³ or tempC is outside the table's range
 * for that density (−18 °C to 95/125/150 °C).
 *
 * @example volumeCorrectionFactor54B(990.3, 34) // ≈ 0.98700 (printed table: 0.9870)
 */
export function volumeCorrectionFactor54B(density15KgPerM3: number, tempC: number): number {
  assertFinite('volumeCorrectionFactor54B', 'density15KgPerM3', density15KgPerM3);
  assertFinite('volumeCorrectionFactor54B', 'tempC', tempC);
  const alpha = thermalExpansion54BPerC(density15KgPerM3);
  const maxC = table54BMaxTempC(density15KgPerM3);
  if (tempC < TABLE_54B_MIN_TEMP_C || tempC > maxC) {
    throw new Error(
      `volumeCorrectionFactor54B requires tempC between ${TABLE_54B_MIN_TEMP_C} and ${maxC} °C for a density of ${density15KgPerM3} kg/m³ (got ${tempC})`,
    );
  }
  const dT = tempC - 15;
  return Math.exp(-alpha * dT * (1 + 0.8 * alpha * dT));
}

/** An observed fuel volume: exactly one of volumeL or volumeM3. */
export interface ObservedFuelVolume {
  volumeL?: number;
  volumeM3?: number;
  /** Fuel temperature at the measurement, °C. */
  tempC: number;
  density15KgPerM3: number;
}

function observedVolumeM3(fn: string, v: ObservedFuelVolume): number {
  const hasL = v.volumeL !== undefined;
  const hasM3 = v.volumeM3 !== undefined;
  if (hasL === hasM3) throw new Error(`${fn} requires exactly one of volumeL or volumeM3`);
  const value = hasL ? (v.volumeL as number) : (v.volumeM3 as number);
  const field = hasL ? 'volumeL' : 'volumeM3';
  assertFinite(fn, field, value);
  if (value < 0) throw new Error(`${fn} requires ${field} ≥ 0 (got ${value})`);
  return hasL ? value / 1000 : value;
}

/**
 * Standard volume at 15 °C, m³: observed volume × VCF (Table 54B).
 *
 * Cost O(1). Throws as volumeCorrectionFactor54B, and when not exactly one of volumeL / volumeM3 is given or it is
 * negative.
 *
 * @example volumeAt15M3({ volumeM3: 10, tempC: 34, density15KgPerM3: 990.3 }) // ≈ 9.8700
 */
export function volumeAt15M3(v: ObservedFuelVolume): number {
  const vm3 = observedVolumeM3('volumeAt15M3', v);
  return vm3 * volumeCorrectionFactor54B(v.density15KgPerM3, v.tempC);
}

/**
 * Fuel mass in vacuum, kg: standard volume at 15 °C × density at 15 °C (density at 15 °C is a mass per volume in
 * vacuum). No air-buoyancy correction is applied: the fuel mass used for SFOC is mass in vacuum (common practice;
 * engine makers' SFOC is a true mass). For the commercial "weight in air" of bunker documents use massInAirKg.
 *
 * Reference: ASTM D1250-80 / ISO 91-1 Table 54B for VCF. Cost O(1). Throws as volumeAt15M3.
 *
 * @example massAt15Kg({ volumeL: 1000, tempC: 40, density15KgPerM3: 860 }) // ≈ 842.31
 */
export function massAt15Kg(v: ObservedFuelVolume): number {
  return volumeAt15M3(v) * v.density15KgPerM3;
}

/** Air-buoyancy deduction from density in vacuum to "density in air", kg/m³ (ASTM D1250 Table 56 practice). */
export const AIR_BUOYANCY_KG_PER_M3 = 1.1;

/**
 * Commercial weight in air, kg: standard volume at 15 °C × (density at 15 °C − 1.1 kg/m³). This is the figure of
 * bunker delivery notes (weight correction factor of ASTM D1250 Table 56, applied as the common-practice 1.1 kg/m³
 * deduction); not for SFOC.
 *
 * Cost O(1). Throws as volumeAt15M3.
 *
 * @example massInAirKg({ volumeM3: 1, tempC: 15, density15KgPerM3: 991 }) // 989.9
 */
export function massInAirKg(v: ObservedFuelVolume): number {
  return volumeAt15M3(v) * (v.density15KgPerM3 - AIR_BUOYANCY_KG_PER_M3);
}
