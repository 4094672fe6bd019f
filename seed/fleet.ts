/**
 * The invented demo company, its people and its three vessels: fixed descriptions the scenario generator draws
 * from. Every name, e-mail, ship number, rating and maintenance interval here is invented for the demo.
 * Pure: no I/O.
 */

export type DemoRole = 'admin' | 'superintendent' | 'chief_engineer' | 'energy_officer' | 'planner';

/** Modes a vessel logs hours in (vessel_mode_hours). Shore power: no service set runs. */
export type ModeKey = 'sea' | 'manoeuvring' | 'port' | 'anchorage' | 'shorePower';
export const MODE_KEYS: readonly ModeKey[] = ['sea', 'manoeuvring', 'port', 'anchorage', 'shorePower'];

/** The one demo password of every demo user. */
export const DEMO_PASSWORD = 'kilowatch-demo';

export const DEMO_COMPANY = {
  name: 'Cormorant Shipping (demo)',
  emailDomain: 'cormorant.example',
  currency: 'USD',
} as const;

/** A demo user. vesselKeys: the vessels a vessel-scoped member sees; null when not scoped. */
export interface DemoUserSpec {
  key: string;
  email: string;
  name: string;
  role: DemoRole;
  vesselKeys: string[] | null;
}

const at = (local: string) => `${local}@${DEMO_COMPANY.emailDomain}`;

export const DEMO_USERS: readonly DemoUserSpec[] = [
  { key: 'admin', email: at('admin'), name: 'Mira Okonkwo', role: 'admin', vesselKeys: null },
  { key: 'superintendent', email: at('superintendent'), name: 'Tomas Lindgren', role: 'superintendent', vesselKeys: null },
  { key: 'chief-shearwater', email: at('chief.shearwater'), name: 'Rui Carvalho', role: 'chief_engineer', vesselKeys: ['shearwater-bay'] },
  { key: 'chief-fulmar', email: at('chief.fulmar'), name: 'Anand Pillai', role: 'chief_engineer', vesselKeys: ['fulmar-spirit'] },
  { key: 'chief-kittiwake', email: at('chief.kittiwake'), name: 'Ewa Sobczak', role: 'chief_engineer', vesselKeys: ['kittiwake-express'] },
  { key: 'energy', email: at('energy'), name: 'Priya Natarajan', role: 'energy_officer', vesselKeys: null },
  { key: 'planner', email: at('planner'), name: 'Jonas Brandt', role: 'planner', vesselKeys: null },
];

/** One sign-in of the demo, for the start script to print and for browser tests. */
export interface DemoSignIn {
  email: string;
  role: DemoRole;
  password: string;
  name: string;
  /** Vessel names a scoped member sees; empty when the member sees the whole fleet. */
  vessels: string[];
}

/** One maintenance kind of a set. `includes`: kinds done with it (a major overhaul includes a top overhaul). */
export interface MaintenanceSpec {
  kind: string;
  intervalHours: number;
  intervalMonths: number | null;
  /** true when doing it restores the set's SFOC (resets the deterioration). */
  resetsDrift: boolean;
  includes: string[];
  /** Days the set is out of service for it (0: done without taking the set out). */
  downtimeDays: number;
}

/** Invented demo intervals for medium-speed service sets. */
const MEDIUM_SPEED_MAINTENANCE: MaintenanceSpec[] = [
  { kind: 'major overhaul', intervalHours: 24_000, intervalMonths: null, resetsDrift: true, includes: ['top overhaul', 'fuel injector overhaul'], downtimeDays: 3 },
  { kind: 'top overhaul', intervalHours: 12_000, intervalMonths: null, resetsDrift: true, includes: ['fuel injector overhaul'], downtimeDays: 2 },
  { kind: 'fuel injector overhaul', intervalHours: 4_000, intervalMonths: null, resetsDrift: false, includes: [], downtimeDays: 0 },
];

/** Invented demo intervals for high-speed service sets. */
const HIGH_SPEED_MAINTENANCE: MaintenanceSpec[] = [
  { kind: 'major overhaul', intervalHours: 20_000, intervalMonths: null, resetsDrift: true, includes: ['top overhaul', 'fuel injector overhaul'], downtimeDays: 3 },
  { kind: 'top overhaul', intervalHours: 10_000, intervalMonths: null, resetsDrift: true, includes: ['fuel injector overhaul'], downtimeDays: 2 },
  { kind: 'fuel injector overhaul', intervalHours: 3_000, intervalMonths: null, resetsDrift: false, includes: [], downtimeDays: 0 },
];

