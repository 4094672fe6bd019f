/**
 * Recommendations at one operating point and the operating guideline, plus what they depend on: operating
 * rules per mode and the status (availability, must-run) of each set. Computation is optimizer/dispatch's
 * rankCombinations and operatingGuideline on the plant model of plant-model.ts.
 */
import { createHash } from 'node:crypto';
import { and, desc, eq } from 'drizzle-orm';
import { operatingGuideline, rankCombinations, type Demand, type RankedCombination } from '../../optimizer/dispatch/index';
import type { GensetUnit, ReserveRule } from '../../optimizer/index';
import {
  OPERATING_MODES,
  RECOMMENDATION_CAUTION,
  type CombinationView,
  type Guideline,
  type GuidelineSummary,
  type OperatingModeName,
  type OperatingRuleInput,
  type OperatingRules,
  type PlantUnit,
  type SinglePointInput,
  type SinglePointResult,
} from '../../shared/schemas/recommendations';
import type { GensetStatusInput } from '../../shared/schemas/recommendations';
import type { Actor, AppDeps } from '../context';
import type { DbOrTx } from '../db/client';
import { gensets, guidelines, operatingRules } from '../db/schema';
import { AppError, notFound } from '../errors';
import { vesselForActor } from './access';
import { recordAudit } from './audit';
import { buildPlantModel } from './plant-model';

/** The rule of a mode with nothing stored: the table's column defaults (no margin, one set, bus tie closed). */
const DEFAULT_RULE: OperatingRuleInput = { marginKw: 0, marginPct: 0, minSets: 1, nMinus1: false, busTieClosed: true };
/** Version of the guideline recipe below (sweep step, shares); part of the input hash. */
const GUIDELINE_METHOD_VERSION = 1;
const GUIDELINE_STEP_PCT = 1;

/** Turns an optimizer Error on malformed input into a 422 the user can read (never a 500). */
export function optimizerCall<T>(what: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof AppError) throw e;
    const message = e instanceof Error ? e.message : String(e);
    throw new AppError('validation_failed', `${what}: ${message}`, [{ path: '', message }]);
  }
}

/** Rules of every mode of a vessel (defaults where none is stored). No access check: callers do it. */
export async function rulesOfVessel(db: DbOrTx, vesselId: string): Promise<OperatingRules['rules']> {
  const rows = await db.select().from(operatingRules).where(eq(operatingRules.vesselId, vesselId));
  return OPERATING_MODES.map((mode) => {
    const r = rows.find((x) => x.mode === mode);
    return r
      ? { mode, stored: true, updatedAt: r.updatedAt.toISOString(), marginKw: r.marginKw, marginPct: r.marginPct, minSets: r.minSets, nMinus1: r.nMinus1, busTieClosed: r.busTieClosed }
      : { mode, stored: false, updatedAt: null, ...DEFAULT_RULE };
  });
}

export function ruleOf(rules: OperatingRules['rules'], mode: OperatingModeName): ReserveRule {
  const r = rules.find((x) => x.mode === mode)!;
  return { marginKw: r.marginKw, marginPct: r.marginPct, minSets: r.minSets, nMinus1: r.nMinus1, busTieClosed: r.busTieClosed };
}

export async function getOperatingRules(deps: AppDeps, actor: Actor, vesselId: string): Promise<OperatingRules> {
  await vesselForActor(deps.db, actor, vesselId);
  return { vesselId, rules: await rulesOfVessel(deps.db, vesselId) };
}

export async function putOperatingRule(deps: AppDeps, actor: Actor, vesselId: string, mode: OperatingModeName, input: OperatingRuleInput): Promise<OperatingRules> {
  await deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(operatingRules).where(and(eq(operatingRules.vesselId, vesselId), eq(operatingRules.mode, mode)));
    const [after] = await tx
      .insert(operatingRules)
      .values({ vesselId, mode, ...input, updatedAt: deps.now() })
      .onConflictDoUpdate({ target: [operatingRules.vesselId, operatingRules.mode], set: { ...input, updatedAt: deps.now() } })
      .returning();
    await recordAudit(tx, actor, 'operating_rule', `${vesselId}:${mode}`, before ? 'update' : 'create', before ?? null, after);
  });
  return getOperatingRules(deps, actor, vesselId);
}

