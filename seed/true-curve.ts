/**
 * The invented "true" fuel curves of the demo gensets, built from a few SFOC figures a marine engineer would
 * recognise, and the maker's shop-test SFOC derived from them. Pure: no I/O.
 */
import type { QuadraticFuelCurve } from '../optimizer/plant';

/** What a true curve is built from. */
export interface TrueCurveTarget {
  ratedKw: number;
  /** Lowest SFOC of the set, g/kWh, reached at bestLoadFraction of the rating. */
  minSfocGPerKwh: number;
  /** Load of lowest SFOC as a fraction of the rating (0.5 to 1). */
  bestLoadFraction: number;
  /** SFOC at 25 % load minus the lowest SFOC, g/kWh (> 0). */
  riseAt25PctGPerKwh: number;
}

/**
 * Quadratic fuel curve F(P) = a + b·P + c·P² (kg/h, P kW) with a given SFOC minimum and low-load rise.
 *
 * SFOC(p) = 1000·F(pR)/(pR) = A/p + B + C·p with A = 1000a/R, B = 1000b, C = 1000cR, p = P/R. Its minimum lies
 * at p* = √(A/C) and equals B + 2√(AC) (elementary calculus). Given p*, the minimum s and the rise r at p = 0.25:
 * A = r / (4 + 0.25/p*² − 2/p*), C = A/p*², B = s − 2A/p*. Cost O(1).
 * Throws when ratedKw ≤ 0, bestLoadFraction is outside 0.5 to 1, or the rise is not positive.
 *
 * @example quadraticCurveFromSfoc({ ratedKw: 2000, minSfocGPerKwh: 195, bestLoadFraction: 0.85, riseAt25PctGPerKwh: 30 })
 *   // ≈ { kind: 'quadratic', a: 30.10, b: 0.15959, c: 1.0416e-5 }
 */
export function quadraticCurveFromSfoc(target: TrueCurveTarget): QuadraticFuelCurve {
  const { ratedKw, minSfocGPerKwh, bestLoadFraction: p, riseAt25PctGPerKwh: rise } = target;
  if (!(ratedKw > 0)) throw new Error(`quadraticCurveFromSfoc requires ratedKw > 0 (got ${ratedKw})`);
  if (!(p >= 0.5 && p <= 1)) throw new Error(`quadraticCurveFromSfoc requires bestLoadFraction between 0.5 and 1 (got ${p})`);
  if (!(rise > 0)) throw new Error(`quadraticCurveFromSfoc requires riseAt25PctGPerKwh > 0 (got ${rise})`);
  const bigA = rise / (4 + 0.25 / (p * p) - 2 / p);
  const bigC = bigA / (p * p);
  const bigB = minSfocGPerKwh - (2 * bigA) / p;
  return { kind: 'quadratic', a: (bigA * ratedKw) / 1000, b: bigB / 1000, c: bigC / (1000 * ratedKw) };
}

/**
 * SFOC of a quadratic curve at a load, g/kWh: 1000·F(P)/P, plus an in-service deterioration in g/kWh.
 *
 * Cost O(1). Throws when loadKw ≤ 0.
 *
 * @example sfocGPerKwh({ kind: 'quadratic', a: 30, b: 0.16, c: 1e-5 }, 1000) // 200
 */
export function sfocGPerKwh(curve: QuadraticFuelCurve, loadKw: number, deteriorationGPerKwh = 0): number {
  if (!(loadKw > 0)) throw new Error(`sfocGPerKwh requires loadKw > 0 (got ${loadKw})`);
  return (1000 * (curve.a + curve.b * loadKw + curve.c * loadKw * loadKw)) / loadKw + deteriorationGPerKwh;
}

/** Load points of the maker's shop test, % of rating. */
export const SHOP_TEST_LOAD_PCTS = [25, 50, 75, 85, 100] as const;

/**
 * Maker's shop-test SFOC at 25/50/75/85/100 % load: the new engine's true SFOC (no deterioration) less a
 * shop-test advantage (test-bed conditions, new engine, ISO reference fuel), rounded to 0.1 g/kWh.
 *
 * Cost O(1). Throws when ratedKw ≤ 0.
 *
 * @example shopTestSfoc(curve, 2000, 4).p85 // true SFOC at 1700 kW − 4, to 0.1 g/kWh
 */
export function shopTestSfoc(
  curve: QuadraticFuelCurve,
  ratedKw: number,
  advantageGPerKwh: number,
): { p25: number; p50: number; p75: number; p85: number; p100: number } {
  if (!(ratedKw > 0)) throw new Error(`shopTestSfoc requires ratedKw > 0 (got ${ratedKw})`);
  const at = (pct: number) => Math.round((sfocGPerKwh(curve, (ratedKw * pct) / 100) - advantageGPerKwh) * 10) / 10;
  return { p25: at(25), p50: at(50), p75: at(75), p85: at(85), p100: at(100) };
}
