/**
 * The Kilowatch demo scenario: an invented company with three vessels and two years of daily engine-room logs,
 * generated from KNOWN fuel curves so that every figure the product derives can be compared with the truth.
 *
 * Pure and deterministic: a seeded RNG (optimizer/random), a fixed date window (seed/dates), no I/O, no clock.
 * How the logs are made from the curves is described in seed/README.md.
 */
import { ISO_3046_REFERENCE_LCV_KJ_PER_KG, estimateLcvMjPerKg, volumeCorrectionFactor54B } from '../optimizer/fuel';
import type { QuadraticFuelCurve } from '../optimizer/plant';
import { createRng, type Rng } from '../optimizer/random';
import { SCENARIO_DAY_COUNT, SCENARIO_FIRST_DATE, SCENARIO_LAST_DATE, dateOfDayIndex, dayIndexOfDate, dayOfYear } from './dates';
import {
  DEMO_COMPANY,
  DEMO_PASSWORD,
  DEMO_USERS,
  DEMO_VESSELS,
  MODE_KEYS,
  type DemoRole,
  type DemoSignIn,
  type GensetSpec,
  type MaintenanceSpec,
  type ModeKey,
  type VesselSpec,
} from './fleet';
import { dayLengthsH, modeHoursByDay, type ForcedWindow } from './operations';
import { quadraticCurveFromSfoc, shopTestSfoc } from './true-curve';

export { DEMO_PASSWORD, SCENARIO_FIRST_DATE, SCENARIO_LAST_DATE };
export type { DemoRole, DemoSignIn, ModeKey };

/** Every demo sign-in (all share DEMO_PASSWORD). */
export const DEMO_SIGN_INS: readonly DemoSignIn[] = DEMO_USERS.map((u) => ({
  email: u.email,
  role: u.role,
  password: DEMO_PASSWORD,
  name: u.name,
  vessels: (u.vesselKeys ?? []).map((k) => DEMO_VESSELS.find((v) => v.key === k)?.name ?? k),
}));

export const DEFAULT_SCENARIO_SEED = 20_241_101;

/** Relative standard deviation of the fuel measurement noise. */
export const FUEL_METER_NOISE_REL_SD = 0.015;

/** Dated events written into the scenario (all invented). */
export const SCENARIO_EVENTS = {
  /** Shearwater Bay in a repair yard on shore power, all service sets stopped. */
  yardShorePower: { vesselKey: 'shearwater-bay', from: '2025-05-12', to: '2025-05-21' },
  /** Kittiwake Express laid up at anchor: two sets at low load. */
  layUpAtAnchor: { vesselKey: 'kittiwake-express', from: '2026-01-12', to: '2026-01-19' },
  /** Fulmar Spirit's engine-room logs lost for a few days. */
  logGap: { vesselKey: 'fulmar-spirit', from: '2025-09-08', to: '2025-09-11' },
  /** kWh meter of Shearwater Bay DG3 replaced at the start of the day. */
  kwhMeterReplacement: { gensetKey: 'shearwater-bay/DG3', date: '2025-08-14' },
  /** Fuel typed ten times too large, on the first day from this date on which the set ran at least 4 h. */
  fuelTypo: { gensetKey: 'kittiwake-express/DG3', onOrAfter: '2026-03-17' },
  /** Random missing days per vessel (besides the gap). */
  randomMissingDaysPerVessel: 3,
} as const;

export interface ScenarioOptions {
  /** Seed of the RNG (default DEFAULT_SCENARIO_SEED). */
  seed?: number;
  /**
   * false switches off everything that makes a log differ from the true curve at the day's mean load: fuel
   * measurement noise, the within-day load-variation effect and the rounding of readings. Default true.
   */
  noise?: boolean;
}

export interface ScenarioMaintenance {
  kind: string;
  intervalHours: number;
  intervalMonths: number | null;
  lastDoneRunningHours: number;
  lastDoneOn: string;
  /** true when doing it resets the set's SFOC deterioration. */
  resetsDrift: boolean;
}

