/**
 * Savings of a vessel over a chosen period: optimizer/savings vesselSavings on the data of savings-data.ts (every
 * logged day, actual against recommended with the same fitted curves, delta-method intervals from each fit's
 * covariance, CO2 by MEPC.364(79) Cf, cost by the company's prices), and the adoption comparison before/after the
 * date from which the vessel follows the recommendations.
 */
import {
  adoptionEffect,
  adoptionPointsFromDays,
  vesselSavings,
  type DaySavings,
  type GensetUnit,
  type SavingsTotals,
  type VesselSavings,
} from '../../optimizer/index';
import {
  SAVINGS_CAUTION,
  SAVINGS_METHOD,
  savingsQuerySchema,
  type AdoptionView,
  type SavingsDayView,
  type SavingsQuery,
  type SavingsTotalsView,
  type VesselSavingsReport,
} from '../../shared/schemas/savings';
import type { Actor, AppDeps } from '../context';
import { parseBody } from '../lib/parse';
import { companyFuelPrices, toOptimizerPrices } from './fuel-prices';
import { optimizerCall } from './recommendations';
import { loadVesselSavingsData } from './savings-data';

/** Days in a row that must follow the recommendation before matched days count as adoption. */
const MATCHED_ADOPTION_MIN_DAYS = 7;

const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

export function totalsView(t: SavingsTotals): SavingsTotalsView {
  return { ...t, effectiveDof: finiteOrNull(t.effectiveDof) };
}

function dayView(d: DaySavings, byDay: SavingsTotals | undefined, names: Map<string, string>): SavingsDayView {
  const name = (id: string) => names.get(id) ?? id;
  return {
    date: d.date,
    grade: d.fuel.grade,
    energyKwh: d.energyKwh,
    plantHours: d.plantHours,
    averageLoadKw: d.averageLoadKw,
    actualSets: d.actualSets.map((s) => ({
      designation: name(s.unitId),
      hoursRun: s.hoursRun,
      kwh: s.kwh,
      loadKw: s.loadKw,
      loadPct: s.loadPct,
      modelledFuelKg: s.modelledFuelKg,
      measuredFuelKg: s.measuredFuelKg,
      lowLoadHours: s.lowLoadHours,
    })),
    modelledActualFuelKg: d.modelledActualFuelKg,
    measuredFuelKg: d.measuredFuelKg,
    residualKg: d.residualKg,
    residualPct: d.residualPct,
    recommendedFuelKg: d.recommendedFuelKg,
    avoidableFuelKg: d.avoidableFuelKg,
    avoidableLowerKg: d.avoidableFuelKg === null || !byDay ? null : byDay.avoidableFuelT.lower * 1000,
    avoidableUpperKg: d.avoidableFuelKg === null || !byDay ? null : byDay.avoidableFuelT.upper * 1000,
    avoidablePct: d.avoidablePct,
    modes: d.modes.map((m) => ({
      mode: m.mode,
      hours: m.hours,
      loadKw: m.loadKw,
      feasible: m.feasible,
      sets: m.unitIds.map(name),
      loadsKw: Object.fromEntries(Object.entries(m.loadsKw).map(([id, kw]) => [name(id), kw])),
      fuelKg: m.fuelKg,
      reasons: m.reasons,
    })),
    splitSavingRecommendedSetsKg: d.splitSavingRecommendedSetsKg,
    splitSavingActualSetsKg: d.splitSavingActualSetsKg,
    splitSavingActualSetsReason: d.splitSavingActualSetsReason,
    lowLoadHours: d.lowLoadHours,
    followedRecommendation: d.followedRecommendation,
  };
}

/** First day of the trailing run of days that followed the recommendation, when long enough and not the first day. */
function matchedAdoptionDate(days: DaySavings[]): string | null {
  let start = days.length;
  while (start > 0 && days[start - 1].followedRecommendation) start--;
  if (days.length - start < MATCHED_ADOPTION_MIN_DAYS || start < MATCHED_ADOPTION_MIN_DAYS) return null;
  return days[start].date;
}

