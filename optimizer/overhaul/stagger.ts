/**
 * Stagger advice: hour budgets per set until a date so that the sets' due dates are spread by a minimum gap and
 * fall in work windows (port calls, dry docks), at the least fuel.
 */
import { dateOfDayNumber, dayNumber } from '../logs/series-checks';
import { solveLinearModel, type LinearColumn, type LinearModel, type LinearRow, type LinearSolution } from './linear-model';

/** One set to stagger: its hours left to the next due and how it runs now. */
export interface StaggerSet {
  gensetId: string;
  /** Maintenance kind that falls due (label only). */
  kind?: string;
  /** Running hours left to the due on fromDate, h (> 0). */
  hoursLeftH: number;
  /** Present usage, h per day (the baseline for the fuel delta). */
  usageHPerDay: number;
  /** Fuel rate at its usual load, kg/h; or give sfocGPerKwh and usualLoadKw. */
  fuelKgPerH?: number;
  sfocGPerKwh?: number;
  usualLoadKw?: number;
  /** Least and most hours per day the set may run, default 0 and 24. */
  minHPerDay?: number;
  maxHPerDay?: number;
  /** true: the set may also stay short of its due until the date (then it needs no window). Default false. */
  mayFallDueAfterDate?: boolean;
}

/** A period in which maintenance work can be done, dates inclusive. */
export interface WorkWindow {
  id: string;
  startsOn: string;
  endsOn: string;
  /** e.g. "port call Rotterdam" or "dry dock". */
  label?: string;
}

export interface StaggerInput {
  /** Date of the hours-left figures (the latest readings); day 1 is the day after. */
  fromDate: string;
  /** The budgets run until the end of this date. */
  untilDate: string;
  sets: StaggerSet[];
  windows: WorkWindow[];
  /** Least days between the due dates of any two sets (0: no gap rule). */
  minGapDays: number;
  /** Set-hours per day the plant needs in total, shared by the sets. */
  requiredSetHoursPerDay: number;
}

export interface SetBudget {
  gensetId: string;
  kind: string | null;
  /** Hours to run from the day after fromDate to the end of untilDate. */
  budgetH: number;
  hPerDay: number;
  /** Due date at that even rate; null when the set stays short of its due until the date. */
  dueDate: string | null;
  /** The window the due date falls in; null when none. */
  windowId: string | null;
  /** Days from the due date to the nearest window day (0 inside one); null without a due date or windows. */
  daysFromWindow: number | null;
  nearestWindowId: string | null;
  /** Present usage scaled to the required set-hours, over the same days. */
  baselineBudgetH: number;
  fuelKg: number;
  baselineFuelKg: number;
}

export interface StaggerProposal {
  /** 'in-windows': every due in a window; 'nearest': the windows cannot all be met, dues as near as possible. */
  status: 'in-windows' | 'nearest' | 'infeasible';
  /** Why windows (or the whole problem) could not be met: which set cannot make which window, and the like. */
  reasons: string[];
  horizonDays: number;
  budgets: SetBudget[];
  /** Budgets by set id, the voyage plan's running-hour limits (PlanProblem.maxRunningHours) over these days. */
  hourBudgets: Record<string, number>;
  /** Σ days from windows of all dues (0 when 'in-windows'). */
  totalDaysFromWindows: number;
  fuelKg: number;
  baselineFuelKg: number;
  /** fuelKg − baselineFuelKg: the fuel cost of the stagger, kg. */
  fuelDeltaKg: number;
  /** false when the time limit cut a solve short: the answer is the best found, not proven best (or none found). */
  proven: boolean;
}

/** Margin that keeps the rate strictly below the bound at which the due would move a day earlier, h/day. */
export const RATE_MARGIN_H_PER_DAY = 1e-6;

/**
 * Outside windows (and when no window is entered) dues are placed on every 7th day: the day-indexed MILP stays
 * small enough for javascript-lp-solver, and a planner plans dues outside port calls to the week anyway.
 */
export const DEFAULT_OFF_WINDOW_STEP_DAYS = 7;

/** Time limit of one javascript-lp-solver solve, ms; only the "nearest" fallback on long horizons comes near it. */
export const DEFAULT_TIME_LIMIT_MS = 10_000;