export async function setGensetStatus(deps: AppDeps, actor: Actor, vesselId: string, gensetId: string, input: GensetStatusInput) {
  return deps.db.transaction(async (tx) => {
    await vesselForActor(tx, actor, vesselId);
    const [before] = await tx.select().from(gensets).where(and(eq(gensets.id, gensetId), eq(gensets.vesselId, vesselId)));
    if (!before) throw notFound('Genset');
    if (before.duty === 'emergency') {
      throw new AppError('validation_failed', 'An emergency set never enters a recommendation', [{ path: 'available', message: 'Emergency set' }]);
    }
    const values = {
      available: input.available,
      unavailableReason: input.available ? null : (input.unavailableReason ?? null),
      mustRun: input.mustRun,
    };
    await tx.update(gensets).set({ ...values, updatedAt: deps.now() }).where(eq(gensets.id, gensetId));
    await recordAudit(
      tx,
      actor,
      'genset',
      gensetId,
      'status',
      { available: before.available, unavailableReason: before.unavailableReason, mustRun: before.mustRun },
      values,
    );
    return { gensetId, designation: before.designation, ...values };
  });
}

export async function getPlantModel(deps: AppDeps, actor: Actor, vesselId: string) {
  return (await buildPlantModel(deps, actor, vesselId)).model;
}

/** Demand of a request under a rule: the plant load with the tie closed, else the load per section. */
function demandOf(input: Pick<SinglePointInput, 'loadKw' | 'sectionLoadsKw'>, rule: ReserveRule, units: GensetUnit[]): Demand {
  const sections = [...new Set(units.map((u) => u.busSection))];
  if (rule.busTieClosed || sections.length <= 1) {
    if (input.loadKw !== undefined) return input.loadKw;
    return Object.values(input.sectionLoadsKw ?? {}).reduce((s, x) => s + x, 0);
  }
  if (!input.sectionLoadsKw) {
    throw new AppError('validation_failed', `The bus tie is open in this mode: enter the load of each bus section (${sections.join(', ')})`, [
      { path: 'sectionLoadsKw', message: 'Enter the load per bus section' },
    ]);
  }
  const unknown = Object.keys(input.sectionLoadsKw).filter((k) => !sections.includes(k));
  if (unknown.length) {
    throw new AppError('validation_failed', `Unknown bus section ${unknown.join(', ')}`, [{ path: 'sectionLoadsKw', message: 'Unknown bus section' }]);
  }
  return input.sectionLoadsKw;
}

function combinationView(c: RankedCombination, byId: Map<string, PlantUnit>): CombinationView {
  return {
    rank: c.rank,
    gensetIds: c.unitIds,
    designations: c.unitNames,
    loadKw: c.loadKw,
    fuelKgPerH: c.fuelKgPerH,
    fuelKgPerDay: c.fuelKgPerDay,
    sfocGPerKwh: c.sfocGPerKwh,
    capacityKw: c.capacityKw,
    reserveKw: c.reserveKw,
    reservePct: c.reservePct,
    units: c.units.map((u) => ({
      gensetId: u.id,
      designation: u.name,
      loadKw: u.loadKw,
      loadPct: (100 * u.loadKw) / (byId.get(u.id)?.ratedKw ?? u.loadKw),
      fuelKgPerH: u.fuelKgPerH,
      sfocGPerKwh: u.loadKw > 0 ? (1000 * u.fuelKgPerH) / u.loadKw : null,
    })),
    sections: c.sections.map((s) => ({ busSection: s.busSection, loadKw: s.loadKw, capacityKw: s.capacityKw, reserveKw: s.reserveKw })),
  };
}