/** Invented demo intervals for emergency sets (calendar-driven: they run a few hours a year). */
const EMERGENCY_MAINTENANCE: MaintenanceSpec[] = [
  { kind: 'top overhaul', intervalHours: 6_000, intervalMonths: 60, resetsDrift: true, includes: ['annual inspection'], downtimeDays: 0 },
  { kind: 'annual inspection', intervalHours: 500, intervalMonths: 12, resetsDrift: false, includes: [], downtimeDays: 0 },
];

/** How a set is described before the generator draws its individual figures. [lo, hi] ranges are drawn uniformly. */
export interface GensetSpec {
  designation: string;
  /** Bus section name; null for an emergency set (it feeds the emergency switchboard). */
  busSection: string | null;
  ratedKw: number;
  voltageV: number;
  frequencyHz: number;
  speedClass: 'high' | 'medium' | 'low';
  minLoadPct: number;
  maxLoadPct: number;
  startCostKg: number;
  minUpH: number;
  minDownH: number;
  duty: 'service' | 'emergency';
  minSfocGPerKwh: [number, number];
  bestLoadFraction: [number, number];
  riseAt25PctGPerKwh: [number, number];
  driftGPerKwhPer1000h: [number, number];
  /** Running-hour meter reading on the first scenario day. */
  runningHoursAtStart: [number, number];
  /** Hours since the last top overhaul on the first day; drawn when not fixed here. */
  hoursSinceTopOverhaulAtStart?: number;
  maintenance: MaintenanceSpec[];
}

/** The threshold commitment the crew follows (common practice in spirit; the numbers are invented). */
export interface CommitmentPolicy {
  /** Sets are added until the online rating × this fraction covers the load. */
  loadingFraction: number;
  minSets: Partial<Record<ModeKey, number>>;
  /** Chance that the crew runs one set more than the policy needs. */
  extraSetChance: Partial<Record<ModeKey, number>>;
  /** Modes in which every bus section must have a set online. */
  oneSetPerSectionIn: ModeKey[];
  /** Days between re-ordering which set leads, [lo, hi]. */
  rotationDays: [number, number];
}

export type OperatingProfile = 'liner' | 'tramp-tanker' | 'ferry';

export interface VesselSpec {
  key: string;
  name: string;
  /** Invented seven-digit ship number; its 7th digit deliberately fails the IMO check-digit rule. */
  imoNumber: string;
  vesselType: string;
  fuelGrades: string[];
  busSections: string[];
  /** How the service sets' fuel is measured: a mass flowmeter (kg) or a volumetric meter (L at a temperature). */
  fuelMeter: 'mass' | 'volume';
  serviceGrade: string;
  emergencyGrade: string;
  /** Fuel temperature at a volumetric meter, °C: mean and day-to-day standard deviation. */
  fuelTempC: { service: [number, number]; emergency: [number, number] };
  profile: OperatingProfile;
  /** Mean electrical load per mode, kW. */
  modeLoadKw: Record<ModeKey, number>;
  /** Relative amplitude of the seasonal load swing (air conditioning, reefers, heating). */
  seasonalAmplitude: number;
  /** Within-mode load fluctuation (standard deviation / mean) per mode. */
  withinModeFluctuation: Record<ModeKey, number>;
  /** Day-to-day load scatter (standard deviation / mean). */
  dayScatter: number;
  policy: CommitmentPolicy;
  /** Days between bunker deliveries of the service grade, [lo, hi]. */
  bunkerIntervalDays: [number, number];
  bunkerQuantityT: [number, number];
  /** Service-set running hours per calendar day before the scenario (to date past maintenance). */
  pastHoursPerDay: number;
  gensets: GensetSpec[];
}

const CONTAINER_SET: Omit<GensetSpec, 'designation' | 'busSection'> = {
  ratedKw: 2400,
  voltageV: 6600,
  frequencyHz: 60,
  speedClass: 'medium',
  minLoadPct: 30,
  maxLoadPct: 90,
  startCostKg: 14,
  minUpH: 2,
  minDownH: 1,
  duty: 'service',
  minSfocGPerKwh: [188, 193],
  bestLoadFraction: [0.8, 0.87],
  riseAt25PctGPerKwh: [28, 36],
  driftGPerKwhPer1000h: [1.0, 1.6],
  runningHoursAtStart: [38_000, 52_000],
  maintenance: MEDIUM_SPEED_MAINTENANCE,
};