interface Prepared {
  id: string;
  kind: string | null;
  hoursLeftH: number;
  minH: number;
  maxH: number;
  fuelKgPerH: number;
  usageHPerDay: number;
  mayAfter: boolean;
}

interface Prepared_Window {
  id: string;
  label: string;
  from: number;
  to: number;
}

/** Everything the models are built from. */
export interface StaggerProblem {
  horizonDays: number;
  fromDay: number;
  sets: Prepared[];
  windows: Prepared_Window[];
  gapDays: number;
  requiredH: number;
  /** Outside windows a due may fall only on every this-many-th day (day numbers divisible by it). */
  offWindowStepDays: number;
}

function finiteNumber(what: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new Error(`proposeHourBudgets requires ${what} to be a finite number (got ${String(v)})`);
  return v;
}

/**
 * Checks and normalises the input. Throws messages naming the field; used by proposeHourBudgets and the models.
 *
 * Cost O(n + w). Throws on bad dates, untilDate not after fromDate, duplicate set ids, missing fuel figures, rates
 * outside 0 to 24 h/day or min above max, a negative or fractional gap, a negative requirement, windows ending
 * before they start.
 *
 * @example prepareStagger(input).horizonDays // days from the day after fromDate to untilDate
 */
export function prepareStagger(input: StaggerInput, offWindowStepDays = DEFAULT_OFF_WINDOW_STEP_DAYS): StaggerProblem {
  if (!(Number.isInteger(offWindowStepDays) && offWindowStepDays >= 1)) throw new Error('proposeHourBudgets requires offWindowStepDays to be a whole number ≥ 1');
  const fromDay = dayNumber(input.fromDate);
  const horizonDays = dayNumber(input.untilDate) - fromDay;
  if (horizonDays < 1) throw new Error('proposeHourBudgets requires untilDate after fromDate');
  if (input.sets.length === 0) throw new Error('proposeHourBudgets requires at least one set');
  const gapDays = finiteNumber('minGapDays', input.minGapDays);
  if (!(Number.isInteger(gapDays) && gapDays >= 0)) throw new Error('proposeHourBudgets requires minGapDays to be a whole number ≥ 0');
  const requiredH = finiteNumber('requiredSetHoursPerDay', input.requiredSetHoursPerDay);
  if (requiredH < 0) throw new Error('proposeHourBudgets requires requiredSetHoursPerDay ≥ 0');
  const ids = new Set<string>();
  const sets = input.sets.map((s): Prepared => {
    if (ids.has(s.gensetId)) throw new Error(`proposeHourBudgets requires each set once (${s.gensetId} appears twice)`);
    ids.add(s.gensetId);
    const minH = finiteNumber(`minHPerDay of ${s.gensetId}`, s.minHPerDay ?? 0);
    const maxH = finiteNumber(`maxHPerDay of ${s.gensetId}`, s.maxHPerDay ?? 24);
    if (minH < 0 || maxH > 24 || minH > maxH) throw new Error(`proposeHourBudgets requires 0 ≤ minHPerDay ≤ maxHPerDay ≤ 24 for ${s.gensetId}`);
    let fuelKgPerH: number;
    if (s.fuelKgPerH !== undefined) fuelKgPerH = finiteNumber(`fuelKgPerH of ${s.gensetId}`, s.fuelKgPerH);
    else if (s.sfocGPerKwh !== undefined && s.usualLoadKw !== undefined) {
      fuelKgPerH = (finiteNumber(`sfocGPerKwh of ${s.gensetId}`, s.sfocGPerKwh) * finiteNumber(`usualLoadKw of ${s.gensetId}`, s.usualLoadKw)) / 1000;
    } else throw new Error(`proposeHourBudgets requires fuelKgPerH, or sfocGPerKwh and usualLoadKw, for ${s.gensetId}`);
    if (fuelKgPerH < 0) throw new Error(`proposeHourBudgets requires a fuel rate ≥ 0 for ${s.gensetId}`);
    const usageHPerDay = finiteNumber(`usageHPerDay of ${s.gensetId}`, s.usageHPerDay);
    if (usageHPerDay < 0 || usageHPerDay > 24) throw new Error(`proposeHourBudgets requires usageHPerDay between 0 and 24 for ${s.gensetId}`);
    return {
      id: s.gensetId,
      kind: s.kind ?? null,
      hoursLeftH: finiteNumber(`hoursLeftH of ${s.gensetId}`, s.hoursLeftH),
      minH,
      maxH,
      fuelKgPerH,
      usageHPerDay,
      mayAfter: s.mayFallDueAfterDate === true,
    };
  });
  const windows: Prepared_Window[] = [];
  for (const w of input.windows) {
    const from = dayNumber(w.startsOn) - fromDay;
    const to = dayNumber(w.endsOn) - fromDay;
    if (to < from) throw new Error(`proposeHourBudgets requires window ${w.id} to end on or after its start`);
    if (to < 1 || from > horizonDays) continue;
    windows.push({ id: w.id, label: w.label ? `${w.label} (${w.startsOn} to ${w.endsOn})` : `${w.id} (${w.startsOn} to ${w.endsOn})`, from: Math.max(1, from), to: Math.min(horizonDays, to) });
  }
  windows.sort((a, b) => a.from - b.from);
  return { horizonDays, fromDay, sets, windows, gapDays, requiredH, offWindowStepDays };
}