/** Every feasible combination at one load, ranked by fuel rate, with reasons, equal split and saving. */
export async function recommendAtPoint(deps: AppDeps, actor: Actor, vesselId: string, input: SinglePointInput): Promise<SinglePointResult> {
  const plant = await buildPlantModel(deps, actor, vesselId);
  const rules = await rulesOfVessel(deps.db, vesselId);
  const rule = ruleOf(rules, input.mode);
  const base = {
    vesselId,
    mode: input.mode,
    rule,
    plant: plant.model,
    caution: RECOMMENDATION_CAUTION,
    combinations: [] as CombinationView[],
    unitReasons: [] as SinglePointResult['unitReasons'],
    equalSplitFuelKgPerH: null,
    equalSplitReason: null,
    savedFuelKgPerDay: null,
  };
  const demand = demandOf(input, rule, plant.units);
  const loadKw = typeof demand === 'number' ? demand : Object.values(demand).reduce((s, x) => s + x, 0);
  const sectionLoadsKw = typeof demand === 'number' ? null : demand;
  if (plant.units.length === 0) {
    return { ...base, loadKw, sectionLoadsKw, feasible: false, reasons: ['the vessel has no service set with a fuel curve (fit or shop test)'] };
  }
  const r = optimizerCall('Recommendation', () => rankCombinations(plant.units, demand, rule));
  if (!r.feasible) return { ...base, loadKw, sectionLoadsKw, feasible: false, reasons: r.reasons };
  const byId = new Map(plant.model.units.map((u) => [u.gensetId, u]));
  return {
    ...base,
    loadKw,
    sectionLoadsKw,
    feasible: true,
    reasons: [],
    combinations: r.combinations.map((c) => combinationView(c, byId)),
    unitReasons: r.unitReasons.map((u) => ({ gensetId: u.id, designation: u.name, on: u.on, reason: u.reason })),
    equalSplitFuelKgPerH: r.equalSplitFuelKgPerH,
    equalSplitReason: r.equalSplitReason,
    savedFuelKgPerDay: r.savedFuelKgPerDay,
  };
}

/**
 * Share of the plant load on each bus section when the tie is open: in proportion to the maximum continuous
 * capacity of the available sets on it (an assumption of the guideline and of plans without per-section loads).
 */
export function sectionShares(units: GensetUnit[]): Record<string, number> {
  const cap = new Map<string, number>();
  for (const u of units) if (u.available) cap.set(u.busSection, (cap.get(u.busSection) ?? 0) + (u.ratedKw * u.maxLoadPct) / 100);
  const total = [...cap.values()].reduce((s, x) => s + x, 0);
  const out: Record<string, number> = {};
  const names = [...cap.keys()].sort();
  let used = 0;
  names.forEach((n, i) => {
    const pct = i === names.length - 1 ? 100 - used : (100 * cap.get(n)!) / total;
    out[n] = pct;
    used += pct;
  });
  return out;
}

function hashOf(value: unknown): string {
  return createHash('sha256').update(JSON.stringify(value)).digest('hex');
}

type GuidelineRow = typeof guidelines.$inferSelect;
interface GuidelineInputs {
  methodVersion: number;
  stepPct: number;
  units: Omit<PlantUnit, 'curveFitId' | 'curveNote'>[];
  rules: OperatingRules['rules'];
}

function guidelineView(row: GuidelineRow, vesselName: string, created: boolean, units: PlantUnit[]): Guideline {
  const result = row.result as Pick<Guideline, 'modes'>;
  return {
    id: row.id,
    vesselId: row.vesselId,
    vesselName,
    version: row.version,
    inputHash: row.inputHash,
    createdAt: row.createdAt.toISOString(),
    created,
    units,
    modes: result.modes,
    caution: RECOMMENDATION_CAUTION,
  };
}

