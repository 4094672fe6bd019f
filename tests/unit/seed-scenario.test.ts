import { createHash } from 'node:crypto';
import { Matrix, solve } from 'ml-matrix';
import { mean, standardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { imoCheckDigit } from '../../seed/fleet';
import {
  DEMO_PASSWORD,
  DEMO_SIGN_INS,
  FUEL_METER_NOISE_REL_SD,
  generateScenario,
  type DemoScenario,
  type ScenarioGenset,
  type ScenarioLog,
} from '../../seed/scenario';
import { quadraticCurveFromSfoc, sfocGPerKwh } from '../../seed/true-curve';

// Frozen inputs: the default seed and one other, both fixed.
const withNoise = generateScenario();
const noiseFree = generateScenario({ noise: false });
const otherSeed = generateScenario({ seed: 7 });

/** Relative tolerance of float round-off through the generator and its inverse (a few hundred operations). */
const FLOAT_REL_TOL = 1e-9;

const digest = (s: DemoScenario) => createHash('sha256').update(JSON.stringify(s)).digest('hex');
const gensets = (s: DemoScenario): ScenarioGenset[] => s.vessels.flatMap((v) => v.gensets);
const byGenset = (s: DemoScenario) => {
  const map = new Map<string, ScenarioLog[]>();
  for (const log of s.logs) {
    const list = map.get(log.gensetKey) ?? [];
    list.push(log);
    map.set(log.gensetKey, list);
  }
  return map;
};
const nextDay = (date: string) => new Date(Date.parse(`${date}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);

/**
 * ASTM D1250-80 / ISO 91-1 Table 54B, fuel-oils band (838.5 to 1075 kg/m³), written out here independently of the
 * project's implementation: alpha15 = 186.9696/rho² + 0.4862/rho, VCF = exp(−alpha·dT·(1 + 0.8·alpha·dT)).
 */
const vcfFuelOils54B = (rho: number, tempC: number) => {
  const alpha = 186.9696 / (rho * rho) + 0.4862 / rho;
  const dT = tempC - 15;
  return Math.exp(-alpha * dT * (1 + 0.8 * alpha * dT));
};

describe('demo scenario: determinism', () => {
  it('gives identical output for the same seed and different output for another seed', () => {
    expect(digest(generateScenario())).toBe(digest(withNoise));
    expect(digest(otherSeed)).not.toBe(digest(withNoise));
  });

  it('switching noise off keeps the operation (hours, kWh, lots, events) and changes only the fuel figures', () => {
    expect(noiseFree.logs.length).toBe(withNoise.logs.length);
    noiseFree.logs.forEach((log, i) => {
      const other = withNoise.logs[i];
      expect(log.gensetKey).toBe(other.gensetKey);
      expect(log.truth.hoursRun).toBe(other.truth.hoursRun);
      expect(log.truth.kwh).toBe(other.truth.kwh);
      expect(log.fuelLotKey).toBe(other.fuelLotKey);
    });
    expect(noiseFree.overhaulEvents.map((e) => e.date)).toEqual(withNoise.overhaulEvents.map((e) => e.date));
  });
});

describe('demo scenario: shape', () => {
  const s = withNoise;

  it('has the company, a user for every role and a chief engineer scoped to one vessel', () => {
    expect(s.company).toEqual({ name: 'Cormorant Shipping (demo)', emailDomain: 'cormorant.example', currency: 'USD' });
    for (const role of ['admin', 'superintendent', 'chief_engineer', 'energy_officer', 'planner']) {
      expect(s.users.some((u) => u.role === role)).toBe(true);
    }
    for (const u of s.users) {
      expect(u.email.endsWith('@cormorant.example')).toBe(true);
      expect(u.vesselScope === null).toBe(u.role !== 'chief_engineer');
    }
    expect(s.users.some((u) => u.role === 'chief_engineer' && u.vesselScope?.length === 1)).toBe(true);
    expect(DEMO_SIGN_INS.map((x) => x.email)).toEqual(s.users.map((u) => u.email));
    expect(DEMO_SIGN_INS.every((x) => x.password === DEMO_PASSWORD && DEMO_PASSWORD === 'kilowatch-demo')).toBe(true);
    expect(new Set(s.users.map((u) => u.email.toLowerCase())).size).toBe(s.users.length);
  });

  it('has at least three vessels of different kinds, each with service sets and one emergency set', () => {
    expect(s.vessels.length).toBeGreaterThanOrEqual(3);
    expect(new Set(s.vessels.map((v) => v.vesselType)).size).toBe(s.vessels.length);
    for (const v of s.vessels) {
      expect(v.gensets.filter((g) => g.duty === 'emergency')).toHaveLength(1);
      expect(v.gensets.filter((g) => g.duty === 'service').length).toBeGreaterThanOrEqual(3);
      for (const g of v.gensets.filter((x) => x.duty === 'service')) expect(v.busSections.map((b) => b.name)).toContain(g.busSection);
    }
    expect(s.vessels.some((v) => v.busSections.length === 2)).toBe(true);
    expect(s.vessels.some((v) => new Set(v.gensets.filter((g) => g.duty === 'service').map((g) => g.ratedKw)).size === 2)).toBe(true);
    expect(s.vessels.some((v) => v.fuelMeter === 'volume')).toBe(true);
  });

  it('uses invented ship numbers: seven digits starting with 9 whose check digit is deliberately wrong', () => {
    // Source: IMO ship identification number check digit (IMO Resolution A.1078(28); weights 7..2, last digit of
    // the sum). Known-valid illustration: IMO 9074729 (from memory).
    expect(imoCheckDigit('907472')).toBe(9);
    for (const v of s.vessels) {
      expect(v.imoNumber).toMatch(/^9\d{6}$/);
      expect(imoCheckDigit(v.imoNumber.slice(0, 6))).not.toBe(Number(v.imoNumber[6]));
    }
  });

  it('rates every set at pf 0.8 on a marine voltage and frequency', () => {
    for (const g of gensets(s)) {
      expect(g.ratedKva).toBeCloseTo(g.ratedKw / 0.8, 9);
      expect([440, 450, 6600]).toContain(g.voltageV);
      expect(g.frequencyHz).toBe(60);
      expect(g.maxLoadPct).toBeGreaterThan(g.minLoadPct);
      expect(g.startCostKg).toBeGreaterThanOrEqual(g.duty === 'service' ? 5 : 0);
      expect(g.maintenance.map((m) => m.kind)).toContain('top overhaul');
    }
  });

  it('logs every day for every set except the vessel\'s missing days (at least 730 days less those)', () => {
    const logs = byGenset(s);
    expect(s.logs.map((l) => l.logDate).sort()[0]).toBe('2024-11-01');
    for (const v of s.vessels) {
      const missing = s.defects.missingDays.filter((d) => d.vesselKey === v.key).length;
      for (const g of v.gensets) {
        const dates = (logs.get(g.key) ?? []).map((l) => l.logDate);
        expect(new Set(dates).size).toBe(dates.length);
        expect(dates.length).toBe(730 - missing);
        expect(dates.length).toBeGreaterThanOrEqual(730 - 10);
      }
    }
  });

  it('has mode hours adding to 24 on complete days and to 23 or 25 on the recorded clock-change days', () => {
    // Source: ship's time practice of advancing / retarding clocks by one hour (common practice).
    const changes = new Map(s.defects.clockChanges.map((c) => [`${c.vesselKey} ${c.date}`, c.dayLengthH]));
    expect(changes.size).toBeGreaterThan(0);
    for (const m of s.modeHours) {
      const sum = m.seaH + m.manoeuvringH + m.portH + m.anchorageH + m.shorePowerH;
      expect(sum).toBe(changes.get(`${m.vesselKey} ${m.logDate}`) ?? 24);
      for (const h of [m.seaH, m.manoeuvringH, m.portH, m.anchorageH, m.shorePowerH]) expect(h).toBeGreaterThanOrEqual(0);
    }
    expect(s.modeHours.length).toBe(s.vessels.length * 730 - s.defects.missingDays.length);
    expect(s.logs.some((l) => l.truth.hoursRun > 24)).toBe(true);
  });

  it('has fuel lots every one to three months with plausible density, LCV and one estimated LCV', () => {
    for (const lot of s.fuelLots) {
      expect(lot.density15KgPerM3).toBeGreaterThanOrEqual(840);
      expect(lot.density15KgPerM3).toBeLessThanOrEqual(991);
      expect(lot.lcvMjPerKg).toBeGreaterThan(40.0);
      expect(lot.lcvMjPerKg).toBeLessThan(43.0);
      if (!lot.lcvEstimated) expect(lot.lcvMjPerKg).toBe(lot.trueLcvMjPerKg);
    }
    expect(s.fuelLots.filter((l) => l.lcvEstimated)).toHaveLength(1);
    for (const v of s.vessels) {
      const grade = v.fuelGrades[0];
      const days = s.fuelLots
        .filter((l) => l.vesselKey === v.key && l.grade === grade)
        .map((l) => Date.parse(l.deliveredOn) / 86_400_000);
      for (let i = 1; i < days.length; i++) {
        expect(days[i] - days[i - 1]).toBeGreaterThanOrEqual(28);
        expect(days[i] - days[i - 1]).toBeLessThanOrEqual(92);
      }
    }
  });
});

describe('demo scenario: defects written into the logs', () => {
  const s = withNoise;
  const logs = byGenset(s);
  const find = (gensetKey: string, date: string) => (logs.get(gensetKey) ?? []).find((l) => l.logDate === date);

  it('replaces one kWh meter: the reading restarts near 0 on the recorded date', () => {
    expect(s.meterReplacements).toHaveLength(1);
    const r = s.meterReplacements[0];
    const before = find(r.gensetKey, new Date(Date.parse(`${r.date}T00:00:00Z`) - 86_400_000).toISOString().slice(0, 10)) as ScenarioLog;
    const today = find(r.gensetKey, r.date) as ScenarioLog;
    expect(before.kwhMeter).toBe(r.oldFinalReading);
    expect(today.kwhMeter).toBeLessThan(before.kwhMeter);
    expect(r.newStartReading).toBeLessThan(100);
    expect(today.kwhMeter - r.newStartReading).toBeCloseTo(today.truth.kwh, -1); // kWh read to 1 kWh
    expect(today.remarks).toContain('kWh meter replaced');
  });

  it('has a shore-power period of at least 10 days with every service set stopped', () => {
    const days = s.defects.shorePowerDays;
    expect(days.length).toBeGreaterThanOrEqual(10);
    const vessel = s.vessels.find((v) => v.key === days[0].vesselKey) as DemoScenario['vessels'][number];
    for (const d of days) {
      const m = s.modeHours.find((x) => x.vesselKey === d.vesselKey && x.logDate === d.date);
      expect(m?.shorePowerH).toBe(24);
      for (const g of vessel.gensets.filter((x) => x.duty === 'service')) {
        const log = find(g.key, d.date) as ScenarioLog;
        const prev = (logs.get(g.key) as ScenarioLog[])[(logs.get(g.key) as ScenarioLog[]).indexOf(log) - 1];
        expect(log.runningHoursMeter).toBe(prev.runningHoursMeter);
        expect(log.kwhMeter).toBe(prev.kwhMeter);
        expect(log.fuelMassKg ?? log.fuelVolumeL).toBe(0);
      }
    }
  });

  it('overhauls at least one set partway through, resetting the drift and updating its maintenance', () => {
    const resets = s.overhaulEvents.filter((e) => e.resetsDrift);
    expect(resets.length).toBeGreaterThan(0);
    for (const e of resets) {
      const g = gensets(s).find((x) => x.key === e.gensetKey) as ScenarioGenset;
      const last = s.overhaulEvents.filter((x) => x.gensetKey === e.gensetKey && x.kind === e.kind).at(-1) as DemoScenario['overhaulEvents'][number];
      const row = g.maintenance.find((m) => m.kind === e.kind) as ScenarioGenset['maintenance'][number];
      // Last done: this kind's last event, or a later event of a larger kind that includes it (a major overhaul
      // includes a top overhaul).
      expect(row.lastDoneOn >= last.date).toBe(true);
      const source = s.overhaulEvents.find((x) => x.gensetKey === e.gensetKey && x.date === row.lastDoneOn);
      expect(source?.runningHours).toBe(row.lastDoneRunningHours);
      const after = (logs.get(e.gensetKey) as ScenarioLog[]).find((l) => l.logDate > e.date && l.truth.hoursRun > 0);
      if (after) expect(after.truth.hoursSinceOverhaul).toBeLessThan(400);
    }
  });

  it('has missing days, one of them a gap of 3 to 5 days', () => {
    const perVessel = new Map<string, string[]>();
    for (const d of s.defects.missingDays) perVessel.set(d.vesselKey, [...(perVessel.get(d.vesselKey) ?? []), d.date]);
    let longest = 0;
    for (const dates of perVessel.values()) {
      let run = 1;
      for (let i = 1; i < dates.length; i++) {
        run = nextDay(dates[i - 1]) === dates[i] ? run + 1 : 1;
        longest = Math.max(longest, run);
      }
    }
    expect(longest).toBeGreaterThanOrEqual(3);
    expect(longest).toBeLessThanOrEqual(5);
    expect(s.defects.missingDays.length).toBeGreaterThan(longest);
  });

  it('has one implausible fuel typo (ten times the true value)', () => {
    expect(s.defects.typos).toHaveLength(1);
    const t = s.defects.typos[0];
    const log = find(t.gensetKey, t.date) as ScenarioLog;
    expect(log[t.field]).toBe(t.loggedValue);
    expect(t.loggedValue / t.trueValue).toBeCloseTo(10, 6);
  });

  it('has low-load days (below 30 % of rating for at least 4 h) and sets that differ in hours run', () => {
    const byKey = new Map(gensets(s).map((g) => [g.key, g]));
    const lowLoad = s.logs.filter((l) => l.truth.hoursRun >= 4 && l.truth.loadKw < 0.3 * (byKey.get(l.gensetKey) as ScenarioGenset).ratedKw);
    expect(lowLoad.length).toBeGreaterThan(20);
    for (const v of s.vessels) {
      const totals = v.gensets.filter((g) => g.duty === 'service').map((g) => (logs.get(g.key) as ScenarioLog[]).reduce((a, l) => a + l.truth.hoursRun, 0));
      expect(new Set(totals.map((t) => Math.round(t))).size).toBe(totals.length);
    }
  });

  it('runs emergency sets only for short weekly tests', () => {
    for (const g of gensets(s).filter((x) => x.duty === 'emergency')) {
      const runs = (logs.get(g.key) as ScenarioLog[]).filter((l) => l.truth.hoursRun > 0);
      expect(runs.length).toBeGreaterThan(90);
      expect(runs.length).toBeLessThanOrEqual(105);
      for (const l of runs) expect(l.truth.hoursRun).toBeLessThanOrEqual(0.6);
    }
  });
});

describe('demo scenario: true curves', () => {
  it('quadraticCurveFromSfoc meets its targets (minimum found by a fine scan, not by the closed form)', () => {
    const target = { ratedKw: 2000, minSfocGPerKwh: 195, bestLoadFraction: 0.85, riseAt25PctGPerKwh: 30 };
    const curve = quadraticCurveFromSfoc(target);
    let best = { p: 0, sfoc: Infinity };
    for (let p = 0.2; p <= 1.0001; p += 1e-5) {
      const v = sfocGPerKwh(curve, p * 2000);
      if (v < best.sfoc) best = { p, sfoc: v };
    }
    expect(best.p).toBeCloseTo(0.85, 3);
    expect(best.sfoc).toBeCloseTo(195, 6);
    expect(sfocGPerKwh(curve, 500) - 195).toBeCloseTo(30, 9);
  });

  it('gives realistic SFOC (185 to 220 g/kWh at 75-85 % load, rising at low load) and shop tests a few g/kWh better', () => {
    for (const g of gensets(withNoise)) {
      const c = g.trueCurve;
      expect(c.c).toBeGreaterThan(0);
      for (const pct of [75, 85]) {
        const v = sfocGPerKwh(c, (g.ratedKw * pct) / 100);
        expect(v).toBeGreaterThan(185);
        expect(v).toBeLessThan(220);
      }
      expect(sfocGPerKwh(c, g.ratedKw * 0.25) - sfocGPerKwh(c, g.ratedKw * 0.85)).toBeGreaterThan(20);
      const shop = g.shopTestSfoc;
      ([[25, shop.p25], [50, shop.p50], [75, shop.p75], [85, shop.p85], [100, shop.p100]] as const).forEach(([pct, value]) => {
        const gap = sfocGPerKwh(c, (g.ratedKw * pct) / 100) - value;
        expect(gap).toBeGreaterThanOrEqual(2.5 - 0.05); // 0.05: rounding to 0.1 g/kWh
        expect(gap).toBeLessThanOrEqual(5 + 0.05);
      });
      expect(g.driftGPerKwhPer1000h).toBeGreaterThan(0.5);
      expect(g.driftGPerKwhPer1000h).toBeLessThan(2.5);
    }
  });
});

describe('demo scenario: ground truth (noise off)', () => {
  const s = noiseFree;
  const lots = new Map(s.fuelLots.map((l) => [l.key, l]));
  const typo = new Set(s.defects.typos.map((t) => `${t.gensetKey} ${t.date}`));
  const replacement = new Map(s.meterReplacements.map((r) => [`${r.gensetKey} ${r.date}`, r]));

  /** Meter reading at the last drift-resetting overhaul before a date: from the events, else the start state. */
  const resetReading = (g: ScenarioGenset, date: string) => {
    const events = s.overhaulEvents.filter((e) => e.gensetKey === g.key && e.resetsDrift && e.date <= date);
    if (events.length) return events[events.length - 1].runningHours;
    return Math.max(...g.maintenanceAtStart.filter((m) => m.resetsDrift).map((m) => m.lastDoneRunningHours));
  };

  it('reproduces, from the raw log fields alone, the true curve at the day\'s load plus the documented drift', () => {
    // Inverse of the documented model: hours and kWh from meter deltas; mass from a mass flowmeter, or volume at 15 °C
    // by ASTM D1250 Table 54B (fuel oils) × density; ISO fuel = mass × LCV / 42.7 MJ/kg (ISO 3046-1 reference LCV).
    const logs = byGenset(s);
    let checked = 0;
    for (const g of gensets(s)) {
      const list = logs.get(g.key) as ScenarioLog[];
      for (let i = 1; i < list.length; i++) {
        const prev = list[i - 1];
        const log = list[i];
        if (nextDay(prev.logDate) !== log.logDate || typo.has(`${g.key} ${log.logDate}`)) continue;
        const hours = log.runningHoursMeter - prev.runningHoursMeter;
        const r = replacement.get(`${g.key} ${log.logDate}`);
        const kwh = r ? r.oldFinalReading - prev.kwhMeter + (log.kwhMeter - r.newStartReading) : log.kwhMeter - prev.kwhMeter;
        if (hours <= 0) {
          expect(log.fuelMassKg ?? log.fuelVolumeL).toBe(0);
          continue;
        }
        const lot = lots.get(log.fuelLotKey) as DemoScenario['fuelLots'][number];
        const massKg =
          log.fuelMassKg ?? ((log.fuelVolumeL as number) / 1000) * lot.density15KgPerM3 * vcfFuelOils54B(lot.density15KgPerM3, log.fuelTempC as number);
        const isoKg = (massKg * lot.trueLcvMjPerKg) / 42.7;
        const loadKw = kwh / hours;
        const hoursSinceOverhaul = prev.runningHoursMeter - resetReading(g, log.logDate);
        const c = g.trueCurve;
        const expected = hours * (c.a + c.b * loadKw + c.c * loadKw * loadKw) + (g.driftGPerKwhPer1000h * hoursSinceOverhaul * kwh) / 1e6;
        expect(Math.abs(isoKg - expected) / expected).toBeLessThan(FLOAT_REL_TOL);
        expect(Math.abs(loadKw - log.truth.loadKw) / loadKw).toBeLessThan(FLOAT_REL_TOL);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(5000);
  });

  it('lets an ordinary least-squares fit (ml-matrix QR) recover each service set\'s true coefficients', () => {
    // Source: ml-matrix `solve` (least squares by QR), a general-purpose reference library. Drift removed with the
    // documented g/kWh-per-1000 h rule; the rest must be exactly quadratic in the load.
    const logs = byGenset(s);
    for (const g of gensets(s).filter((x) => x.duty === 'service')) {
      const rows = (logs.get(g.key) as ScenarioLog[]).filter((l) => l.truth.hoursRun > 0 && !typo.has(`${g.key} ${l.logDate}`));
      const x = rows.map((l) => [1, l.truth.loadKw / 1000, (l.truth.loadKw / 1000) ** 2]);
      const y = rows.map((l) => {
        const lot = lots.get(l.fuelLotKey) as DemoScenario['fuelLots'][number];
        const massKg = l.fuelMassKg ?? ((l.fuelVolumeL as number) / 1000) * lot.density15KgPerM3 * vcfFuelOils54B(lot.density15KgPerM3, l.fuelTempC as number);
        const driftKg = (g.driftGPerKwhPer1000h * l.truth.hoursSinceOverhaul * l.truth.kwh) / 1e6;
        return [((massKg * lot.trueLcvMjPerKg) / 42.7 - driftKg) / l.truth.hoursRun];
      });
      const coef = solve(new Matrix(x), new Matrix(y), true).to1DArray();
      expect(coef[0]).toBeCloseTo(g.trueCurve.a, 5);
      expect(coef[1] / 1000).toBeCloseTo(g.trueCurve.b, 8);
      expect(Math.abs(coef[2] / 1e6 - g.trueCurve.c) / g.trueCurve.c).toBeLessThan(1e-6);
    }
  });
});

describe('demo scenario: noise (on by default)', () => {
  it('measures fuel with about 1.5 % noise around the true mass (simple-statistics mean and sd)', () => {
    // Source: simple-statistics mean / standardDeviation. Sample of ~5 000 days: the standard error of the sd is
    // about 1.5 % / √(2n) ≈ 0.00015, so ±0.001 is a 6-sigma band; rounding to 0.1 kg adds < 1e-4.
    const typos = new Set(withNoise.defects.typos.map((t) => `${t.gensetKey} ${t.date}`));
    const ratios = withNoise.logs
      .filter((l) => l.fuelMassKg !== null && l.truth.fuelKg > 500 && !typos.has(`${l.gensetKey} ${l.logDate}`))
      .map((l) => (l.fuelMassKg as number) / l.truth.fuelKg);
    expect(ratios.length).toBeGreaterThan(3000);
    expect(mean(ratios)).toBeCloseTo(1, 3);
    expect(Math.abs(standardDeviation(ratios) - FUEL_METER_NOISE_REL_SD)).toBeLessThan(0.001);
  });

  it('adds the within-day load-variation effect only with noise on (never below the mean-load fuel)', () => {
    // Relative tolerance 1e-6: with noise on, overhaul meter readings are rounded to 0.1 h, which moves the drift
    // term by at most drift × 0.05 h / 1000 h (about 1e-7 of the fuel); float round-off is far below that.
    const relative = withNoise.logs.map((l, i) => (l.truth.fuelIsoKg - noiseFree.logs[i].truth.fuelIsoKg) / Math.max(1, l.truth.fuelIsoKg));
    expect(Math.min(...relative)).toBeGreaterThan(-1e-6);
    expect(Math.max(...relative)).toBeGreaterThan(1e-3);
  });
});