/**
 * Rate interval [lo, hi] (h/day) that puts the due of a set with H hours left on a day from `from` to `to`
 * (H/to ≤ r < H/(from − 1)); null when empty.
 */
function slotRate(s: Prepared, from: number, to: number): [number, number] | null {
  const lo = Math.max(s.minH, s.hoursLeftH / to);
  const hi = Math.min(s.maxH, from === 1 ? Infinity : s.hoursLeftH / (from - 1) - RATE_MARGIN_H_PER_DAY);
  return lo <= hi ? [lo, hi] : null;
}

/** Rate interval that keeps the set short of its due through the horizon; null when empty or not allowed. */
function afterRate(p: StaggerProblem, s: Prepared): [number, number] | null {
  if (!s.mayAfter) return null;
  const hi = Math.min(s.maxH, s.hoursLeftH / p.horizonDays - RATE_MARGIN_H_PER_DAY);
  return s.minH <= hi ? [s.minH, hi] : null;
}

/** Days from day k to the nearest window day (0 inside), and that window; [0, null] when there are no windows. */
export function windowDistance(p: StaggerProblem, k: number): [number, Prepared_Window | null] {
  let best: [number, Prepared_Window | null] = [p.windows.length === 0 ? 0 : Infinity, null];
  for (const w of p.windows) {
    const d = k < w.from ? w.from - k : k > w.to ? k - w.to : 0;
    if (d < best[0]) best = [d, w];
  }
  return best;
}

/** A range of days a due may be placed in: one window day, or a block of off-window days. */
export interface DueSlot {
  fromDay: number;
  toDay: number;
  /** Days from a window of the slot's farthest day (0 for a window day). */
  distanceDays: number;
}

/**
 * The slots of the horizon: every window day alone; off-window days (all days when no window is entered) in
 * blocks of at most p.offWindowStepDays consecutive days, cut at windows and at multiples of the step.
 */
export function dueSlots(p: StaggerProblem): DueSlot[] {
  const out: DueSlot[] = [];
  let block: number[] = [];
  const flush = (): void => {
    if (block.length === 0) return;
    const distanceDays = Math.max(...block.map((k) => windowDistance(p, k)[0]));
    out.push({ fromDay: block[0], toDay: block[block.length - 1], distanceDays });
    block = [];
  };
  for (let k = 1; k <= p.horizonDays; k++) {
    const inWindow = p.windows.some((w) => k >= w.from && k <= w.to);
    if (inWindow) {
      flush();
      out.push({ fromDay: k, toDay: k, distanceDays: 0 });
      continue;
    }
    block.push(k);
    if (k % p.offWindowStepDays === 0) flush();
  }
  flush();
  return out;
}