export interface ScenarioGenset {
  key: string;
  vesselKey: string;
  designation: string;
  busSection: string | null;
  duty: 'service' | 'emergency';
  ratedKw: number;
  ratedKva: number;
  voltageV: number;
  frequencyHz: number;
  speedClass: 'high' | 'medium' | 'low';
  minLoadPct: number;
  maxLoadPct: number;
  startCostKg: number;
  minUpH: number;
  minDownH: number;
  shopTestSfoc: { p25: number; p50: number; p75: number; p85: number; p100: number };
  /** The true ISO-LCV fuel rate of the set as new (kg/h at P kW). */
  trueCurve: QuadraticFuelCurve;
  /** SFOC deterioration, g/kWh per 1 000 running hours since the last overhaul that resets it. */
  driftGPerKwhPer1000h: number;
  runningHoursAtStart: number;
  kwhMeterAtStart: number;
  /** Maintenance state on the first day. */
  maintenanceAtStart: ScenarioMaintenance[];
  /** Maintenance state after the last day (what the database gets). */
  maintenance: ScenarioMaintenance[];
}

export interface ScenarioVessel {
  key: string;
  name: string;
  imoNumber: string;
  vesselType: string;
  fuelGrades: string[];
  busSections: { name: string; sortOrder: number }[];
  fuelMeter: 'mass' | 'volume';
  gensets: ScenarioGenset[];
}

export interface ScenarioFuelLot {
  key: string;
  vesselKey: string;
  reference: string;
  grade: string;
  density15KgPerM3: number;
  /** LCV as recorded (measured, or estimated when lcvEstimated). */
  lcvMjPerKg: number;
  lcvEstimated: boolean;
  /** The lot's actual LCV, used to make the logs (equals lcvMjPerKg unless lcvEstimated). */
  trueLcvMjPerKg: number;
  sulphurPct: number;
  quantityT: number;
  deliveredOn: string;
}

/** What the generator knew when it wrote a log (not stored in the database). */
export interface ScenarioLogTruth {
  hoursRun: number;
  kwh: number;
  /** Mean load while running, kW (0 when the set did not run). */
  loadKw: number;
  /** Running hours since the last drift-resetting overhaul, at the start of the day. */
  hoursSinceOverhaul: number;
  /** Time-weighted variance of the load while running, kW². */
  loadVarianceKw2: number;
  /** Fuel at the ISO reference LCV, kg, before measurement noise. */
  fuelIsoKg: number;
  /** Fuel mass of the lot actually burned, kg, before measurement noise. */
  fuelKg: number;
}

export interface ScenarioLog {
  gensetKey: string;
  logDate: string;
  runningHoursMeter: number;
  kwhMeter: number;
  fuelMassKg: number | null;
  fuelVolumeL: number | null;
  fuelTempC: number | null;
  fuelLotKey: string;
  remarks: string | null;
  truth: ScenarioLogTruth;
}

export interface ScenarioModeHours {
  vesselKey: string;
  logDate: string;
  seaH: number;
  manoeuvringH: number;
  portH: number;
  anchorageH: number;
  shorePowerH: number;
}

export interface ScenarioMeterReplacement {
  gensetKey: string;
  date: string;
  meter: 'kwh';
  /** The old meter's last reading (at the start of the day). */
  oldFinalReading: number;
  /** The new meter's first reading. */
  newStartReading: number;
}

export interface ScenarioOverhaulEvent {
  gensetKey: string;
  kind: string;
  /** Date of the work (first day out of service when it takes the set out). */
  date: string;
  /** Running-hour meter at the work. */
  runningHours: number;
  resetsDrift: boolean;
}

export interface ScenarioUser {
  key: string;
  email: string;
  name: string;
  role: DemoRole;
  /** Vessel keys a vessel-scoped member sees; null when not scoped. */
  vesselScope: string[] | null;
}

export interface ScenarioDefects {
  missingDays: { vesselKey: string; date: string }[];
  shorePowerDays: { vesselKey: string; date: string }[];
  lowLoadAnchorDays: { vesselKey: string; date: string }[];
  clockChanges: { vesselKey: string; date: string; dayLengthH: number }[];
  typos: { gensetKey: string; date: string; field: 'fuelMassKg' | 'fuelVolumeL'; trueValue: number; loggedValue: number }[];
}

export interface DemoScenario {
  seed: number;
  noise: boolean;
  firstDate: string;
  lastDate: string;
  company: { name: string; emailDomain: string; currency: string };
  users: ScenarioUser[];
  vessels: ScenarioVessel[];
  fuelLots: ScenarioFuelLot[];
  logs: ScenarioLog[];
  modeHours: ScenarioModeHours[];
  meterReplacements: ScenarioMeterReplacement[];
  overhaulEvents: ScenarioOverhaulEvent[];
  defects: ScenarioDefects;
}

