/**
 * Operating pattern of a demo vessel: a timeline of modes (sea passage, manoeuvring, port, anchorage, shore power)
 * cut into ship's days. Segment lengths are whole half-hours and days are 23, 24 or 25 h, so each day's mode hours
 * add up exactly to its length. Pure: no I/O.
 */
import type { Rng } from '../optimizer/random';
import { dateOfDayIndex } from './dates';
import type { ModeKey, OperatingProfile } from './fleet';

export type ModeHours = Record<ModeKey, number>;

/** A stretch of whole days spent in one mode (yard period on shore power, lay-up at anchor). */
export interface ForcedWindow {
  fromDay: number;
  /** Last day of the window (inclusive). */
  toDay: number;
  mode: ModeKey;
  /** Manoeuvring hours just before and just after the window. */
  leadInH: number;
}

type Segment = [ModeKey, number];

const half = (rng: Rng, loH: number, hiH: number): number => rng.int(loH * 2, hiH * 2) / 2;

/** One cycle of a container liner: passage, sometimes a wait at anchor, port call. */
function linerCycle(rng: Rng): Segment[] {
  const cycle: Segment[] = [['sea', half(rng, 40, 150)]];
  if (rng.uniform() < 0.3) cycle.push(['anchorage', half(rng, 4, 36)]);
  cycle.push(['manoeuvring', half(rng, 2, 3.5)], ['port', half(rng, 12, 36)], ['manoeuvring', half(rng, 2, 3)]);
  return cycle;
}

/** One cycle of a tanker in the spot trade: long passage, often a long wait at anchor, cargo operations. */
function tankerCycle(rng: Rng): Segment[] {
  const cycle: Segment[] = [['sea', half(rng, 160, 480)]];
  if (rng.uniform() < 0.6) cycle.push(['anchorage', half(rng, 12, 96)]);
  cycle.push(['manoeuvring', half(rng, 2, 4)], ['port', half(rng, 24, 48)], ['manoeuvring', half(rng, 2, 3)]);
  return cycle;
}

/** A ferry's day: two crossings on weekdays (one on Sundays), nights on shore power at the home berth. */
function ferryDay(rng: Rng, tH: number): Segment[] {
  const intoDay = tH % 24;
  if (intoDay !== 0) return [['port', 24 - intoDay]];
  const dayIndex = Math.floor(tH / 24);
  const sunday = new Date(`${dateOfDayIndex(dayIndex)}T00:00:00Z`).getUTCDay() === 0;
  const delayH = rng.int(-1, 1) / 2;
  if (sunday) return [['shorePower', 5], ['port', 1], ['manoeuvring', 1], ['sea', 6.5 + delayH], ['manoeuvring', 1], ['shorePower', 9.5 - delayH]];
  return [
    ['shorePower', 5],
    ['port', 1],
    ['manoeuvring', 1],
    ['sea', 6.5 + delayH],
    ['manoeuvring', 1],
    ['port', 2 - delayH],
    ['manoeuvring', 1],
    ['sea', 5.5],
    ['manoeuvring', 1],
  ];
}

/**
 * Length of each ship's day, h. A liner on an east-west trade changes clocks by one hour every one to three weeks,
 * alternately retarding (25 h day) and advancing (23 h day); other profiles keep 24 h days.
 *
 * Cost O(days). Days listed in avoidDays keep 24 h.
 *
 * @example dayLengthsH('ferry', 3, createRng(1), new Set()) // [24, 24, 24]
 */
export function dayLengthsH(profile: OperatingProfile, dayCount: number, rng: Rng, avoidDays: ReadonlySet<number>): number[] {
  const lengths = new Array<number>(dayCount).fill(24);
  if (profile !== 'liner') return lengths;
  let sign = 1;
  for (let d = rng.int(5, 15); d < dayCount; d += rng.int(8, 20)) {
    if (avoidDays.has(d)) continue;
    lengths[d] = 24 + sign;
    sign = -sign;
  }
  return lengths;
}

/**
 * Mode hours of every day: the profile's timeline with the forced windows inserted, cut at the day boundaries.
 *
 * Cost O(days + segments). Throws when a forced window lies outside the days or windows overlap.
 *
 * @example modeHoursByDay('ferry', [24], [], createRng(1))[0].shorePower // 5
 */
export function modeHoursByDay(profile: OperatingProfile, lengthsH: readonly number[], windows: readonly ForcedWindow[], rng: Rng): ModeHours[] {
  const dayStartH: number[] = [0];
  for (const len of lengthsH) dayStartH.push(dayStartH[dayStartH.length - 1] + len);
  const totalH = dayStartH[lengthsH.length];
  const sorted = [...windows].sort((x, y) => x.fromDay - y.fromDay);
  sorted.forEach((w, i) => {
    if (w.fromDay < 1 || w.toDay >= lengthsH.length - 1 || w.toDay < w.fromDay) throw new Error(`modeHoursByDay requires forced windows inside the days (got ${w.fromDay} to ${w.toDay})`);
    if (i > 0 && w.fromDay <= sorted[i - 1].toDay + 1) throw new Error('modeHoursByDay requires forced windows that do not overlap');
  });

  const segments: Segment[] = [];
  let tH = 0;
  const push = (mode: ModeKey, h: number) => {
    if (h > 0) {
      segments.push([mode, h]);
      tH += h;
    }
  };
  let next = 0;
  while (tH < totalH) {
    const chunk = profile === 'liner' ? linerCycle(rng) : profile === 'tramp-tanker' ? tankerCycle(rng) : ferryDay(rng, tH);
    for (const [mode, h] of chunk) {
      const w = sorted[next];
      if (w && tH + h > dayStartH[w.fromDay] - w.leadInH) {
        push(mode, dayStartH[w.fromDay] - w.leadInH - tH);
        push('manoeuvring', w.leadInH);
        push(w.mode, dayStartH[w.toDay + 1] - dayStartH[w.fromDay]);
        push('manoeuvring', w.leadInH);
        next++;
        break;
      }
      push(mode, h);
    }
  }

  const days: ModeHours[] = lengthsH.map(() => ({ sea: 0, manoeuvring: 0, port: 0, anchorage: 0, shorePower: 0 }));
  let day = 0;
  let segStart = 0;
  for (const [mode, h] of segments) {
    let from = segStart;
    const to = segStart + h;
    while (day < lengthsH.length && from < to) {
      const cut = Math.min(to, dayStartH[day + 1]);
      days[day][mode] += cut - from;
      from = cut;
      if (cut === dayStartH[day + 1]) day++;
    }
    segStart = to;
    if (day >= lengthsH.length) break;
  }
  return days;
}