/** The slots a set's rate limits allow, at most maxDistanceDays from a window, with their rate intervals. */
export function candidateSlots(p: StaggerProblem, s: Prepared, maxDistanceDays = Infinity): (DueSlot & { rate: [number, number] })[] {
  if (s.hoursLeftH <= 0) return [];
  const out: (DueSlot & { rate: [number, number] })[] = [];
  for (const slot of dueSlots(p)) {
    if (slot.distanceDays > maxDistanceDays) continue;
    const rate = slotRate(s, slot.fromDay, slot.toDay);
    if (rate) out.push({ ...slot, rate });
  }
  return out;
}

export type StaggerObjective = 'fuel' | 'window-distance';

/** The MILP and, per binary column of a due slot, the set index and slot. */
export interface StaggerModel extends LinearModel {
  slots: Record<string, { set: number; slot: DueSlot; rate: [number, number] }>;
}

/**
 * The stagger MILP (time-indexed). Columns: r_i, the set's even rate (h/day) over the horizon; y_i_a binary, the
 * set's due falls in slot a (a window day, or a block of off-window days); n_i binary, the set stays short of its
 * due (only when allowed). Rows: one due choice per set (Σ_a y + n = 1); the rate lies in the interval that puts
 * the due in the chosen slot [from, to], H/to ≤ r < H/(from − 1) (big-M-free: Σ_a lo_a·y ≤ r ≤ Σ_a hi_a·y); the
 * sets share the plant's set-hours (Σ r = N); and for every run of g consecutive days at most one slot of all
 * sets touching it is chosen. For single days that is exactly |due_i − due_j| ≥ g for every pair (the clique form
 * of a no-overlap rule, Wolsey, Integer Programming, 1998, ch. 1 and 9 on time-indexed formulations); for a block it
 * is conservative (the block counts as all its days). Objective 'fuel': Σ fuelKgPerH·D·r; 'window-distance':
 * Σ days from windows of the chosen slots (a block by its farthest day). maxDistanceDays adds Σ distance ≤ it.
 *
 * Cost: O(n·S) columns for S slots (≤ window days + D/step + windows), O(D) gap rows of up to n·g terms each.
 * Throws nothing beyond prepareStagger.
 *
 * @example buildStaggerModel(prepareStagger(input), { candidateDistanceDays: 0, objective: 'fuel' }).columns.length
 */
export function buildStaggerModel(
  p: StaggerProblem,
  options: {
    /** Candidate due days at most this many days from a window (0: inside windows only). Default: all. */
    candidateDistanceDays?: number;
    objective: StaggerObjective;
    /** Adds the row Σ days from windows ≤ this. */
    maxDistanceDays?: number;
    withGap?: boolean;
  },
): StaggerModel {
  const slots: StaggerModel['slots'] = {};
  const columns: LinearColumn[] = [];
  const rows: LinearRow[] = [];
  const share: [string, number][] = [];
  const distance: [string, number][] = [];
  const dueColumns = new Map<number, string[]>();
  p.sets.forEach((s, i) => {
    const r = `r${i}`;
    columns.push({ name: r, cost: options.objective === 'fuel' ? s.fuelKgPerH * p.horizonDays : 0, lower: s.minH, upper: s.maxH, binary: false });
    share.push([r, 1]);
    const pick: [string, number][] = [];
    const lo: [string, number][] = [[r, 1]];
    const hi: [string, number][] = [[r, 1]];
    const choose = (name: string, rate: [number, number], dist: number): void => {
      columns.push({ name, cost: options.objective === 'window-distance' ? dist : 0, lower: 0, upper: 1, binary: true });
      pick.push([name, 1]);
      lo.push([name, -rate[0]]);
      hi.push([name, -rate[1]]);
      if (dist > 0) distance.push([name, dist]);
    };
    for (const slot of candidateSlots(p, s, options.candidateDistanceDays)) {
      const name = `y${i}_${slot.fromDay}`;
      choose(name, slot.rate, slot.distanceDays);
      slots[name] = { set: i, slot, rate: slot.rate };
      for (let d = slot.fromDay; d <= slot.toDay; d++) dueColumns.set(d, [...(dueColumns.get(d) ?? []), name]);
    }
    const after = afterRate(p, s);
    if (after) choose(`n${i}`, after, 0);
    rows.push({ name: `pick${i}`, terms: pick, sense: '=', rhs: 1 });
    rows.push({ name: `lo${i}`, terms: lo, sense: '>=', rhs: 0 });
    rows.push({ name: `hi${i}`, terms: hi, sense: '<=', rhs: 0 });
  });
  rows.push({ name: 'share', terms: share, sense: '=', rhs: p.requiredH });
  if (options.withGap !== false && p.gapDays > 0) {
    let previous = '';
    for (let k = 1; k <= p.horizonDays; k++) {
      const terms: [string, number][] = [];
      const names = new Set<string>();
      for (let d = k; d < k + p.gapDays && d <= p.horizonDays; d++) for (const name of dueColumns.get(d) ?? []) names.add(name);
      for (const name of names) terms.push([name, 1]);
      const sets = new Set([...names].map((name) => slots[name].set));
      const key = terms.map(([name]) => name).join(' ');
      if (sets.size < 2 || key === previous) continue;
      previous = key;
      rows.push({ name: `gap${k}`, terms, sense: '<=', rhs: 1 });
    }
  }
  if (options.maxDistanceDays !== undefined) rows.push({ name: 'distance', terms: distance, sense: '<=', rhs: options.maxDistanceDays + 1e-6 });
  return { columns, rows, slots };
}

