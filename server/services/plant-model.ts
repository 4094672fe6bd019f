/**
 * The plant as every recommendation sees it: the vessel's service sets (emergency sets never enter) with
 * rating, load limits, availability, must-run, bus section, start fuel, minimum up/down times and one fuel curve
 * each. A set's curve is its current fit (curves service, since-overhaul window) when one exists, otherwise a
 * quadratic through its shop-test fuel-rate points ("from shop test"). Savings and planning reuse this.
 */
import { asc, eq } from 'drizzle-orm';
import { fitFuelCurve, type GensetUnit, type QuadraticFuelCurve } from '../../optimizer/index';
import type { PlantModel, PlantUnit } from '../../shared/schemas/recommendations';
import type { Actor, AppDeps } from '../context';
import { busSections, gensets } from '../db/schema';
import { vesselForActor } from './access';
import { listVesselCurves } from './curves';

type GensetRow = typeof gensets.$inferSelect;

/** The maker's shop-test SFOC points of a set as fuel-rate points (kg/h at kW); null entries dropped. */
export function shopTestFuelPoints(g: Pick<GensetRow, 'ratedKw' | 'shopTestSfoc'>): { loadKw: number; fuelKgPerH: number }[] {
  const s = g.shopTestSfoc;
  const pairs: [number, number | null][] = [
    [25, s.p25],
    [50, s.p50],
    [75, s.p75],
    [85, s.p85],
    [100, s.p100],
  ];
  return pairs
    .filter((p): p is [number, number] => p[1] !== null)
    .map(([pct, sfoc]) => {
      const loadKw = (pct * g.ratedKw) / 100;
      return { loadKw, fuelKgPerH: (sfoc * loadKw) / 1000 };
    });
}

/**
 * Quadratic fuel curve through a set's shop-test fuel-rate points: optimizer/fit fitFuelCurve on those points
 * alone (equal weights, no robust weighting, no prior, a ≥ 0 and c ≥ 0). Null with fewer than three points.
 */
export function shopTestCurve(g: Pick<GensetRow, 'ratedKw' | 'shopTestSfoc'>): QuadraticFuelCurve | null {
  const pts = shopTestFuelPoints(g);
  if (pts.length < 3) return null;
  const fit = fitFuelCurve(
    pts.map((p) => ({ ...p, hoursRun: 1 })),
    { ratedKw: g.ratedKw, robust: 'none', weighting: 'equal', constrained: true, prior: { use: 'never' } },
  );
  return fit.curve;
}

export interface BuiltPlant {
  vessel: Awaited<ReturnType<typeof vesselForActor>>;
  model: PlantModel;
  /** Same order as model.units; ids are genset ids, names designations. */
  units: GensetUnit[];
}

/** Builds the plant model of a vessel the actor may see (404 otherwise). */
export async function buildPlantModel(deps: AppDeps, actor: Actor, vesselId: string): Promise<BuiltPlant> {
  const vessel = await vesselForActor(deps.db, actor, vesselId);
  const sections = await deps.db.select().from(busSections).where(eq(busSections.vesselId, vesselId)).orderBy(asc(busSections.sortOrder));
  const sectionName = new Map(sections.map((s) => [s.id, s.name]));
  const rows = (await deps.db.select().from(gensets).where(eq(gensets.vesselId, vesselId)).orderBy(asc(gensets.designation))).filter(
    (g) => g.duty === 'service',
  );
  const curves = rows.length ? await listVesselCurves(deps, actor, vesselId, { window: 'since_overhaul' }) : { sets: [] };
  const fitBy = new Map(curves.sets.map((s) => [s.gensetId, s]));
  const units: PlantUnit[] = [];
  const leftOut: PlantModel['leftOut'] = [];
  for (const g of rows) {
    const fitted = fitBy.get(g.id);
    let curve: QuadraticFuelCurve | null;
    let source: PlantUnit['curveSource'] = 'fit';
    let note: string;
    let fitId: string | null = null;
    if (fitted?.fit) {
      const k = fitted.fit.coefficients;
      curve = { kind: 'quadratic', a: k.a, b: k.b, c: k.c };
      fitId = fitted.fitId;
      note = `fit of ${fitted.fit.days} logged days (${fitted.window.from ?? '?'} to ${fitted.window.to ?? '?'})`;
    } else {
      curve = shopTestCurve(g);
      source = 'shop_test';
      note = 'from shop test' + (fitted?.reason ? ` (no fit: ${fitted.reason})` : '');
    }
    if (!curve) {
      leftOut.push({ gensetId: g.id, designation: g.designation, reason: 'no fit and fewer than three shop-test SFOC points' });
      continue;
    }
    units.push({
      gensetId: g.id,
      designation: g.designation,
      busSection: (g.busSectionId && sectionName.get(g.busSectionId)) || 'A',
      ratedKw: g.ratedKw,
      minLoadPct: g.minLoadPct,
      maxLoadPct: g.maxLoadPct,
      available: g.available,
      unavailableReason: g.unavailableReason,
      mustRun: g.mustRun,
      startCostKg: g.startCostKg,
      minUpH: g.minUpH,
      minDownH: g.minDownH,
      curve: { a: curve.a, b: curve.b, c: curve.c },
      curveSource: source,
      curveFitId: fitId,
      curveNote: note,
    });
  }
  const model: PlantModel = { vesselId, busSections: sections.map((s) => s.name), units, leftOut };
  return { vessel, model, units: units.map(toGensetUnit) };
}

/** The optimizer's view of one plant unit. */
export function toGensetUnit(u: PlantUnit): GensetUnit {
  return {
    id: u.gensetId,
    name: u.designation,
    ratedKw: u.ratedKw,
    minLoadPct: u.minLoadPct,
    maxLoadPct: u.maxLoadPct,
    curve: { kind: 'quadratic', a: u.curve.a, b: u.curve.b, c: u.curve.c },
    busSection: u.busSection,
    available: u.available,
    mustRun: u.mustRun,
    startCostKg: u.startCostKg,
    minUpH: u.minUpH,
    minDownH: u.minDownH,
  };
}