const ISO_LCV_MJ_PER_KG = ISO_3046_REFERENCE_LCV_KJ_PER_KG / 1000;
const DAYS_PER_MONTH = 30.44;
const round = (x: number, decimals: number) => Math.round(x * 10 ** decimals) / 10 ** decimals;
const draw = (rng: Rng, [lo, hi]: readonly [number, number]) => lo + (hi - lo) * rng.uniform();

/** Lot properties per grade (invented but typical ranges). */
const GRADE_PROPERTIES: Record<string, { densityKgPerM3: [number, number]; sulphurPct: [number, number]; family: 'distillate' | 'residual' }> = {
  VLSFO: { densityKgPerM3: [922, 962], sulphurPct: [0.38, 0.49], family: 'residual' },
  HFO: { densityKgPerM3: [975, 990.5], sulphurPct: [2.1, 3.0], family: 'residual' },
  MGO: { densityKgPerM3: [846, 872], sulphurPct: [0.04, 0.09], family: 'distillate' },
};

function subSeed(seed: number, stream: number): number {
  return (Math.imul(seed ^ 0x9e3779b9, 0x85ebca6b) ^ Math.imul(stream + 1, 0xc2b2ae35)) >>> 0;
}

function vesselCode(spec: VesselSpec): string {
  return spec.name
    .split(' ')
    .map((w) => w[0])
    .join('')
    .toUpperCase();
}

/** Bunker deliveries of one grade: the first before the scenario starts, then every interval until the end. */
function bunkerLots(spec: VesselSpec, grade: string, intervalDays: readonly [number, number], quantityT: readonly [number, number], rng: Rng): ScenarioFuelLot[] {
  const props = GRADE_PROPERTIES[grade];
  if (!props) throw new Error(`generateScenario has no lot properties for grade ${grade}`);
  const lots: ScenarioFuelLot[] = [];
  for (let day = -rng.int(10, 40); day < SCENARIO_DAY_COUNT - 3; day += rng.int(intervalDays[0], intervalDays[1])) {
    const deliveredOn = dateOfDayIndex(day);
    const density15KgPerM3 = round(draw(rng, props.densityKgPerM3), 1);
    const sulphurPct = round(draw(rng, props.sulphurPct), 2);
    const estimate = estimateLcvMjPerKg({ density15KgPerM3, sulphurPct, family: props.family });
    const trueLcvMjPerKg = round(estimate + rng.normal(0, 0.12), 2);
    const reference = `BDN-${vesselCode(spec)}-${deliveredOn.replace(/-/g, '')}-${grade}`;
    lots.push({
      key: `${spec.key}/${reference}`,
      vesselKey: spec.key,
      reference,
      grade,
      density15KgPerM3,
      lcvMjPerKg: trueLcvMjPerKg,
      lcvEstimated: false,
      trueLcvMjPerKg,
      sulphurPct,
      quantityT: Math.round(draw(rng, quantityT)),
      deliveredOn,
    });
  }
  return lots;
}

/** The lot in use on a day: the newest lot delivered at least two days before (settling), else the first. */
function lotOnDay(lots: readonly ScenarioFuelLot[], lotDays: readonly number[], day: number): ScenarioFuelLot {
  let pick = 0;
  for (let i = 0; i < lots.length; i++) if (lotDays[i] <= day - 2) pick = i;
  return lots[pick];
}

interface SetState {
  spec: GensetSpec;
  out: ScenarioGenset;
  meterH: number;
  kwhReading: number;
  resetMeterH: number;
  /** Per maintenance kind: last-done meter reading and day index. */
  lastDone: Map<string, { h: number; day: number }>;
  downUntilDay: number;
}