function describeRate(h: number): string {
  return `${Math.round(h * 100) / 100} h/day`;
}

/** Which window each set cannot make, and why (one line per set and window). */
function windowReasons(p: StaggerProblem): { reasons: string[]; setsWithoutWindow: string[] } {
  const reasons: string[] = [];
  const setsWithoutWindow: string[] = [];
  for (const s of p.sets) {
    let any = false;
    for (const w of p.windows) {
      const needHi = w.from === 1 ? Infinity : s.hoursLeftH / (w.from - 1);
      const needLo = s.hoursLeftH / w.to;
      if (needLo > s.maxH) reasons.push(`${s.id} cannot make ${w.label}: it would need at least ${describeRate(needLo)}, above its ${describeRate(s.maxH)}`);
      else if (needHi <= s.minH) reasons.push(`${s.id} cannot make ${w.label}: it would need below ${describeRate(needHi)}, under its minimum ${describeRate(s.minH)}`);
      else any = true;
    }
    if (!any && !afterRate(p, s)) setsWithoutWindow.push(s.id);
  }
  return { reasons, setsWithoutWindow };
}

type Solve = (model: LinearModel) => LinearSolution;

/** Solves cut short by the time limit during the current proposeHourBudgets call (it runs synchronously). */
const timedOutSolves = { count: 0 };

interface Solved {
  model: StaggerModel;
  values: Record<string, number>;
}

function solveModel(model: StaggerModel, solve: Solve): Solved | null {
  const solution = solve(model);
  if (solution.timedOut) timedOutSolves.count++;
  return solution.feasible ? { model, values: solution.values } : null;
}

/**
 * Dues nearest the windows: least Σ days from windows, then the least fuel for that placement. The first stage is
 * solved on slots at most Δ from a window, Δ doubling from the gap until the optimum V satisfies V ≤ Δ (then no
 * slot farther than Δ can do better, so V is the optimum over all slots) or Δ covers the horizon. The second stage
 * fixes the chosen slots and solves the rates for least fuel (an LP). (A full second MILP over all placements of
 * sum V made javascript-lp-solver stall on some instances, so the fuel is best for the placement, not over ties.)
 */
function solveNearest(p: StaggerProblem, solve: Solve): Solved | null {
  for (let delta = Math.max(7, p.gapDays); ; delta *= 2) {
    const full = delta >= p.horizonDays;
    const model = buildStaggerModel(p, { candidateDistanceDays: full ? Infinity : delta, objective: 'window-distance' });
    const first = solve(model);
    if (first.timedOut) timedOutSolves.count++;
    if (first.feasible && (full || first.objective <= delta + 1e-6)) {
      const fuel = buildStaggerModel(p, { candidateDistanceDays: full ? Infinity : delta, objective: 'fuel' });
      const fixed: StaggerModel = {
        ...fuel,
        columns: fuel.columns.map((c) => (c.binary ? { ...c, binary: false, lower: Math.round(first.values[c.name] ?? 0), upper: Math.round(first.values[c.name] ?? 0) } : c)),
      };
      return solveModel(fixed, solve);
    }
    if (full) return null;
  }
}

