/**
 * Fuel curves per genset: fit on read, stored with the inputs they used. A read derives the window's current
 * inputs, hashes them and returns the latest stored fit of that set and window when its hash matches; otherwise
 * it fits again and stores the new fit (audited), so fits follow every change of the logs behind them.
 */
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { z } from 'zod';
import {
  type curveQuerySchema,
  type CurveSetDetail,
  type CurveSetFit,
  type DriftAlertSet,
  type FleetDriftAlerts,
  type VesselCurves,
  type VesselDriftAlerts,
} from '../../shared/schemas/curves';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { curveFits, vessels } from '../db/schema';
import { notFound } from '../errors';
import { inScope, vesselForActor } from './access';
import { recordAudit } from './audit';
import { loadCurveInputs, type CurveInputSet } from './curve-inputs';
import { buildInputs, computeCurve, hashInputs, resolveWindow, type CurveFitInputs, type StoredCurveResult } from './curves-fit';

/** A curve window query as parsed by curveQuerySchema. */
export type ParsedCurveQuery = z.infer<typeof curveQuerySchema>;
type ParsedQuery = ParsedCurveQuery;

interface Resolved {
  inputs: CurveFitInputs;
  result: StoredCurveResult;
  fitId: string | null;
  fittedAt: string | null;
  inputHash: string | null;
  refitted: boolean;
}

/** The stored fit of the set and window when its inputs are unchanged, else a new fit (stored when there is one). */
async function fitFor(deps: AppDeps, actor: Actor, set: CurveInputSet, query: ParsedQuery): Promise<Resolved> {
  const window = resolveWindow(set, query);
  const inputs = buildInputs(set, window);
  const inputHash = hashInputs(inputs);
  const db = deps.db;
  const [latest] = await db
    .select({ id: curveFits.id, inputHash: curveFits.inputHash, result: curveFits.result, createdAt: curveFits.createdAt })
    .from(curveFits)
    .where(
      and(
        eq(curveFits.gensetId, set.id),
        eq(curveFits.windowKind, window.kind),
        window.from ? eq(curveFits.fromDate, window.from) : isNull(curveFits.fromDate),
        window.to ? eq(curveFits.toDate, window.to) : isNull(curveFits.toDate),
      ),
    )
    .orderBy(desc(curveFits.createdAt))
    .limit(1);
  if (latest && latest.inputHash === inputHash) {
    return { inputs, result: latest.result as StoredCurveResult, fitId: latest.id, fittedAt: latest.createdAt.toISOString(), inputHash, refitted: false };
  }
  const result = computeCurve(inputs);
  if (!result.fit) return { inputs, result, fitId: null, fittedAt: null, inputHash, refitted: true };
  const row = await db.transaction(async (tx) => {
    const [created] = await tx
      .insert(curveFits)
      .values({ gensetId: set.id, windowKind: window.kind, fromDate: window.from, toDate: window.to, inputHash, inputs, result, createdAt: deps.now() })
      .returning({ id: curveFits.id, createdAt: curveFits.createdAt });
    await recordAudit(tx, actor, 'curve_fit', created.id, 'create', null, {
      gensetId: set.id,
      windowKind: window.kind,
      fromDate: window.from,
      toDate: window.to,
      inputHash,
      days: result.fit?.days ?? 0,
      replaces: latest?.id ?? null,
    });
    return created;
  });
  return { inputs, result, fitId: row.id, fittedAt: row.createdAt.toISOString(), inputHash, refitted: true };
}

function view(set: CurveInputSet, r: Resolved): CurveSetFit {
  return {
    gensetId: set.id,
    designation: set.designation,
    ratedKw: set.ratedKw,
    window: r.inputs.window,
    fitId: r.fitId,
    inputHash: r.inputHash,
    fittedAt: r.fittedAt,
    refitted: r.refitted,
    daysLogged: r.inputs.daysLogged,
    daysLeftOut: r.inputs.daysLeftOut,
    shopTest: r.inputs.shopTest,
    fit: r.result.fit,
    drift: r.result.drift,
    reason: r.result.reason,
  };
}

/** Every set of a vessel fitted for one window (no daily points; see getSetCurve). */
export async function listVesselCurves(deps: AppDeps, actor: Actor, vesselId: string, query: ParsedQuery): Promise<VesselCurves> {
  await vesselForActor(deps.db, actor, vesselId);
  const sets = await loadCurveInputs(deps.db, vesselId);
  const out: CurveSetFit[] = [];
  for (const set of sets) out.push(view(set, await fitFor(deps, actor, set, query)));
  return { vesselId, window: query.window, sets: out };
}

/** One set's fit for one window with the daily points it used and their robust weights. */
export async function getSetCurve(
  deps: AppDeps,
  actor: Actor,
  vesselId: string,
  gensetId: string,
  query: ParsedQuery,
): Promise<CurveSetDetail> {
  await vesselForActor(deps.db, actor, vesselId);
  const [set] = await loadCurveInputs(deps.db, vesselId, gensetId);
  if (!set) throw notFound('Genset');
  const r = await fitFor(deps, actor, set, query);
  const weights = r.result.robustWeights;
  return { ...view(set, r), points: r.inputs.points.map((p, i) => ({ ...p, robustWeight: weights[i] ?? 1 })) };
}

function alertOf(set: CurveSetFit): DriftAlertSet {
  const d = set.drift;
  return {
    gensetId: set.gensetId,
    designation: set.designation,
    alert: d?.alert ?? false,
    excessGPerKwh: d?.excessGPerKwh ?? null,
    excessLowerBoundGPerKwh: d?.excessLowerBoundGPerKwh ?? null,
    thresholdGPerKwh: d?.thresholdGPerKwh ?? null,
    slopeGPerKwhPer1000h: d?.slopeGPerKwhPer1000h ?? null,
    confidence: d?.confidence ?? 0.95,
    unavailable: d ? d.alertUnavailable : (set.reason ?? 'No fit since the last overhaul'),
  };
}

async function vesselAlerts(deps: AppDeps, actor: Actor, vessel: { id: string; name: string }): Promise<VesselDriftAlerts> {
  const curves = await listVesselCurves(deps, actor, vessel.id, { window: 'since_overhaul' });
  const sets = curves.sets.map(alertOf);
  return { vesselId: vessel.id, vesselName: vessel.name, alertCount: sets.filter((s) => s.alert).length, sets };
}

/** Drift alerts of a vessel's sets (since-overhaul window). */
export async function getVesselDriftAlerts(deps: AppDeps, actor: Actor, vesselId: string): Promise<VesselDriftAlerts> {
  const vessel = await vesselForActor(deps.db, actor, vesselId);
  return vesselAlerts(deps, actor, vessel);
}

/** Drift alerts of every vessel the actor may see. */
export async function getFleetDriftAlerts(deps: AppDeps, actor: Actor): Promise<FleetDriftAlerts> {
  const rows = await listVessels(deps.db, actor);
  const out: VesselDriftAlerts[] = [];
  for (const v of rows) out.push(await vesselAlerts(deps, actor, v));
  return { alertCount: out.reduce((n, v) => n + v.alertCount, 0), vessels: out };
}

async function listVessels(db: DbOrTx, actor: Actor) {
  const rows = await db.select({ id: vessels.id, name: vessels.name }).from(vessels).where(eq(vessels.companyId, actor.companyId)).orderBy(vessels.name);
  return rows.filter((v) => inScope(actor, v.id));
}