function initialMaintenance(spec: GensetSpec, vessel: VesselSpec, meterH: number, rng: Rng): { state: Map<string, { h: number; day: number }>; rows: ScenarioMaintenance[] } {
  const hoursPerDay = spec.duty === 'emergency' ? 0.07 : vessel.pastHoursPerDay;
  const ago = new Map<string, { h: number; days: number }>();
  for (const m of spec.maintenance) {
    let h: number;
    let days: number;
    if (m.intervalMonths !== null) {
      days = draw(rng, [0.05, 0.9]) * m.intervalMonths * DAYS_PER_MONTH;
      h = days * hoursPerDay;
    } else {
      const forcedTopH = spec.hoursSinceTopOverhaulAtStart;
      h = draw(rng, [0.05, 0.92]) * m.intervalHours;
      if (forcedTopH !== undefined && m.kind === 'top overhaul') h = forcedTopH;
      else if (forcedTopH !== undefined && m.includes.includes('top overhaul')) h = Math.max(h, forcedTopH + 2_000);
      days = h / hoursPerDay;
    }
    for (const includer of spec.maintenance) {
      const prior = ago.get(includer.kind);
      if (includer.includes.includes(m.kind) && prior && prior.h < h) ({ h, days } = prior);
    }
    ago.set(m.kind, { h: Math.min(h, meterH), days });
  }
  const state = new Map<string, { h: number; day: number }>();
  const rows = spec.maintenance.map((m) => {
    const a = ago.get(m.kind) as { h: number; days: number };
    const lastDoneRunningHours = round(meterH - a.h, 1);
    const day = -Math.max(1, Math.round(a.days));
    state.set(m.kind, { h: lastDoneRunningHours, day });
    return {
      kind: m.kind,
      intervalHours: m.intervalHours,
      intervalMonths: m.intervalMonths,
      lastDoneRunningHours,
      lastDoneOn: dateOfDayIndex(day),
      resetsDrift: m.resetsDrift,
    };
  });
  return { state, rows };
}

function makeGenset(spec: GensetSpec, vessel: VesselSpec, rng: Rng): SetState {
  const trueCurve = quadraticCurveFromSfoc({
    ratedKw: spec.ratedKw,
    minSfocGPerKwh: draw(rng, spec.minSfocGPerKwh),
    bestLoadFraction: draw(rng, spec.bestLoadFraction),
    riseAt25PctGPerKwh: draw(rng, spec.riseAt25PctGPerKwh),
  });
  const meterH = round(draw(rng, spec.runningHoursAtStart), 1);
  const kwhMeterAtStart = Math.round(meterH * spec.ratedKw * draw(rng, [0.45, 0.6]));
  const { state, rows } = initialMaintenance(spec, vessel, meterH, rng);
  const out: ScenarioGenset = {
    key: `${vessel.key}/${spec.designation}`,
    vesselKey: vessel.key,
    designation: spec.designation,
    busSection: spec.busSection,
    duty: spec.duty,
    ratedKw: spec.ratedKw,
    ratedKva: spec.ratedKw / 0.8,
    voltageV: spec.voltageV,
    frequencyHz: spec.frequencyHz,
    speedClass: spec.speedClass,
    minLoadPct: spec.minLoadPct,
    maxLoadPct: spec.maxLoadPct,
    startCostKg: spec.startCostKg,
    minUpH: spec.minUpH,
    minDownH: spec.minDownH,
    shopTestSfoc: shopTestSfoc(trueCurve, spec.ratedKw, draw(rng, [2.5, 5])),
    trueCurve,
    driftGPerKwhPer1000h: round(draw(rng, spec.driftGPerKwhPer1000h), 2),
    runningHoursAtStart: meterH,
    kwhMeterAtStart,
    maintenanceAtStart: rows,
    maintenance: rows.map((r) => ({ ...r })),
  };
  const resetMeterH = Math.max(...rows.filter((r) => r.resetsDrift).map((r) => r.lastDoneRunningHours));
  return { spec, out, meterH, kwhReading: kwhMeterAtStart, resetMeterH, lastDone: state, downUntilDay: -1 };
}

/** Does the start of `day` find maintenance kind m due on the set? */
function isDue(set: SetState, m: MaintenanceSpec, day: number): boolean {
  const last = set.lastDone.get(m.kind) as { h: number; day: number };
  if (set.meterH - last.h >= m.intervalHours) return true;
  return m.intervalMonths !== null && day - last.day >= m.intervalMonths * DAYS_PER_MONTH;
}

/** Does the due maintenance at the start of the day; returns the remarks for the day's log. */
function doDueMaintenance(set: SetState, day: number, noise: boolean, events: ScenarioOverhaulEvent[]): string[] {
  if (day <= set.downUntilDay) return [];
  const remarks: string[] = [];
  const doneToday = new Set<string>();
  const reading = noise ? round(set.meterH, 1) : set.meterH;
  for (const m of set.spec.maintenance) {
    if (doneToday.has(m.kind) || !isDue(set, m, day)) continue;
    for (const kind of [m.kind, ...m.includes]) {
      doneToday.add(kind);
      set.lastDone.set(kind, { h: reading, day });
      const row = set.out.maintenance.find((r) => r.kind === kind) as ScenarioMaintenance;
      row.lastDoneRunningHours = reading;
      row.lastDoneOn = dateOfDayIndex(day);
    }
    events.push({ gensetKey: set.out.key, kind: m.kind, date: dateOfDayIndex(day), runningHours: reading, resetsDrift: m.resetsDrift });
    if (m.resetsDrift) set.resetMeterH = reading;
    if (m.downtimeDays > 0 && set.spec.duty === 'service') set.downUntilDay = day + m.downtimeDays - 1;
    remarks.push(m.downtimeDays > 0 && set.spec.duty === 'service' ? `${m.kind}: set out of service ${m.downtimeDays} days` : `${m.kind} done`);
  }
  return remarks;
}