function baselineRates(p: StaggerProblem): number[] {
  const total = p.sets.reduce((s, x) => s + x.usageHPerDay, 0);
  return p.sets.map((s) => (total > 0 ? (s.usageHPerDay * p.requiredH) / total : p.requiredH / p.sets.length));
}

function readProposal(p: StaggerProblem, status: 'in-windows' | 'nearest', reasons: string[], solved: Solved): StaggerProposal {
  const { model, values } = solved;
  const base = baselineRates(p);
  const budgets = p.sets.map((s, i): SetBudget => {
    const chosen = Object.entries(model.slots).find(([name, v]) => v.set === i && (values[name] ?? 0) > 0.5)?.[1];
    // The solver reports values to about 1e-8; keep the rate inside the chosen slot's interval so ⌈H / rate⌉ is in it.
    const [lo, hi] = (chosen ? chosen.rate : afterRate(p, s)) ?? [s.minH, s.maxH];
    const hPerDay = Math.min(hi, Math.max(lo, values[`r${i}`]));
    const dueDay = chosen ? Math.max(chosen.slot.fromDay, Math.ceil(s.hoursLeftH / hPerDay - 1e-9)) : null;
    const [dist, nearest] = dueDay === null ? [null, null] : windowDistance(p, dueDay);
    const budgetH = hPerDay * p.horizonDays;
    const baselineBudgetH = base[i] * p.horizonDays;
    return {
      gensetId: s.id,
      kind: s.kind,
      budgetH,
      hPerDay,
      dueDate: dueDay === null ? null : dateOfDayNumber(p.fromDay + dueDay),
      windowId: dist === 0 && nearest ? nearest.id : null,
      daysFromWindow: nearest ? dist : null,
      nearestWindowId: nearest ? nearest.id : null,
      baselineBudgetH,
      fuelKg: s.fuelKgPerH * budgetH,
      baselineFuelKg: s.fuelKgPerH * baselineBudgetH,
    };
  });
  const fuelKg = budgets.reduce((s, b) => s + b.fuelKg, 0);
  const baselineFuelKg = budgets.reduce((s, b) => s + b.baselineFuelKg, 0);
  return {
    status,
    reasons,
    horizonDays: p.horizonDays,
    budgets,
    hourBudgets: Object.fromEntries(budgets.map((b) => [b.gensetId, b.budgetH])),
    totalDaysFromWindows: budgets.reduce((s, b) => s + (b.daysFromWindow ?? 0), 0),
    fuelKg,
    baselineFuelKg,
    fuelDeltaKg: fuelKg - baselineFuelKg,
    proven: timedOutSolves.count === 0,
  };
}

function infeasible(p: StaggerProblem, reasons: string[]): StaggerProposal {
  return {
    status: 'infeasible',
    reasons,
    horizonDays: p.horizonDays,
    budgets: [],
    hourBudgets: {},
    totalDaysFromWindows: 0,
    fuelKg: 0,
    baselineFuelKg: 0,
    fuelDeltaKg: 0,
    proven: timedOutSolves.count === 0,
  };
}

/**
 * Proposes hour budgets per set until untilDate so that due dates are at least minGapDays apart and each falls in
 * a work window, at the least fuel; when no arrangement puts every due in a window, the dues as near the windows as
 * possible (least total days outside, then least fuel), with the reasons.
 *
 * Method: the exact MILP of `buildStaggerModel`, solved with javascript-lp-solver; first with window days only
 * (least fuel); if that is infeasible, the reasons are named (per set and window; then a solve without the gap
 * tells whether the gap or the load sharing is to blame) and the dues are placed nearest the windows (see
 * solveNearest). Each set runs its budget evenly (budget = rate × days); a due falls on day k = ⌈H / rate⌉ after
 * fromDate. Fuel = Σ fuelKgPerH × budget, against
 * the present usage scaled to the required set-hours. Assumptions: fuel per running hour is the set's figure at its
 * usual load; the downtime of the work itself is not modelled; windows outside the horizon are ignored.
 *
 * Outside windows a due is placed in a block of offWindowStepDays days (default 7), so "nearest" is to the week.
 *
 * Cost: one MILP on window days (milliseconds for a few sets and windows); when that is infeasible, a MILP without
 * the gap to name the reason and two or more MILPs on blocks near the windows. Each solve is limited to timeLimitMs
 * (default 10 s); a cut-short search gives proven: false. Throws on the bad input prepareStagger refuses.
 * Infeasible cases are results (status 'infeasible', reasons).
 *
 * @example proposeHourBudgets({ fromDate: '2027-01-01', untilDate: '2027-07-01', sets, windows, minGapDays: 14,
 *   requiredSetHoursPerDay: 36 }) // { status: 'in-windows', budgets: [{ gensetId: 'DG1', budgetH: …, dueDate: …, windowId: 'W1' }, …] }
 */
