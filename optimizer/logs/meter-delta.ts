/**
 * Daily deltas of cumulative meters (running-hour counters, kWh meters), with recorded meter replacements.
 */

/**
 * A meter replaced (or rolled over) during the day: the old meter's last reading and the new meter's first reading.
 * A rollover is recorded the same way: old final = the reading at which the counter wrapped (its capacity),
 * new start = 0.
 */
export interface MeterReplacement {
  oldFinalReading: number;
  newStartReading: number;
}

export type MeterDeltaResult =
  | { ok: true; delta: number; replaced: boolean }
  | { ok: false; reason: 'negative-delta'; rawDelta: number }
  | { ok: false; reason: 'previous-missing' }
  | { ok: false; reason: 'replacement-inconsistent'; detail: string };

function finite(fn: string, field: string, v: number): void {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new Error(`${fn} requires ${field} to be a finite number (got ${String(v)})`);
}

/**
 * Delta of a cumulative meter between yesterday's and today's reading.
 *
 * Without a replacement: today − yesterday; a negative value is NOT accepted (reason 'negative-delta'), because it
 * means an unrecorded meter replacement, a rollover or a typing error. With a replacement:
 * (oldFinal − yesterday) + (today − newStart); each part must be ≥ 0, else 'replacement-inconsistent'.
 * A missing previous reading gives 'previous-missing'. Problems are results, not exceptions.
 *
 * Cost O(1). Throws only on non-finite numbers.
 *
 * @example meterDelta({ previousReading: 99_990, currentReading: 15, replacement: { oldFinalReading: 100_000, newStartReading: 0 } })
 *   // { ok: true, delta: 25, replaced: true }
 */
export function meterDelta(input: {
  previousReading: number | undefined | null;
  currentReading: number;
  replacement?: MeterReplacement | null;
}): MeterDeltaResult {
  const { previousReading, currentReading, replacement } = input;
  finite('meterDelta', 'currentReading', currentReading);
  if (previousReading === undefined || previousReading === null) return { ok: false, reason: 'previous-missing' };
  finite('meterDelta', 'previousReading', previousReading);
  if (replacement) {
    finite('meterDelta', 'replacement.oldFinalReading', replacement.oldFinalReading);
    finite('meterDelta', 'replacement.newStartReading', replacement.newStartReading);
    const before = replacement.oldFinalReading - previousReading;
    const after = currentReading - replacement.newStartReading;
    if (before < 0) {
      return { ok: false, reason: 'replacement-inconsistent', detail: `old meter's final reading ${replacement.oldFinalReading} is below the previous reading ${previousReading}` };
    }
    if (after < 0) {
      return { ok: false, reason: 'replacement-inconsistent', detail: `today's reading ${currentReading} is below the new meter's start reading ${replacement.newStartReading}` };
    }
    return { ok: true, delta: before + after, replaced: true };
  }
  const rawDelta = currentReading - previousReading;
  if (rawDelta < 0) return { ok: false, reason: 'negative-delta', rawDelta };
  return { ok: true, delta: rawDelta, replaced: false };
}