const EMERGENCY_SET: Omit<GensetSpec, 'designation' | 'ratedKw' | 'voltageV'> = {
  busSection: null,
  frequencyHz: 60,
  speedClass: 'high',
  minLoadPct: 20,
  maxLoadPct: 100,
  startCostKg: 1,
  minUpH: 0,
  minDownH: 0,
  duty: 'emergency',
  minSfocGPerKwh: [211, 216],
  bestLoadFraction: [0.8, 0.9],
  riseAt25PctGPerKwh: [34, 42],
  driftGPerKwhPer1000h: [1.5, 2.0],
  runningHoursAtStart: [700, 1_600],
  maintenance: EMERGENCY_MAINTENANCE,
};

const TANKER_SET: Omit<GensetSpec, 'designation'> = {
  busSection: 'Main',
  ratedKw: 850,
  voltageV: 450,
  frequencyHz: 60,
  speedClass: 'medium',
  minLoadPct: 30,
  maxLoadPct: 100,
  startCostKg: 6,
  minUpH: 1,
  minDownH: 1,
  duty: 'service',
  minSfocGPerKwh: [197, 203],
  bestLoadFraction: [0.8, 0.88],
  riseAt25PctGPerKwh: [30, 38],
  driftGPerKwhPer1000h: [1.1, 1.6],
  runningHoursAtStart: [55_000, 70_000],
  maintenance: MEDIUM_SPEED_MAINTENANCE,
};

const FERRY_LARGE_SET: Omit<GensetSpec, 'designation' | 'busSection'> = {
  ratedKw: 1500,
  voltageV: 440,
  frequencyHz: 60,
  speedClass: 'medium',
  minLoadPct: 30,
  maxLoadPct: 90,
  startCostKg: 9,
  minUpH: 1,
  minDownH: 1,
  duty: 'service',
  minSfocGPerKwh: [192, 197],
  bestLoadFraction: [0.8, 0.86],
  riseAt25PctGPerKwh: [28, 35],
  driftGPerKwhPer1000h: [0.9, 1.4],
  runningHoursAtStart: [30_000, 42_000],
  maintenance: MEDIUM_SPEED_MAINTENANCE,
};

const FERRY_SMALL_SET: Omit<GensetSpec, 'designation' | 'busSection'> = {
  ratedKw: 1000,
  voltageV: 440,
  frequencyHz: 60,
  speedClass: 'high',
  minLoadPct: 25,
  maxLoadPct: 90,
  startCostKg: 5,
  minUpH: 0.5,
  minDownH: 0.5,
  duty: 'service',
  minSfocGPerKwh: [205, 210],
  bestLoadFraction: [0.78, 0.85],
  riseAt25PctGPerKwh: [32, 40],
  driftGPerKwhPer1000h: [1.2, 1.8],
  runningHoursAtStart: [24_000, 34_000],
  maintenance: HIGH_SPEED_MAINTENANCE,
};