function shuffle(order: number[], rng: Rng): void {
  for (let i = order.length - 1; i > 0; i--) {
    const j = rng.int(0, i);
    [order[i], order[j]] = [order[j], order[i]];
  }
}

/** The crew's threshold commitment: indexes of the service sets online in one mode of one day. */
function commitSets(vessel: VesselSpec, sets: readonly SetState[], priority: readonly number[], mode: ModeKey, loadKw: number, day: number, rng: Rng): number[] {
  const policy = vessel.policy;
  const available = priority.filter((i) => sets[i].downUntilDay < day);
  const online: number[] = [];
  if (policy.oneSetPerSectionIn.includes(mode)) {
    for (const section of vessel.busSections) {
      const first = available.find((i) => sets[i].spec.busSection === section);
      if (first !== undefined) online.push(first);
    }
  }
  const minSets = policy.minSets[mode] ?? 1;
  const capacityKw = () => online.reduce((s, i) => s + sets[i].spec.ratedKw, 0) * policy.loadingFraction;
  for (const i of available) {
    if (online.length >= minSets && capacityKw() >= loadKw) break;
    if (!online.includes(i)) online.push(i);
  }
  const extra = available.find((i) => !online.includes(i));
  if (rng.uniform() < (policy.extraSetChance[mode] ?? 0) && extra !== undefined) online.push(extra);
  return online;
}

interface DayAccumulator {
  hoursRun: number;
  kwh: number;
  /** Σ (mean-square load × hours) for the within-day variance. */
  p2h: number;
}

interface VesselResult {
  vessel: ScenarioVessel;
  lots: ScenarioFuelLot[];
  logs: ScenarioLog[];
  modeHours: ScenarioModeHours[];
  meterReplacements: ScenarioMeterReplacement[];
  overhaulEvents: ScenarioOverhaulEvent[];
  defects: ScenarioDefects;
}

function windowDays(w: { from: string; to: string }): number[] {
  const days: number[] = [];
  for (let d = dayIndexOfDate(w.from); d <= dayIndexOfDate(w.to); d++) days.push(d);
  return days;
}

