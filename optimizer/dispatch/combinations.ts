/**
 * Which gensets to run at one operating point: enumeration of every combination of available sets, each
 * dispatched exactly, filtered by the mode's reserve rule and ranked by fuel rate.
 */
import type { GensetUnit, ReserveRule } from '../plant';
import {
  dispatchPrepared,
  equalSplitPrepared,
  prepareUnits,
  type DispatchFeasible,
  type UnitLoad,
} from './economic-dispatch';
import { formatNumber, type PreparedUnit } from './prepared-unit';

/** Plant load (bus tie closed) or load per bus section, kW. With the tie closed a per-section record is summed. */
export type Demand = number | Record<string, number>;

/** First rule a combination fails, in the order they are checked. */
export type CombinationRule = 'min-sets' | 'above-maximum' | 'reserve' | 'n-minus-1' | 'below-minimum';

export interface RankOptions {
  /** Most sets that may start or stop (2^N combinations). Default 12. */
  maxSwitchableSets?: number;
  /** Also return each rejected combination with its first failed rule. Default false. */
  listRejected?: boolean;
  /** Passed to the economic dispatch. Default 1e-9. */
  lambdaRelTol?: number;
}

/** Dispatch of one bus section (the whole plant when the bus tie is closed). */
export interface SectionDispatch {
  /** Bus section, or 'all' when the bus tie is closed. */
  busSection: string;
  loadKw: number;
  unitIds: string[];
  dispatch: DispatchFeasible;
  /** Maximum continuous capacity online, kW. */
  capacityKw: number;
  /** Capacity online above the load, kW. */
  reserveKw: number;
}

export interface RankedCombination {
  /** 1 = least fuel. */
  rank: number;
  unitIds: string[];
  unitNames: string[];
  loadKw: number;
  fuelKgPerH: number;
  fuelKgPerDay: number;
  /** Plant SFOC, g/kWh; null at zero load. */
  sfocGPerKwh: number | null;
  capacityKw: number;
  reserveKw: number;
  /** Reserve as % of the load; null at zero load. */
  reservePct: number | null;
  units: UnitLoad[];
  sections: SectionDispatch[];
}

export interface UnitReason {
  id: string;
  name: string;
  on: boolean;
  reason: string;
}

export interface RejectedCombination {
  busSection: string;
  unitIds: string[];
  rule: CombinationRule;
  reason: string;
}

export interface RankFeasible {
  feasible: true;
  loadKw: number;
  /** Every feasible combination, least fuel first. */
  combinations: RankedCombination[];
  best: RankedCombination;
  /** For every set passed in, why it is on or off in the best combination. */
  unitReasons: UnitReason[];
  /** Fuel rate of the best combination's sets sharing load equally (% of rating); null when that is not possible. */
  equalSplitFuelKgPerH: number | null;
  equalSplitReason: string | null;
  /** (equal split − optimal split) × 24 h for the best combination, kg/day; null when equal split is not possible. */
  savedFuelKgPerDay: number | null;
  rejected?: RejectedCombination[];
}

export interface RankInfeasible {
  feasible: false;
  loadKw: number;
  /** Which rule(s) cannot be met. */
  reasons: string[];
  rejected?: RejectedCombination[];
}

export type RankResult = RankFeasible | RankInfeasible;