function adoptionOf(
  result: VesselSavings,
  units: GensetUnit[],
  declared: string | null,
  level: number,
): { adoption: AdoptionView | null; adoptionUnavailable: string | null } {
  const matched = declared ? null : matchedAdoptionDate(result.days);
  const adoptedFrom = declared ?? matched;
  if (!adoptedFrom) {
    return {
      adoption: null,
      adoptionUnavailable: `No adoption date: the chief engineer has not marked one and the period does not end with ${MATCHED_ADOPTION_MIN_DAYS} or more days following the recommendation after as many that did not.`,
    };
  }
  try {
    const e = adoptionEffect(adoptionPointsFromDays(result.days, units), adoptedFrom, { level });
    return {
      adoption: {
        adoptedFrom,
        source: declared ? 'chief_engineer' : 'matched_days',
        daysBefore: e.daysBefore,
        daysAfter: e.daysAfter,
        rawSfocBeforeGPerKwh: e.rawSfocBeforeGPerKwh,
        rawSfocAfterGPerKwh: e.rawSfocAfterGPerKwh,
        changeGPerKwh: e.changeGPerKwh,
        changeLowerGPerKwh: e.changeLowerGPerKwh,
        changeUpperGPerKwh: e.changeUpperGPerKwh,
        changePct: e.changePct,
        fuelSavedAfterT: e.fuelSavedAfterT,
        level: e.level,
        warnings: e.warnings,
      },
      adoptionUnavailable: null,
    };
  } catch (err) {
    return { adoption: null, adoptionUnavailable: `Adoption from ${adoptedFrom} cannot be compared in this period: ${(err as Error).message}` };
  }
}

/** The computation behind the savings page and the reports (query already parsed). */
export async function computeVesselSavings(deps: AppDeps, actor: Actor, vesselId: string, q: { from: string; to: string; level: number }): Promise<VesselSavingsReport> {
  const data = await loadVesselSavingsData(deps, actor, vesselId, q.from, q.to);
  const prices = toOptimizerPrices(await companyFuelPrices(deps.db, actor.companyId, actor.currency));
  const result = optimizerCall('Savings', () =>
    vesselSavings(
      { units: data.units, fits: data.fits, rules: data.rules, days: data.days },
      { level: q.level, prices: prices.length ? prices : undefined, from: q.from, to: q.to },
    ),
  );
  const names = new Map(data.units.map((u) => [u.id, u.name]));
  const byDay = new Map(result.byDay.map((t) => [t.label, t]));
  const { adoption, adoptionUnavailable } = adoptionOf(result, data.units, data.vessel.followsRecommendationsFrom, q.level);
  const warnings = [...data.warnings, ...result.warnings];
  if (!prices.length) warnings.push('No fuel prices are set: cost is not shown (an admin sets them under Fuel prices).');
  return {
    vesselId,
    vesselName: data.vessel.name,
    from: q.from,
    to: q.to,
    level: q.level,
    currency: actor.currency,
    curves: data.curves,
    days: result.days.map((d) => dayView(d, byDay.get(d.date), names)),
    byMonth: result.byMonth.map(totalsView),
    period: totalsView(result.period),
    adoption,
    adoptionUnavailable,
    skippedDays: data.skippedDays,
    warnings,
    method: Object.values(SAVINGS_METHOD),
    caution: SAVINGS_CAUTION,
  };
}

/** Savings of a vessel the actor may see (404 otherwise) for the chosen period. */
export async function getVesselSavings(deps: AppDeps, actor: Actor, vesselId: string, rawQuery: SavingsQuery | unknown): Promise<VesselSavingsReport> {
  const q = parseBody(savingsQuerySchema, rawQuery, 'savings period');
  return computeVesselSavings(deps, actor, vesselId, q);
}