function generateVessel(spec: VesselSpec, vesselIndex: number, seed: number, noise: boolean): VesselResult {
  const rng = createRng(subSeed(seed, 2 * vesselIndex));
  const noiseRng = createRng(subSeed(seed, 2 * vesselIndex + 1));
  const ev = SCENARIO_EVENTS;
  const dayCount = SCENARIO_DAY_COUNT;

  // Fixed events of this vessel.
  const windows: ForcedWindow[] = [];
  const shorePowerDays = ev.yardShorePower.vesselKey === spec.key ? windowDays(ev.yardShorePower) : [];
  const layUpDays = ev.layUpAtAnchor.vesselKey === spec.key ? windowDays(ev.layUpAtAnchor) : [];
  if (shorePowerDays.length) windows.push({ fromDay: shorePowerDays[0], toDay: shorePowerDays[shorePowerDays.length - 1], mode: 'shorePower', leadInH: 2 });
  if (layUpDays.length) windows.push({ fromDay: layUpDays[0], toDay: layUpDays[layUpDays.length - 1], mode: 'anchorage', leadInH: 1 });
  const replacementKey = ev.kwhMeterReplacement.gensetKey;
  const replacementDay = replacementKey.startsWith(`${spec.key}/`) ? dayIndexOfDate(ev.kwhMeterReplacement.date) : -1;
  const typoFrom = ev.fuelTypo.gensetKey.startsWith(`${spec.key}/`) ? dayIndexOfDate(ev.fuelTypo.onOrAfter) : -1;
  const protectedDays = new Set<number>([...shorePowerDays, ...layUpDays]);
  for (const d of [replacementDay, typoFrom]) if (d >= 0) for (let k = -1; k <= 14; k++) protectedDays.add(d + k);

  // Missing days: the gap, then random single days (never next to a fixed event, never the first day).
  const missing = new Set<number>(ev.logGap.vesselKey === spec.key ? windowDays(ev.logGap) : []);
  for (const d of missing) for (let k = -1; k <= 1; k++) protectedDays.add(d + k);
  while (missing.size < (ev.logGap.vesselKey === spec.key ? windowDays(ev.logGap).length : 0) + ev.randomMissingDaysPerVessel) {
    const d = rng.int(5, dayCount - 5);
    if (protectedDays.has(d) || missing.has(d - 1) || missing.has(d) || missing.has(d + 1)) continue;
    missing.add(d);
  }

  const lengths = dayLengthsH(spec.profile, dayCount, rng, protectedDays);
  const modes = modeHoursByDay(spec.profile, lengths, windows, rng);

  // Fuel lots.
  const serviceLots = bunkerLots(spec, spec.serviceGrade, spec.bunkerIntervalDays, spec.bunkerQuantityT, rng);
  const emergencyLots = spec.emergencyGrade === spec.serviceGrade ? serviceLots : bunkerLots(spec, spec.emergencyGrade, [100, 200], [60, 150], rng);
  if (spec.key === 'shearwater-bay' && serviceLots.length > 2) {
    // One delivery came without a lab LCV: recorded as the ISO 8217 annex estimate, flagged estimated.
    const lot = serviceLots[2];
    const family = GRADE_PROPERTIES[lot.grade].family;
    lot.lcvMjPerKg = round(estimateLcvMjPerKg({ density15KgPerM3: lot.density15KgPerM3, sulphurPct: lot.sulphurPct, family }), 2);
    lot.lcvEstimated = true;
  }
  const serviceLotDays = serviceLots.map((l) => dayIndexOfDate(l.deliveredOn));
  const emergencyLotDays = emergencyLots.map((l) => dayIndexOfDate(l.deliveredOn));

  const sets = spec.gensets.map((g) => makeGenset(g, spec, rng));
  const service = sets.map((_, i) => i).filter((i) => sets[i].spec.duty === 'service');
  const priority = [...service];
  let nextRotationDay = 0;
  const testWeekday = (2 + 2 * vesselIndex) % 7;

  const logs: ScenarioLog[] = [];
  const modeHours: ScenarioModeHours[] = [];
  const meterReplacements: ScenarioMeterReplacement[] = [];
  const overhaulEvents: ScenarioOverhaulEvent[] = [];
  const defects: ScenarioDefects = { missingDays: [], shorePowerDays: [], lowLoadAnchorDays: [], clockChanges: [], typos: [] };
  let typoDone = typoFrom < 0;

  for (let day = 0; day < dayCount; day++) {
    const date = dateOfDayIndex(day);
    const dayRemarks: string[] = [];
    if (lengths[day] !== 24) {
      defects.clockChanges.push({ vesselKey: spec.key, date, dayLengthH: lengths[day] });
      dayRemarks.push(lengths[day] === 25 ? 'clocks retarded 1 h (25 h day)' : 'clocks advanced 1 h (23 h day)');
    }
    if (shorePowerDays.includes(day)) dayRemarks.push('repair yard, on shore power');
    const setRemarks = sets.map(() => [...dayRemarks]);
    sets.forEach((s, i) => setRemarks[i].push(...doDueMaintenance(s, day, noise, overhaulEvents)));

    if (day === replacementDay) {
      const i = sets.findIndex((s) => s.out.key === replacementKey);
      const set = sets[i];
      const oldFinalReading = noise ? Math.round(set.kwhReading) : set.kwhReading;
      const newStartReading = rng.int(0, 25);
      set.kwhReading = newStartReading;
      meterReplacements.push({ gensetKey: set.out.key, date, meter: 'kwh', oldFinalReading, newStartReading });
      setRemarks[i].push(`kWh meter replaced: old meter's final reading ${oldFinalReading} kWh, new meter started at ${newStartReading} kWh`);
    }

    if (day >= nextRotationDay) {
      shuffle(priority, rng);
      nextRotationDay = day + rng.int(spec.policy.rotationDays[0], spec.policy.rotationDays[1]);
    }

    // Loads and commitment per mode.
    const acc: DayAccumulator[] = sets.map(() => ({ hoursRun: 0, kwh: 0, p2h: 0 }));
    const season = 1 + spec.seasonalAmplitude * Math.cos((2 * Math.PI * (dayOfYear(day) - 200)) / 365.25);
    const m = modes[day];
    for (const mode of MODE_KEYS) {
      const h = m[mode];
      if (mode === 'shorePower' || h <= 0) continue;
      const wanted = spec.modeLoadKw[mode] * season * Math.max(0.4, 1 + spec.dayScatter * rng.normal());
      const online = commitSets(spec, sets, priority, mode, wanted, day, rng);
      if (online.length === 0) continue;
      const ratedSum = online.reduce((s, i) => s + sets[i].spec.ratedKw, 0);
      const maxKw = online.reduce((s, i) => s + (sets[i].spec.ratedKw * sets[i].spec.maxLoadPct) / 100, 0);
      const loadKw = Math.min(wanted, maxKw);
      const fluct = spec.withinModeFluctuation[mode];
      for (const i of online) {
        const p = (loadKw * sets[i].spec.ratedKw) / ratedSum;
        acc[i].hoursRun += h;
        acc[i].kwh += p * h;
        acc[i].p2h += p * p * (1 + fluct * fluct) * h;
      }
    }
    // Emergency sets: a short weekly test run.
    sets.forEach((s, i) => {
      if (s.spec.duty !== 'emergency' || day % 7 !== testWeekday) return;
      const h = rng.int(3, 6) / 10;
      const p = s.spec.ratedKw * draw(rng, [0.3, 0.5]);
      acc[i] = { hoursRun: h, kwh: p * h, p2h: p * p * h };
      setRemarks[i].push('weekly test run');
    });

    const isMissing = missing.has(day);
    if (isMissing) defects.missingDays.push({ vesselKey: spec.key, date });
    else {
      modeHours.push({ vesselKey: spec.key, logDate: date, seaH: m.sea, manoeuvringH: m.manoeuvring, portH: m.port, anchorageH: m.anchorage, shorePowerH: m.shorePower });
      if (shorePowerDays.includes(day)) defects.shorePowerDays.push({ vesselKey: spec.key, date });
      if (layUpDays.includes(day)) defects.lowLoadAnchorDays.push({ vesselKey: spec.key, date });
    }

    sets.forEach((s, i) => {
      const a = acc[i];
      const curve = s.out.trueCurve;
      const loadKw = a.hoursRun > 0 ? a.kwh / a.hoursRun : 0;
      const loadVarianceKw2 = a.hoursRun > 0 ? Math.max(0, a.p2h / a.hoursRun - loadKw * loadKw) : 0;
      const hoursSinceOverhaul = s.meterH - s.resetMeterH;
      const curveKg = a.hoursRun > 0 ? a.hoursRun * (curve.a + curve.b * loadKw + curve.c * loadKw * loadKw) : 0;
      const withinDayKg = noise ? curve.c * loadVarianceKw2 * a.hoursRun : 0;
      const driftKg = (((s.out.driftGPerKwhPer1000h * hoursSinceOverhaul) / 1000) * a.kwh) / 1000;
      const fuelIsoKg = curveKg + withinDayKg + driftKg;
      const emergency = s.spec.duty === 'emergency';
      const lot = emergency ? lotOnDay(emergencyLots, emergencyLotDays, day) : lotOnDay(serviceLots, serviceLotDays, day);
      const fuelKg = (fuelIsoKg * ISO_LCV_MJ_PER_KG) / lot.trueLcvMjPerKg;
      const measuredKg = noise ? fuelKg * (1 + FUEL_METER_NOISE_REL_SD * noiseRng.normal()) : fuelKg;
      const [tempMean, tempSd] = emergency ? spec.fuelTempC.emergency : spec.fuelTempC.service;
      const tempC = tempMean + tempSd * rng.normal();

      s.meterH += a.hoursRun;
      s.kwhReading += a.kwh;
      if (isMissing) return;

      let fuelMassKg: number | null = null;
      let fuelVolumeL: number | null = null;
      let fuelTempC: number | null = null;
      if (spec.fuelMeter === 'mass') fuelMassKg = noise ? round(measuredKg, 1) : measuredKg;
      else {
        fuelTempC = a.hoursRun > 0 ? (noise ? Math.round(tempC * 2) / 2 : tempC) : null;
        const vcf = fuelTempC === null ? 1 : volumeCorrectionFactor54B(lot.density15KgPerM3, fuelTempC);
        const litres = measuredKg / ((lot.density15KgPerM3 / 1000) * vcf);
        fuelVolumeL = noise ? round(litres, 1) : litres;
      }
      if (!typoDone && day >= typoFrom && s.out.key === ev.fuelTypo.gensetKey && a.hoursRun >= 4) {
        const field = fuelMassKg !== null ? 'fuelMassKg' : 'fuelVolumeL';
        const trueValue = (fuelMassKg ?? fuelVolumeL) as number;
        const loggedValue = round(trueValue * 10, 1);
        if (field === 'fuelMassKg') fuelMassKg = loggedValue;
        else fuelVolumeL = loggedValue;
        defects.typos.push({ gensetKey: s.out.key, date, field, trueValue, loggedValue });
        typoDone = true;
      }
      logs.push({
        gensetKey: s.out.key,
        logDate: date,
        runningHoursMeter: noise ? round(s.meterH, 1) : s.meterH,
        kwhMeter: noise ? Math.round(s.kwhReading) : s.kwhReading,
        fuelMassKg,
        fuelVolumeL,
        fuelTempC,
        fuelLotKey: lot.key,
        remarks: setRemarks[i].length ? setRemarks[i].join('; ') : null,
        truth: { hoursRun: a.hoursRun, kwh: a.kwh, loadKw, hoursSinceOverhaul, loadVarianceKw2, fuelIsoKg, fuelKg },
      });
    });
  }

  const vessel: ScenarioVessel = {
    key: spec.key,
    name: spec.name,
    imoNumber: spec.imoNumber,
    vesselType: spec.vesselType,
    fuelGrades: [...spec.fuelGrades],
    busSections: spec.busSections.map((name, sortOrder) => ({ name, sortOrder })),
    fuelMeter: spec.fuelMeter,
    gensets: sets.map((s) => s.out),
  };
  const lots = emergencyLots === serviceLots ? serviceLots : [...serviceLots, ...emergencyLots];
  return { vessel, lots, logs, modeHours, meterReplacements, overhaulEvents, defects };
}