const DEFAULT_MAX_SWITCHABLE = 12;
const HOURS_PER_DAY = 24;
const N_MINUS_1_SOURCE = 'SOLAS II-1/41 asks that essential services survive the loss of any one generating set';
const NUMBER_WORDS = ['no', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve'];

type SectionOption =
  | { ok: true; mask: number; members: PreparedUnit[]; dispatch: DispatchFeasible; capacityKw: number; minKw: number }
  | { ok: false; mask: number; rule: CombinationRule; minKw: number };

export interface Section {
  busSection: string;
  /** Label used in reasons: '' when the bus tie is closed, ' on bus section A' when open. */
  where: string;
  loadKw: number;
  fixed: PreparedUnit[];
  free: PreparedUnit[];
  options: SectionOption[];
}

function label(p: PreparedUnit): string {
  return p.unit.name || p.unit.id;
}

function joinNames(members: PreparedUnit[]): string {
  return members.length > 0 ? members.map(label).join(' + ') : 'no set';
}

function countWord(n: number): string {
  return NUMBER_WORDS[n] ?? String(n);
}

function setsWord(n: number): string {
  return `${countWord(n)} set${n === 1 ? '' : 's'}`;
}

function tolKw(capacityKw: number): number {
  return 1e-9 * Math.max(1, capacityKw);
}

/** Spinning reserve the rule asks for at a load: the larger of the absolute and the percentage margin. */
export function requiredMarginKw(loadKw: number, rule: ReserveRule): number {
  return Math.max(rule.marginKw, (rule.marginPct / 100) * loadKw);
}

function firstFailedRule(
  count: number,
  minKw: number,
  maxKw: number,
  largestKw: number,
  loadKw: number,
  rule: ReserveRule,
): CombinationRule | null {
  const tol = tolKw(maxKw);
  if (loadKw <= 0) return minKw > tol ? 'below-minimum' : null; // a dead section needs no set
  if (count < rule.minSets) return 'min-sets';
  if (loadKw > maxKw + tol) return 'above-maximum';
  if (maxKw + tol < loadKw + requiredMarginKw(loadKw, rule)) return 'reserve';
  if (rule.nMinus1 && maxKw - largestKw + tol < loadKw) return 'n-minus-1';
  if (loadKw < minKw - tol) return 'below-minimum';
  return null;
}

function sums(members: PreparedUnit[]): { minKw: number; maxKw: number; largest: PreparedUnit | null } {
  let minKw = 0;
  let maxKw = 0;
  let largest: PreparedUnit | null = null;
  for (const p of members) {
    minKw += p.minKw;
    maxKw += p.maxKw;
    if (!largest || p.maxKw > largest.maxKw) largest = p;
  }
  return { minKw, maxKw, largest };
}

function nMinus1Text(members: PreparedUnit[], loadKw: number): string {
  const { maxKw, largest } = sums(members);
  if (!largest) return `no set online for the ${formatNumber(loadKw)} kW load`;
  return (
    `losing ${label(largest)} (${formatNumber(largest.maxKw)} kW) leaves ${formatNumber(maxKw - largest.maxKw)} kW ` +
    `for the ${formatNumber(loadKw)} kW load`
  );
}

/** Reason text of one rejected combination. */
function describeFailure(rule: CombinationRule, members: PreparedUnit[], section: Section, reserve: ReserveRule): string {
  const { minKw, maxKw } = sums(members);
  const load = formatNumber(section.loadKw);
  switch (rule) {
    case 'min-sets':
      return (
        (members.length > 0 ? `${setsWord(members.length)} online (${joinNames(members)})` : 'no set online') +
        `; the mode asks for at least ${countWord(reserve.minSets)}${section.where}`
      );
    case 'above-maximum':
      return `load ${load} kW exceeds the ${formatNumber(maxKw)} kW maximum continuous capacity of ${joinNames(members)}`;
    case 'reserve':
      return (
        `spinning reserve ${formatNumber(maxKw - section.loadKw)} kW is below the required ` +
        `${formatNumber(requiredMarginKw(section.loadKw, reserve))} kW`
      );
    case 'n-minus-1':
      return `N-1 not met: ${nMinus1Text(members, section.loadKw)} (${N_MINUS_1_SOURCE})`;
    case 'below-minimum':
      return `load ${load} kW is below the ${formatNumber(minKw)} kW sum of minimum loads of ${joinNames(members)}`;
  }
}

function membersOf(section: Section, mask: number): PreparedUnit[] {
  const members = section.fixed.slice();
  section.free.forEach((p, bit) => {
    if (mask & (1 << bit)) members.push(p);
  });
  return members;
}

/** Enumerates every on/off choice of a section's free sets; stats are built incrementally from the lowest bit. */
function enumerateSection(section: Section, rule: ReserveRule, relTol: number): void {
  const n = section.free.length;
  const size = 1 << n;
  const count = new Int32Array(size);
  const minKw = new Float64Array(size);
  const maxKw = new Float64Array(size);
  const largestKw = new Float64Array(size);
  const base = sums(section.fixed);
  count[0] = section.fixed.length;
  minKw[0] = base.minKw;
  maxKw[0] = base.maxKw;
  largestKw[0] = base.largest ? base.largest.maxKw : 0;
  const options: SectionOption[] = new Array(size);
  for (let mask = 0; mask < size; mask++) {
    if (mask > 0) {
      const low = mask & -mask;
      const prev = mask ^ low;
      const p = section.free[31 - Math.clz32(low)];
      count[mask] = count[prev] + 1;
      minKw[mask] = minKw[prev] + p.minKw;
      maxKw[mask] = maxKw[prev] + p.maxKw;
      largestKw[mask] = Math.max(largestKw[prev], p.maxKw);
    }
    const failed = firstFailedRule(count[mask], minKw[mask], maxKw[mask], largestKw[mask], section.loadKw, rule);
    if (failed) {
      options[mask] = { ok: false, mask, rule: failed, minKw: minKw[mask] };
      continue;
    }
    const members = membersOf(section, mask);
    const dispatch = dispatchPrepared(members, section.loadKw, relTol);
    options[mask] = dispatch.feasible
      ? { ok: true, mask, members, dispatch, capacityKw: maxKw[mask], minKw: minKw[mask] }
      : { ok: false, mask, rule: dispatch.rule === 'above-maximum' ? 'above-maximum' : 'below-minimum', minKw: minKw[mask] };
  }
  section.options = options;
}

/** Splits the plant into the sections dispatched separately (one 'all' section with the bus tie closed). */
export function buildSections(prepared: PreparedUnit[], demand: Demand, rule: ReserveRule): Section[] {
  const usable = prepared.filter((p) => p.unit.available);
  const checkLoad = (kw: number, what: string): number => {
    if (!Number.isFinite(kw) || kw < 0) throw new Error(`rankCombinations requires a finite load ≥ 0 kW${what}`);
    return kw;
  };
  const make = (busSection: string, where: string, loadKw: number, members: PreparedUnit[]): Section => ({
    busSection,
    where,
    loadKw,
    fixed: members.filter((p) => p.unit.mustRun),
    free: members.filter((p) => !p.unit.mustRun),
    options: [],
  });
  if (rule.busTieClosed) {
    const total =
      typeof demand === 'number'
        ? checkLoad(demand, '')
        : Object.entries(demand).reduce((s, [k, v]) => s + checkLoad(v, ` (bus section ${k})`), 0);
    return [make('all', '', total, usable)];
  }
  const names = new Set(prepared.map((p) => p.unit.busSection));
  if (typeof demand === 'number') {
    if (names.size > 1) {
      throw new Error('rankCombinations requires a load per bus section when the bus tie is open');
    }
    const only = names.size === 1 ? [...names][0] : 'all';
    return [make(only, '', checkLoad(demand, ''), usable)];
  }
  for (const k of Object.keys(demand)) names.add(k);
  const sorted = [...names].sort();
  const where = (s: string): string => (sorted.length > 1 ? ` on bus section ${s}` : '');
  return sorted.map((s) =>
    make(s, where(s), checkLoad(demand[s] ?? 0, ` (bus section ${s})`), usable.filter((p) => p.unit.busSection === s)),
  );
}

/** Why no combination of a section works: the rules that cannot be met even with every available set. */
function explainSection(section: Section, rule: ReserveRule): string[] {
  const prefix = section.where ? `bus section ${section.busSection}: ` : '';
  const all = [...section.fixed, ...section.free];
  const load = formatNumber(section.loadKw);
  const reasons: string[] = [];
  const { minKw: fixedMinKw } = sums(section.fixed);
  if (section.loadKw > 0 && all.length === 0) return [`${prefix}load ${load} kW but no available set`];
  if (section.loadKw > 0) {
    const { maxKw } = sums(all);
    const tol = tolKw(maxKw);
    if (all.length < rule.minSets) {
      reasons.push(
        `minimum ${setsWord(rule.minSets)} online cannot be met: only ${countWord(all.length)} available`,
      );
    }
    if (section.loadKw > maxKw + tol) {
      reasons.push(`load ${load} kW exceeds the ${formatNumber(maxKw)} kW maximum continuous capacity of available sets`);
    } else if (maxKw + tol < section.loadKw + requiredMarginKw(section.loadKw, rule)) {
      const marginKw = requiredMarginKw(section.loadKw, rule);
      reasons.push(
        `spinning reserve cannot be met: the ${load} kW load with a ${formatNumber(marginKw)} kW margin needs ` +
          `${formatNumber(section.loadKw + marginKw)} kW online, available sets give ${formatNumber(maxKw)} kW`,
      );
    }
    if (rule.nMinus1 && maxKw - (sums(all).largest?.maxKw ?? 0) + tol < section.loadKw) {
      reasons.push(
        `N-1 cannot be met: with all ${countWord(all.length)} available sets online, ` +
          `${nMinus1Text(all, section.loadKw)} (${N_MINUS_1_SOURCE})`,
      );
    }
  }
  if (fixedMinKw > section.loadKw + tolKw(fixedMinKw)) {
    reasons.push(
      `load ${load} kW is below the ${formatNumber(fixedMinKw)} kW sum of minimum loads of the must-run sets ` +
        `(${joinNames(section.fixed)})`,
    );
  }
  if (reasons.length === 0) {
    // Only the minimum loads conflict with the other rules: name the smallest combination that meets them.
    let smallest: SectionOption | null = null;
    for (const o of section.options) {
      if (!o.ok && o.rule === 'below-minimum' && (!smallest || o.minKw < smallest.minKw)) smallest = o;
    }
    const who = smallest ? ` (${joinNames(membersOf(section, smallest.mask))})` : '';
    reasons.push(
      `load ${load} kW is below the ${formatNumber(smallest?.minKw ?? 0)} kW sum of minimum loads of the smallest ` +
        `combination that meets the minimum number of sets, reserve and N-1${who}`,
    );
  }
  return reasons.map((r) => prefix + r);
}

/** Cartesian product of the sections' feasible options (bus tie open: sections are independent). */
function combine(sections: Section[]): SectionOption[][] {
  let product: SectionOption[][] = [[]];
  for (const section of sections) {
    const feasible = section.options.filter((o) => o.ok);
    const next: SectionOption[][] = [];
    for (const partial of product) for (const o of feasible) next.push([...partial, o]);
    product = next;
  }
  return product;
}

function toRanked(sections: Section[], choice: SectionOption[]): RankedCombination {
  const parts: SectionDispatch[] = [];
  const units: UnitLoad[] = [];
  let fuelKgPerH = 0;
  let capacityKw = 0;
  let loadKw = 0;
  choice.forEach((o, i) => {
    if (!o.ok) throw new Error('unreachable: infeasible option in a combination');
    const s = sections[i];
    parts.push({
      busSection: s.busSection,
      loadKw: s.loadKw,
      unitIds: o.members.map((p) => p.unit.id),
      dispatch: o.dispatch,
      capacityKw: o.capacityKw,
      reserveKw: o.capacityKw - s.loadKw,
    });
    units.push(...o.dispatch.units);
    fuelKgPerH += o.dispatch.fuelKgPerH;
    capacityKw += o.capacityKw;
    loadKw += s.loadKw;
  });
  const reserveKw = capacityKw - loadKw;
  return {
    rank: 0,
    unitIds: units.map((u) => u.id),
    unitNames: units.map((u) => u.name),
    loadKw,
    fuelKgPerH,
    fuelKgPerDay: fuelKgPerH * HOURS_PER_DAY,
    sfocGPerKwh: loadKw > 0 ? (fuelKgPerH * 1000) / loadKw : null,
    capacityKw,
    reserveKw,
    reservePct: loadKw > 0 ? (reserveKw / loadKw) * 100 : null,
    units,
    sections: parts,
  };
}

function reasonFor(p: PreparedUnit, sections: Section[], bestChoice: SectionOption[], rule: ReserveRule): UnitReason {
  const head = { id: p.unit.id, name: p.unit.name };
  if (!p.unit.available) {
    const note = p.unit.mustRun ? ', although marked must-run' : '';
    return { ...head, on: false, reason: `off: unavailable (maintenance or defect)${note}` };
  }
  if (p.unit.mustRun) return { ...head, on: true, reason: 'on: must run' };
  const si = sections.findIndex((s) => s.free.includes(p));
  const section = sections[si];
  const bit = 1 << section.free.indexOf(p);
  const current = bestChoice[si];
  if (!current.ok) throw new Error('unreachable: infeasible option in the best combination');
  const on = (current.mask & bit) !== 0;
  const other = section.options[current.mask ^ bit];
  const members = membersOf(section, other.mask);
  if (on) {
    if (other.ok) {
      const plus = formatNumber(other.dispatch.fuelKgPerH - current.dispatch.fuelKgPerH, 2);
      return { ...head, on, reason: `on: cheapest combination that carries the load (without it +${plus} kg/h)` };
    }
    // Name the most basic rule the set is needed for (capacity first), not merely the first one checked.
    const { maxKw, largest } = sums(members);
    const tol = tolKw(maxKw);
    const loadKw = section.loadKw;
    if (loadKw > maxKw + tol) {
      const without = members.length > 0 ? ` (without it ${formatNumber(maxKw)} kW for ${formatNumber(loadKw)} kW)` : '';
      return { ...head, on, reason: `on: needed to carry the load${without}` };
    }
    if (maxKw + tol < loadKw + requiredMarginKw(loadKw, rule)) {
      return { ...head, on, reason: `on: needed for spinning reserve; without it ${describeFailure('reserve', members, section, rule)}` };
    }
    if (rule.nMinus1 && maxKw - (largest?.maxKw ?? 0) + tol < loadKw) {
      return { ...head, on, reason: `on: needed for N-1; without it ${nMinus1Text(members, loadKw)} (${N_MINUS_1_SOURCE})` };
    }
    if (other.rule === 'min-sets') {
      return { ...head, on, reason: `on: minimum ${setsWord(rule.minSets)} online${section.where} in this mode` };
    }
    return { ...head, on, reason: `on: ${describeFailure(other.rule, members, section, rule)}` };
  }
  if (section.loadKw <= 0) return { ...head, on, reason: `off: no load${section.where}` };
  if (other.ok) {
    const met = rule.nMinus1 ? 'N-1' : rule.marginKw > 0 || rule.marginPct > 0 ? 'reserve' : 'load';
    const plus = formatNumber(other.dispatch.fuelKgPerH - current.dispatch.fuelKgPerH, 2);
    return { ...head, on, reason: `off: ${met} met without it (running it too adds ${plus} kg/h)` };
  }
  return { ...head, on, reason: `off: with it, ${describeFailure(other.rule, members, section, rule)}` };
}

function checkRule(rule: ReserveRule): void {
  const ok =
    rule.marginKw >= 0 &&
    rule.marginPct >= 0 &&
    Number.isInteger(rule.minSets) &&
    rule.minSets >= 0 &&
    Number.isFinite(rule.marginKw) &&
    Number.isFinite(rule.marginPct);
  if (!ok) throw new Error('rankCombinations requires marginKw ≥ 0, marginPct ≥ 0 and a whole minSets ≥ 0');
}

/**
 * Ranks every feasible combination of available gensets at one operating point by fuel rate.
 *
 * All 2^N on/off choices of the sets that may start or stop are enumerated (must-run sets always in,
 * unavailable sets never; emergency sets are not passed in). A combination is kept when, per bus section with
 * the tie open or for the whole plant with it closed: at least `minSets` are online; the load lies within the
 * sums of minimum and maximum continuous loads; the online maximum continuous capacity is at least the load
 * plus max(marginKw, marginPct % of load); and, with `nMinus1`, the rest still carry the load when the largest
 * running set trips (SOLAS II-1/41, common practice for essential services). A section with zero load may be
 * left dead. Each kept combination is dispatched exactly (`dispatchLoad`), so the unit-commitment answer is
 * exact for the given curves (Wood & Wollenberg, 2nd ed., §5.2 and Example 5A: commitment by enumeration).
 *
 * Cost: O(2^N · D) with D the cost of one dispatch (N ≤ 12 by default); well under 5 ms for 8 sets.
 *
 * Throws on bad input (negative load, bad rule, too many switchable sets, missing per-section load with the
 * tie open, bad curves). No feasible combination is a result `{ feasible: false, reasons }`.
 *
 * @example
 * const r = rankCombinations(units, 1800, { marginKw: 200, marginPct: 10, minSets: 2, nMinus1: true, busTieClosed: true });
 * if (r.feasible) r.best.unitNames; // e.g. ['DG1', 'DG3']
 */
export function rankCombinations(units: GensetUnit[], demand: Demand, rule: ReserveRule, options: RankOptions = {}): RankResult {
  checkRule(rule);
  const prepared = prepareUnits(units, 'rankCombinations');
  const sections = buildSections(prepared, demand, rule);
  const maxSwitchable = options.maxSwitchableSets ?? DEFAULT_MAX_SWITCHABLE;
  const switchable = sections.reduce((s, x) => s + x.free.length, 0);
  if (switchable > maxSwitchable) {
    throw new Error(`rankCombinations enumerates at most ${maxSwitchable} sets that may start or stop (got ${switchable})`);
  }
  const relTol = options.lambdaRelTol ?? 1e-9;
  for (const s of sections) enumerateSection(s, rule, relTol);
  const loadKw = sections.reduce((s, x) => s + x.loadKw, 0);
  const rejected = options.listRejected
    ? sections.flatMap((s) =>
        s.options.flatMap((o): RejectedCombination[] => {
          if (o.ok) return [];
          const members = membersOf(s, o.mask);
          return [{ busSection: s.busSection, unitIds: members.map((p) => p.unit.id), rule: o.rule, reason: describeFailure(o.rule, members, s, rule) }];
        }),
      )
    : undefined;
  const withRejected = <T extends object>(r: T): T => (rejected ? { ...r, rejected } : r);
  const blocked = sections.filter((s) => !s.options.some((o) => o.ok));
  if (blocked.length > 0) {
    return withRejected({ feasible: false, loadKw, reasons: blocked.flatMap((s) => explainSection(s, rule)) });
  }
  const choices = combine(sections);
  const ranked = choices.map((c) => ({ c, r: toRanked(sections, c) }));
  ranked.sort(
    (x, y) =>
      x.r.fuelKgPerH - y.r.fuelKgPerH ||
      x.r.unitIds.length - y.r.unitIds.length ||
      x.r.unitIds.join('\u0000').localeCompare(y.r.unitIds.join('\u0000')),
  );
  ranked.forEach((x, i) => (x.r.rank = i + 1));
  const best = ranked[0];
  const unitReasons = prepared.map((p) => reasonFor(p, sections, best.c, rule));
  let equalFuel: number | null = 0;
  let equalReason: string | null = null;
  for (const part of best.c) {
    if (!part.ok) continue;
    const section = sections[best.c.indexOf(part)];
    const split = equalSplitPrepared(part.members, section.loadKw);
    if (split.feasible) {
      if (equalFuel !== null) equalFuel += split.fuelKgPerH;
    } else {
      equalFuel = null;
      equalReason = (section.where ? `bus section ${section.busSection}: ` : '') + split.reason;
    }
  }
  return withRejected({
    feasible: true as const,
    loadKw,
    combinations: ranked.map((x) => x.r),
    best: best.r,
    unitReasons,
    equalSplitFuelKgPerH: equalFuel,
    equalSplitReason: equalReason,
    savedFuelKgPerDay: equalFuel === null ? null : (equalFuel - best.r.fuelKgPerH) * HOURS_PER_DAY,
  });
}
