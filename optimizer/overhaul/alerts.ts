/**
 * Due alerts: which set and maintenance kind has come within a number of running hours of its due point.
 */
import type { MaintenanceStatus } from './types';

export interface DueAlert {
  /** `${gensetId}:${kind}:${dueAtEquivalentH}` (due point to 0.1 h): one alert per due, whatever the date. */
  key: string;
  gensetId: string;
  kind: string;
  hoursLeft: number;
  dueAtEquivalentH: number;
  dueAtMeterReadingH: number;
  overdue: boolean;
}

/**
 * The stable key of a due: set, kind and the due point on the set's continuous hour scale, rounded to 0.1 h.
 * The due point moves only when work of that kind is recorded (a new due) or its interval is changed; a later
 * meter replacement does not move it. So a key identifies one due and an alert keyed by it is sent once.
 *
 * Cost O(1).
 *
 * @example dueKey({ gensetId: 'DG1', kind: 'top', dueAtEquivalentH: 18000 }) // 'DG1:top:18000'
 */
export function dueKey(status: Pick<MaintenanceStatus, 'gensetId' | 'kind' | 'dueAtEquivalentH'>): string {
  const rounded = Math.round(status.dueAtEquivalentH * 10) / 10;
  return `${status.gensetId}:${status.kind}:${rounded}`;
}

/**
 * Alerts for the dues within `thresholdHours` running hours (overdue ones included), minus those already sent.
 *
 * Cost O(n + s) for n statuses and s sent keys. Throws on a threshold that is negative or not finite.
 *
 * @example dueAlerts([{ gensetId: 'DG1', kind: 'top', hoursLeft: 150, dueAtEquivalentH: 18000, ... }], 200, ['DG1:top:18000'])
 *   // [] (already sent)
 */
export function dueAlerts(statuses: MaintenanceStatus[], thresholdHours: number, sentKeys: Iterable<string> = []): DueAlert[] {
  if (!(thresholdHours >= 0) || !Number.isFinite(thresholdHours)) throw new Error('dueAlerts requires a threshold of zero or more hours');
  const sent = new Set(sentKeys);
  const out: DueAlert[] = [];
  for (const s of statuses) {
    if (s.hoursLeft > thresholdHours) continue;
    const key = dueKey(s);
    if (sent.has(key)) continue;
    sent.add(key);
    out.push({
      key,
      gensetId: s.gensetId,
      kind: s.kind,
      hoursLeft: s.hoursLeft,
      dueAtEquivalentH: s.dueAtEquivalentH,
      dueAtMeterReadingH: s.dueAtMeterReadingH,
      overdue: s.hoursLeft <= 0,
    });
  }
  return out;
}