export function proposeHourBudgets(
  input: StaggerInput,
  options: { solve?: Solve; timeLimitMs?: number; offWindowStepDays?: number } = {},
): StaggerProposal {
  const p = prepareStagger(input, options.offWindowStepDays);
  const timeLimitMs = options.timeLimitMs ?? DEFAULT_TIME_LIMIT_MS;
  const solve = options.solve ?? ((model: LinearModel) => solveLinearModel(model, { timeLimitMs }));
  timedOutSolves.count = 0;
  const blocking: string[] = [];
  for (const s of p.sets) {
    if (s.hoursLeftH <= 0) blocking.push(`${s.id} is already due (${Math.round(s.hoursLeftH * 10) / 10} h left): record the work or leave it out`);
    else if (candidateSlots(p, s).length === 0 && !afterRate(p, s)) {
      blocking.push(`${s.id} cannot fall due by ${dateOfDayNumber(p.fromDay + p.horizonDays)}: ${s.hoursLeftH} h left need ${describeRate(s.hoursLeftH / p.horizonDays)}, above its ${describeRate(s.maxH)}`);
    }
  }
  const minTotal = p.sets.reduce((s, x) => s + x.minH, 0);
  const maxTotal = p.sets.reduce((s, x) => s + x.maxH, 0);
  if (p.requiredH > maxTotal) blocking.push(`the sets give at most ${maxTotal} set-hours per day; the plant needs ${p.requiredH}`);
  if (p.requiredH < minTotal) blocking.push(`the sets' minimum hours add up to ${minTotal} set-hours per day, above the ${p.requiredH} needed`);
  if (blocking.length > 0) return infeasible(p, blocking);

  const inWindows = solveModel(buildStaggerModel(p, { candidateDistanceDays: 0, objective: 'fuel' }), solve);
  if (inWindows) return readProposal(p, 'in-windows', [], inWindows);

  if (p.windows.length === 0) {
    const reason = timedOutSolves.count > 0
      ? `no arrangement found within the time limit of ${timeLimitMs} ms per solve`
      : `no budgets keep the due dates ${p.gapDays} days apart while the sets share ${p.requiredH} set-hours per day`;
    return infeasible(p, [reason]);
  }
  const { reasons, setsWithoutWindow } = windowReasons(p);
  for (const id of setsWithoutWindow) reasons.push(`${id} can make no window before ${dateOfDayNumber(p.fromDay + p.horizonDays)}`);
  if (setsWithoutWindow.length === 0) {
    const noGap = solve(buildStaggerModel(p, { candidateDistanceDays: 0, objective: 'fuel', withGap: false }));
    reasons.push(
      noGap.feasible
        ? `the windows cannot hold the due dates ${p.gapDays} days apart`
        : `the rates that put every due in a window cannot share the ${p.requiredH} set-hours per day the plant needs`,
    );
  }
  const nearest = solveNearest(p, solve);
  if (!nearest) {
    reasons.push(
      timedOutSolves.count > 0
        ? `no arrangement found within the time limit of ${timeLimitMs} ms per solve`
        : `no budgets keep the due dates ${p.gapDays} days apart while the sets share ${p.requiredH} set-hours per day`,
    );
    return infeasible(p, reasons);
  }
  return readProposal(p, 'nearest', reasons, nearest);
}