/**
 * Generates the whole demo scenario: company, users, three vessels with their plants, fuel lots, and a daily log
 * of every genset for every day from SCENARIO_FIRST_DATE to SCENARIO_LAST_DATE, made from each set's true fuel
 * curve (see seed/README.md for the model and the defects written into the logs).
 *
 * Reference: fuel volumes are made with the ASTM D1250-80 Table 54B volume correction and fuel masses referred to
 * the ISO 3046-1 reference LCV of 42 700 kJ/kg (both via optimizer/fuel). Cost: O(days × gensets), about 10 000
 * log rows, tens of milliseconds. Deterministic for a given seed and noise option. Throws only on an inconsistent
 * fleet description (a programming error).
 *
 * @example const s = generateScenario({ seed: 7, noise: false }); s.vessels.length // 3
 */
export function generateScenario(options: ScenarioOptions = {}): DemoScenario {
  const seed = (options.seed ?? DEFAULT_SCENARIO_SEED) >>> 0;
  const noise = options.noise ?? true;
  const parts = DEMO_VESSELS.map((v, i) => generateVessel(v, i, seed, noise));
  const merge = <K extends keyof ScenarioDefects>(k: K): ScenarioDefects[K] => {
    const all: unknown[] = [];
    for (const p of parts) all.push(...p.defects[k]);
    return all as ScenarioDefects[K];
  };
  return {
    seed,
    noise,
    firstDate: SCENARIO_FIRST_DATE,
    lastDate: SCENARIO_LAST_DATE,
    company: { ...DEMO_COMPANY },
    users: DEMO_USERS.map((u) => ({ key: u.key, email: u.email, name: u.name, role: u.role, vesselScope: u.vesselKeys ? [...u.vesselKeys] : null })),
    vessels: parts.map((p) => p.vessel),
    fuelLots: parts.flatMap((p) => p.lots),
    logs: parts.flatMap((p) => p.logs),
    modeHours: parts.flatMap((p) => p.modeHours),
    meterReplacements: parts.flatMap((p) => p.meterReplacements),
    overhaulEvents: parts.flatMap((p) => p.overhaulEvents),
    defects: {
      missingDays: merge('missingDays'),
      shorePowerDays: merge('shorePowerDays'),
      lowLoadAnchorDays: merge('lowLoadAnchorDays'),
      clockChanges: merge('clockChanges'),
      typos: merge('typos'),
    },
  };
}