function sweepMode(units: GensetUnit[], mode: OperatingModeName, rule: ReserveRule): Guideline['modes'][number] {
  const sections = new Set(units.filter((u) => u.available).map((u) => u.busSection));
  const shares = !rule.busTieClosed && sections.size > 1 ? sectionShares(units) : null;
  const empty = { mode, rule, stepKw: 0, sectionSharePct: shares, minFeasibleKw: null, maxFeasibleKw: null, bands: [], gaps: [] };
  if (!units.some((u) => u.available)) return { ...empty, error: 'no available service set with a fuel curve' };
  try {
    const g = operatingGuideline(units, rule, { stepPct: GUIDELINE_STEP_PCT, sectionSharePct: shares ?? undefined });
    return {
      mode,
      rule,
      stepKw: g.stepKw,
      sectionSharePct: shares,
      minFeasibleKw: g.minFeasibleKw,
      maxFeasibleKw: g.maxFeasibleKw,
      bands: g.bands.map((b) => ({
        fromKw: b.fromKw,
        toKw: b.toKw,
        gensetIds: b.unitIds,
        designations: b.unitNames,
        midKw: b.midKw,
        fuelKgPerDay: b.fuelKgPerDay,
        sfocGPerKwh: b.sfocGPerKwh,
        nextBest: b.nextBest ? { designations: b.nextBest.unitNames, fuelKgPerDay: b.nextBest.fuelKgPerDay } : null,
        extraFuelNextBestKgPerDay: b.extraFuelNextBestKgPerDay,
      })),
      gaps: g.gaps,
      error: null,
    };
  } catch (e) {
    return { ...empty, error: e instanceof Error ? e.message : String(e) };
  }
}

/**
 * The vessel's current guideline: the latest stored version when its inputs (curves, rules, plant) hash the
 * same, else a new version swept now and stored (audited).
 */
export async function currentGuideline(deps: AppDeps, actor: Actor, vesselId: string): Promise<Guideline> {
  const plant = await buildPlantModel(deps, actor, vesselId);
  const rules = await rulesOfVessel(deps.db, vesselId);
  const inputs: GuidelineInputs = {
    methodVersion: GUIDELINE_METHOD_VERSION,
    stepPct: GUIDELINE_STEP_PCT,
    units: plant.model.units.map(({ curveFitId: _f, curveNote: _n, ...u }) => u),
    rules: rules.map((r) => ({ ...r, updatedAt: null, stored: false })),
  };
  const inputHash = hashOf(inputs);
  const [latest] = await deps.db.select().from(guidelines).where(eq(guidelines.vesselId, vesselId)).orderBy(desc(guidelines.version)).limit(1);
  if (latest && latest.inputHash === inputHash) return guidelineView(latest, plant.vessel.name, false, plant.model.units);
  const modes = OPERATING_MODES.map((m) => sweepMode(plant.units, m, ruleOf(rules, m)));
  const row = await deps.db.transaction(async (tx) => {
    const [last] = await tx.select({ version: guidelines.version }).from(guidelines).where(eq(guidelines.vesselId, vesselId)).orderBy(desc(guidelines.version)).limit(1);
    const version = (last?.version ?? 0) + 1;
    const [created] = await tx
      .insert(guidelines)
      .values({ vesselId, version, inputHash, inputs: { ...inputs, units: plant.model.units }, result: { modes }, createdBy: actor.userId, createdAt: deps.now() })
      .returning();
    await recordAudit(tx, actor, 'guideline', created.id, 'create', null, { vesselId, version, inputHash });
    return created;
  });
  return guidelineView(row, plant.vessel.name, true, plant.model.units);
}

export async function listGuidelines(deps: AppDeps, actor: Actor, vesselId: string): Promise<GuidelineSummary[]> {
  await vesselForActor(deps.db, actor, vesselId);
  const rows = await deps.db
    .select({ id: guidelines.id, version: guidelines.version, inputHash: guidelines.inputHash, createdAt: guidelines.createdAt })
    .from(guidelines)
    .where(eq(guidelines.vesselId, vesselId))
    .orderBy(desc(guidelines.version));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

export async function getGuidelineVersion(deps: AppDeps, actor: Actor, vesselId: string, version: number): Promise<Guideline> {
  const vessel = await vesselForActor(deps.db, actor, vesselId);
  const [row] = await deps.db.select().from(guidelines).where(and(eq(guidelines.vesselId, vesselId), eq(guidelines.version, version)));
  if (!row) throw notFound('Guideline');
  const units = (row.inputs as { units: PlantUnit[] }).units;
  return guidelineView(row, vessel.name, false, units);
}