export const DEMO_VESSELS: readonly VesselSpec[] = [
  {
    key: 'shearwater-bay',
    name: 'Shearwater Bay',
    imoNumber: '9472815',
    vesselType: 'container ship',
    fuelGrades: ['VLSFO', 'MGO'],
    busSections: ['A', 'B'],
    fuelMeter: 'mass',
    serviceGrade: 'VLSFO',
    emergencyGrade: 'MGO',
    fuelTempC: { service: [55, 2], emergency: [30, 3] },
    profile: 'liner',
    modeLoadKw: { sea: 1900, manoeuvring: 3300, port: 1500, anchorage: 1250, shorePower: 0 },
    seasonalAmplitude: 0.1,
    withinModeFluctuation: { sea: 0.05, manoeuvring: 0.18, port: 0.1, anchorage: 0.06, shorePower: 0 },
    dayScatter: 0.07,
    policy: {
      loadingFraction: 0.85,
      minSets: { sea: 1, manoeuvring: 2, port: 1, anchorage: 1 },
      extraSetChance: { sea: 0.3, manoeuvring: 0.5, port: 0.2, anchorage: 0.3 },
      oneSetPerSectionIn: ['manoeuvring'],
      rotationDays: [7, 21],
    },
    bunkerIntervalDays: [35, 85],
    bunkerQuantityT: [1800, 2800],
    pastHoursPerDay: 9,
    gensets: [
      { ...CONTAINER_SET, designation: 'DG1', busSection: 'A' },
      { ...CONTAINER_SET, designation: 'DG2', busSection: 'A', hoursSinceTopOverhaulAtStart: 10_900 },
      { ...CONTAINER_SET, designation: 'DG3', busSection: 'B' },
      { ...CONTAINER_SET, designation: 'DG4', busSection: 'B' },
      { ...EMERGENCY_SET, designation: 'EDG', ratedKw: 300, voltageV: 440 },
    ],
  },
  {
    key: 'fulmar-spirit',
    name: 'Fulmar Spirit',
    imoNumber: '9618342',
    vesselType: 'oil tanker',
    fuelGrades: ['HFO', 'MGO'],
    busSections: ['Main'],
    fuelMeter: 'volume',
    serviceGrade: 'HFO',
    emergencyGrade: 'MGO',
    fuelTempC: { service: [85, 2.5], emergency: [32, 3] },
    profile: 'tramp-tanker',
    modeLoadKw: { sea: 520, manoeuvring: 900, port: 1300, anchorage: 330, shorePower: 0 },
    seasonalAmplitude: 0.08,
    withinModeFluctuation: { sea: 0.05, manoeuvring: 0.15, port: 0.12, anchorage: 0.06, shorePower: 0 },
    dayScatter: 0.06,
    policy: {
      loadingFraction: 0.85,
      minSets: { sea: 1, manoeuvring: 2, port: 2, anchorage: 1 },
      extraSetChance: { sea: 0.25, manoeuvring: 0.3, port: 0.15, anchorage: 0.35 },
      oneSetPerSectionIn: [],
      rotationDays: [10, 25],
    },
    bunkerIntervalDays: [40, 90],
    bunkerQuantityT: [900, 1500],
    pastHoursPerDay: 12,
    gensets: [
      { ...TANKER_SET, designation: 'DG1' },
      { ...TANKER_SET, designation: 'DG2' },
      { ...TANKER_SET, designation: 'DG3' },
      { ...EMERGENCY_SET, designation: 'EDG', ratedKw: 200, voltageV: 450 },
    ],
  },
  {
    key: 'kittiwake-express',
    name: 'Kittiwake Express',
    imoNumber: '9537461',
    vesselType: 'ro-ro passenger',
    fuelGrades: ['MGO'],
    busSections: ['A', 'B'],
    fuelMeter: 'mass',
    serviceGrade: 'MGO',
    emergencyGrade: 'MGO',
    fuelTempC: { service: [38, 2], emergency: [28, 3] },
    profile: 'ferry',
    modeLoadKw: { sea: 1850, manoeuvring: 2750, port: 1050, anchorage: 450, shorePower: 0 },
    seasonalAmplitude: 0.12,
    withinModeFluctuation: { sea: 0.06, manoeuvring: 0.2, port: 0.12, anchorage: 0.08, shorePower: 0 },
    dayScatter: 0.06,
    policy: {
      loadingFraction: 0.85,
      minSets: { sea: 2, manoeuvring: 3, port: 1, anchorage: 1 },
      extraSetChance: { sea: 0.2, manoeuvring: 0.25, port: 0.25, anchorage: 0.5 },
      oneSetPerSectionIn: ['sea', 'manoeuvring'],
      rotationDays: [7, 14],
    },
    bunkerIntervalDays: [28, 55],
    bunkerQuantityT: [350, 550],
    pastHoursPerDay: 10,
    gensets: [
      { ...FERRY_LARGE_SET, designation: 'DG1', busSection: 'A' },
      { ...FERRY_SMALL_SET, designation: 'DG2', busSection: 'A' },
      { ...FERRY_LARGE_SET, designation: 'DG3', busSection: 'B' },
      { ...FERRY_SMALL_SET, designation: 'DG4', busSection: 'B' },
      { ...EMERGENCY_SET, designation: 'EDG', ratedKw: 250, voltageV: 440 },
    ],
  },
];

/**
 * IMO check digit of the first six digits (weights 7..2, last digit of the sum), per IMO Resolution A.1078(28)
 * (ship identification number scheme; rule from memory). The demo numbers deliberately do NOT satisfy it.
 *
 * Cost O(1). Throws when the input is not six digits.
 *
 * @example imoCheckDigit('907472') // 9 (IMO 9074729, the usual illustration of the rule; from memory)
 */
export function imoCheckDigit(firstSix: string): number {
  if (!/^\d{6}$/.test(firstSix)) throw new Error(`imoCheckDigit requires six digits (got ${firstSix})`);
  let sum = 0;
  for (let i = 0; i < 6; i++) sum += Number(firstSix[i]) * (7 - i);
  return sum % 10;
}
