import { describe, expect, it } from 'vitest';
import { dueAlerts, dueKey, hoursSinceMaintenance, type GensetHoursRecord } from '../../optimizer/overhaul';
import { DG1_HOURS } from '../fixtures/overhaul/dg1-hours';

// Hand-computed from tests/fixtures/overhaul/dg1-hours.ts: inspection 200 h left (due at 10 100 h equivalent),
// top 11 620 h, major 14 200 h, governor 10 100 h left (since new).
const statuses = (record: GensetHoursRecord = DG1_HOURS) => hoursSinceMaintenance(record);

describe('dueAlerts (hand-computed fixture)', () => {
  it('alerts the kinds within the threshold, keyed by set, kind and due point', () => {
    const alerts = dueAlerts(statuses(), 250);
    expect(alerts.map((a) => a.key)).toEqual(['DG1:inspection:10100']);
    expect(alerts[0]).toMatchObject({ hoursLeft: 200, overdue: false, dueAtMeterReadingH: 10100 - 9595 });
    expect(dueAlerts(statuses(), 199.9)).toEqual([]);
  });

  it('does not propose an alert already sent, and the key survives more running and a later meter replacement', () => {
    const sent = dueAlerts(statuses(), 250).map((a) => a.key);
    const later: GensetHoursRecord = {
      ...DG1_HOURS,
      readings: [...DG1_HOURS.readings, { date: '2026-04-05', readingH: 350 }, { date: '2026-04-06', readingH: 12 }],
      replacements: [...(DG1_HOURS.replacements ?? []), { date: '2026-04-06', oldFinalReading: 360, newStartReading: 0 }],
    };
    const s = statuses(later).find((x) => x.kind === 'inspection')!;
    expect(s.hoursLeft).toBeCloseTo(500 - (9595 + 360 + 12 - 9600), 9); // 133 h left (hand)
    expect(dueKey(s)).toBe(sent[0]);
    expect(dueAlerts(statuses(later), 250, sent)).toEqual([]);
  });

  it('a new due (work recorded) gets a new key and is alerted again; overdue dues are alerted', () => {
    const reset: GensetHoursRecord = { ...DG1_HOURS, done: [...(DG1_HOURS.done ?? []), { kind: 'inspection', doneOn: '2026-03-31', readingH: 305 }] };
    const s = statuses(reset).find((x) => x.kind === 'inspection')!;
    expect(dueKey(s)).toBe('DG1:inspection:10400');
    const overdue = dueAlerts(statuses({ ...DG1_HOURS, kinds: [{ kind: 'inspection', intervalHours: 100 }] }), 0);
    expect(overdue).toMatchObject([{ key: 'DG1:inspection:9700', overdue: true, hoursLeft: -200 }]);
  });

  it('one alert per key even when a status repeats, and a bad threshold throws', () => {
    const twice = [...statuses(), ...statuses()];
    expect(dueAlerts(twice, 250)).toHaveLength(1);
    expect(() => dueAlerts(statuses(), -1)).toThrow('dueAlerts requires a threshold of zero or more hours');
  });
});
