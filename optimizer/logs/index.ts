// Public API of the daily-log derivation: meter deltas, quality flags, one genset-day, series checks. Pure computation.
export { meterDelta } from './meter-delta';
export type { MeterReplacement, MeterDeltaResult } from './meter-delta';
export { QUALITY_FLAG_CODES, DEFAULT_SFOC_BAND_G_PER_KWH, qualityFlag } from './quality-flags';
export type { QualityFlagCode, QualityFlagSeverity, QualityFlag } from './quality-flags';
export { deriveDailyRow } from './derive-daily-row';
export type {
  RunningHoursEntry,
  EnergyEntry,
  FuelEntry,
  RawDailyLog,
  FuelLot,
  DailyRowContext,
  LcvBasis,
  DerivedDailyRow,
} from './derive-daily-row';
export { dayNumber, dateOfDayNumber, checkLogSeries, deriveGensetSeries } from './series-checks';
export type { SeriesFlag } from './series-checks';
