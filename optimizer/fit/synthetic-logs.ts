/**
 * Seeded synthetic daily log points of one genset, for tests, benchmarks and demonstrations.
 *
 * Each day draws an average load (normal around a mean, clipped to [minLoadPct, maxLoadPct] of rating), hours
 * run (uniform), and a fuel rate F(P) + drift + noise, where the noise SD scales as 1/√(hours run / 24) so
 * that weighting by hours run is the efficient choice. Not a model of any real engine.
 */
import { curveFuelKgPerH, type QuadraticFuelCurve } from '../plant';
import type { Rng } from '../random';
import type { DailyFuelPoint } from './fuel-curve-fit';

export interface SyntheticLogOptions {
  curve: QuadraticFuelCurve;
  ratedKw: number;
  days: number;
  meanLoadPct?: number;
  loadSdPct?: number;
  minLoadPct?: number;
  maxLoadPct?: number;
  /** Noise SD of a 24-hour day's fuel rate, kg/h. */
  noiseSdKgPerH?: number;
  minHoursRun?: number;
  maxHoursRun?: number;
  /** SFOC rise with running hours, g/kWh per 1000 h (shifts fuel by rise·P/1000). */
  driftGPerKwhPer1000h?: number;
  startHoursSinceOverhaul?: number;
  /** ISO date of the first day; default 2020-01-01. */
  startDate?: string;
}

/**
 * Generate `days` daily points from a known curve with seeded noise.
 *
 * Cost: O(days). Throws when days < 1 or ratedKw ≤ 0.
 *
 * @example generateDailyLogs(createRng(1), { curve, ratedKw: 1000, days: 90 }).length // 90
 */
export function generateDailyLogs(rng: Rng, options: SyntheticLogOptions): DailyFuelPoint[] {
  const { curve, ratedKw, days } = options;
  if (!(days >= 1) || !Number.isInteger(days)) throw new Error('generateDailyLogs requires a whole number of days ≥ 1');
  if (!(ratedKw > 0)) throw new Error('generateDailyLogs requires ratedKw > 0');
  const meanPct = options.meanLoadPct ?? 65;
  const sdPct = options.loadSdPct ?? 15;
  const minPct = options.minLoadPct ?? 30;
  const maxPct = options.maxLoadPct ?? 100;
  const noise = options.noiseSdKgPerH ?? 2;
  const minH = options.minHoursRun ?? 4;
  const maxH = options.maxHoursRun ?? 24;
  const drift = options.driftGPerKwhPer1000h ?? 0;
  let hours = options.startHoursSinceOverhaul ?? 0;
  const start = Date.parse(options.startDate ?? '2020-01-01');
  const out: DailyFuelPoint[] = [];
  for (let d = 0; d < days; d++) {
    const pct = Math.min(maxPct, Math.max(minPct, rng.normal(meanPct, sdPct)));
    const loadKw = (pct * ratedKw) / 100;
    const hoursRun = minH + (maxH - minH) * rng.uniform();
    const driftKgPerH = (drift * (hours / 1000) * loadKw) / 1000;
    const fuelKgPerH = curveFuelKgPerH(curve, loadKw) + driftKgPerH + rng.normal(0, noise / Math.sqrt(hoursRun / 24));
    out.push({
      loadKw,
      fuelKgPerH,
      hoursRun,
      hoursSinceOverhaul: hours,
      date: new Date(start + d * 86_400_000).toISOString().slice(0, 10),
      id: `day-${d}`,
    });
    hours += hoursRun;
  }
  return out;
}
