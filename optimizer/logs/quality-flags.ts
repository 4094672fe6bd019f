/**
 * Quality flags raised while deriving daily genset rows from engine-room logs.
 *
 * severity 'error': the row's derived figures are not usable (e.g. for fitting a fuel curve) until the log is
 * corrected. severity 'warning': the figures are computed but deserve a look (e.g. low-load running).
 */

export const QUALITY_FLAG_CODES = [
  /** Hours run above 24 in one day. */
  'HOURS_OVER_24',
  /** Hours run below 0. */
  'HOURS_NEGATIVE',
  /** A cumulative meter reads lower than the day before, with no recorded replacement. */
  'METER_NEGATIVE_DELTA',
  /** A cumulative meter reading without the previous day's reading. */
  'METER_PREVIOUS_MISSING',
  /** A recorded meter replacement that contradicts the readings. */
  'METER_REPLACEMENT_INCONSISTENT',
  /** Energy above rated power × hours run. */
  'KWH_OVER_RATED',
  /** Observed SFOC outside the plausible band. */
  'SFOC_OUT_OF_BAND',
  /** Average load below the set's minimum load. */
  'LOW_LOAD',
  /** Fuel logged on a day with zero hours run. */
  'FUEL_WITHOUT_HOURS',
  /** A calendar day between two logged days with no row for the set. */
  'MISSING_DAY',
  /** Two or more rows of the same set on the same date. */
  'DUPLICATE_DATE',
] as const;
export type QualityFlagCode = (typeof QUALITY_FLAG_CODES)[number];

export type QualityFlagSeverity = 'error' | 'warning';

export interface QualityFlag {
  code: QualityFlagCode;
  /** The raw or derived field the flag is about, e.g. 'hoursRun', 'energy', 'sfocObservedGPerKwh', 'date'. */
  field: string;
  severity: QualityFlagSeverity;
  /** A sentence for the chief engineer. */
  message: string;
}

const SEVERITY: Record<QualityFlagCode, QualityFlagSeverity> = {
  HOURS_OVER_24: 'error',
  HOURS_NEGATIVE: 'error',
  METER_NEGATIVE_DELTA: 'error',
  METER_PREVIOUS_MISSING: 'error',
  METER_REPLACEMENT_INCONSISTENT: 'error',
  KWH_OVER_RATED: 'error',
  SFOC_OUT_OF_BAND: 'error',
  LOW_LOAD: 'warning',
  FUEL_WITHOUT_HOURS: 'error',
  MISSING_DAY: 'warning',
  DUPLICATE_DATE: 'error',
};

/**
 * A flag with the code's fixed severity.
 *
 * Cost O(1). Does not throw.
 *
 * @example qualityFlag('LOW_LOAD', 'avgLoadPct', 'Average load 20 % is below 30 %.').severity // 'warning'
 */
export function qualityFlag(code: QualityFlagCode, field: string, message: string): QualityFlag {
  return { code, field, severity: SEVERITY[code], message };
}

/** Plausible observed SFOC band, g/kWh: 150 to 450 (common practice for diesel gensets). */
export const DEFAULT_SFOC_BAND_G_PER_KWH: Readonly<{ min: number; max: number }> = { min: 150, max: 450 };
