import type { IntervalAmountView } from './savings';

/** One vessel of the fleet benchmark over the chosen period. */
export interface FleetVesselRow {
  vesselId: string;
  vesselName: string;
  setCount: number;
  energyMwh: number;
  /** Σ ISO-corrected fuel / Σ kWh of the set-days with fuel, g/kWh. */
  plantSfocIsoGPerKwh: number | null;
  /** Σ kWh / Σ (hours run × rating), %. */
  avgLoadFactorPct: number | null;
  /** Hours of set-days below the set's minimum load / all hours run, %. */
  lowLoadHoursSharePct: number | null;
  avoidableFuelT: IntervalAmountView | null;
  avoidablePct: number | null;
  avoidableCo2T: IntervalAmountView | null;
  driftAlerts: number;
  /** max − min running hours since overhaul of the service sets, h; null when any is unknown. */
  hoursSinceOverhaulSpreadH: number | null;
  /** Coefficient of variation of the sets' running hours in the period, %. */
  periodHoursCvPct: number | null;
  /** Smallest running hours left to a maintenance due of any set, h. */
  minHoursToOverhaulH: number | null;
  /** Why the savings figures are missing, when they are. */
  savingsUnavailable: string | null;
}

/** One service set of the fleet benchmark. */
export interface FleetSetRow {
  vesselId: string;
  vesselName: string;
  gensetId: string;
  designation: string;
  ratedKw: number;
  curveSource: 'fit' | 'shop_test';
  hoursRun: number;
  energyMwh: number;
  sfocIsoGPerKwh: number | null;
  /** SFOC at 75 % of rating from the set's curve, g/kWh. */
  sfoc75GPerKwh: number;
  avgLoadFactorPct: number | null;
  lowLoadHoursSharePct: number | null;
  driftAlert: boolean;
  driftExcessGPerKwh: number | null;
  hoursSinceOverhaulH: number | null;
  hoursToNextOverhaulH: number | null;
  nextOverhaulKind: string | null;
}

/** Curves of sets of one rating across the fleet (SFOC against % of rating). */
export interface SisterCurveGroup {
  ratedKw: number;
  sets: { vesselName: string; designation: string; curveSource: 'fit' | 'shop_test'; points: { loadPct: number; sfocGPerKwh: number }[] }[];
}

export interface FleetMonthRow {
  vesselId: string;
  vesselName: string;
  month: string;
  plantSfocIsoGPerKwh: number | null;
  avoidableFuelT: number | null;
  avoidablePct: number | null;
}

export interface FleetBenchmark {
  from: string;
  to: string;
  currency: string;
  vessels: FleetVesselRow[];
  sets: FleetSetRow[];
  sisterCurves: SisterCurveGroup[];
  monthly: FleetMonthRow[];
  method: Record<string, string>;
  caution: string;
}

/** How each benchmark figure is computed (tooltips and report notes). */
export const FLEET_METHOD: Record<string, string> = {
  plantSfoc: 'Plant SFOC (ISO) = Σ fuel corrected to the ISO 3046-1 reference LCV / Σ kWh of the set-days with fuel logged, g/kWh.',
  sfoc75: 'SFOC at 75 % = 1000 × F(0.75 × rating) / (0.75 × rating) from the set’s curve (current fit, or shop test).',
  loadFactor: 'Average load factor = Σ kWh / Σ (hours run × rating), %.',
  lowLoad: 'Low-load share = hours of set-days with daily average load below the set’s minimum load / all hours run, %.',
  avoidable: 'Avoidable fuel = modelled fuel of what was done − modelled fuel of the recommendation (same curves), with its delta-method interval; % of modelled actual.',
  drift: 'Drift alerts: sets whose SFOC since the last overhaul has risen above the alert threshold at the stated confidence.',
  balance: 'Running-hour balance: max − min hours since overhaul within the vessel, and the coefficient of variation of the sets’ hours in the period.',
  overhaul: 'Hours to next overhaul = last done at + interval − current running hours meter, smallest of the set’s maintenance kinds.',
};
