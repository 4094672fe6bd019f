import { describe, expect, it } from 'vitest';
import { deriveDailyRow, meterDelta, QUALITY_FLAG_CODES } from '../../optimizer/logs';
import type { DailyRowContext, QualityFlagCode, RawDailyLog } from '../../optimizer/logs';

/** Hand computations carry at least 7 significant figures. */
const HAND_TOL_REL = 1e-7;
const close = (actual: number | null, expected: number, tolRel = HAND_TOL_REL) => {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(tolRel * Math.abs(expected));
};
const codes = (row: { flags: { code: QualityFlagCode }[] }) => row.flags.map((f) => f.code).sort();

const MGO_CTX: DailyRowContext = {
  ratedKw: 1000,
  minLoadPct: 30,
  lot: { grade: 'MGO', density15KgPerM3: 850, lcvKjPerKg: 42_700 },
  previous: { runningHoursReadingH: 12_000, energyReadingKwh: 5_000_000 },
};
const cleanLog: RawDailyLog = {
  date: '2026-03-02',
  gensetId: 'DG1',
  runningHours: { kind: 'cumulative', readingH: 12_020 },
  energy: { kind: 'cumulative', readingKwh: 5_012_000 },
  fuel: { kind: 'mass', value: 2.64, unit: 't' },
};

describe('deriveDailyRow on hand-computed rows', () => {
  // Hand: hours 12 020 − 12 000 = 20 h; kWh 5 012 000 − 5 000 000 = 12 000; load 600 kW = 60 % of 1000 kW;
  // fuel 2.64 t = 2640 kg; LCV = ISO 3046-1 reference, so ISO fuel = 2640 kg; SFOC 2 640 000 g / 12 000 kWh = 220;
  // CO2 = 2640 × 3.206 (MEPC.364(79) diesel/gas oil) = 8463.84 kg.
  it('cumulative meters, mass in t, measured LCV', () => {
    const row = deriveDailyRow(cleanLog, MGO_CTX);
    expect(row.hoursRun).toBe(20);
    expect(row.kwh).toBe(12_000);
    close(row.avgLoadKw, 600);
    close(row.avgLoadPct, 60);
    close(row.fuelKgAt15, 2640);
    close(row.fuelKgIso, 2640);
    close(row.sfocObservedGPerKwh, 220);
    close(row.sfocIsoGPerKwh, 220);
    close(row.co2Kg, 8463.84);
    expect(row.lcvBasis).toBe('measured');
    expect(row.cfFuelType).toBe('diesel-gas-oil');
    expect(row.readings).toEqual({ runningHoursH: 12_020, energyKwh: 5_012_000 });
    expect(row.flags).toEqual([]);
    expect(row.usable).toBe(true);
  });

  // Hand, with the printed ASTM D1250 Table 54B VCF 0.9870 for 990.3 kg/m³ at 34 °C (±5e-5 on 0.987, i.e.
  // ±5.1e-5 relative; we allow 6e-5 relative): fuel = 3 m³ × 0.9870 × 990.3 = 2932.2783 kg; hours 22, kWh 13 200 → 600 kW,
  // 75 % of 800 kW; SFOC = 2 932 278.3 / 13 200 = 222.1423 g/kWh; ISO (LCV 40 200): × 40 200 / 42 700 → 209.1363;
  // CO2 = 2932.2783 × 3.114 (MEPC.364(79) HFO) = 9131.114 kg.
  it('hours run and kWh produced, volume fuel in m³ with temperature', () => {
    const PRINTED_VCF_REL_TOL = 6e-5;
    const row = deriveDailyRow(
      {
        date: '2026-03-02',
        gensetId: 'DG2',
        runningHours: { kind: 'run', hoursRun: 22 },
        energy: { kind: 'produced', kwh: 13_200 },
        fuel: { kind: 'volume', value: 3, unit: 'm3', tempC: 34 },
      },
      { ratedKw: 800, minLoadPct: 30, lot: { grade: 'HFO', density15KgPerM3: 990.3, lcvKjPerKg: 40_200 } },
    );
    close(row.avgLoadKw, 600);
    close(row.avgLoadPct, 75);
    close(row.fuelKgAt15, 2932.2783, PRINTED_VCF_REL_TOL);
    close(row.sfocObservedGPerKwh, 222.1423, PRINTED_VCF_REL_TOL);
    close(row.sfocIsoGPerKwh, 209.1363, PRINTED_VCF_REL_TOL);
    close(row.fuelKgIso, 2932.2783 * (40_200 / 42_700), PRINTED_VCF_REL_TOL);
    close(row.co2Kg, 9131.114, PRINTED_VCF_REL_TOL);
    expect(row.readings).toEqual({ runningHoursH: null, energyKwh: null });
    expect(row.flags).toEqual([]);
  });

  // Hand: Table 54B VCF for 860 kg/m³ at 40 °C = 0.979426228395587 (computed from the formula, see the VCF test);
  // fuel = 4 m³ (4000 L) × 0.979426228 × 860 = 3369.226226 kg. No LCV on the lot, so ISO 8217 distillate estimate
  // with S 0.1 %: 42.6134101632 MJ/kg (hand computation in the LCV test); ISO fuel = 3369.226226 × 42 613.41016 /
  // 42 700 = 3362.393890 kg. 20 h, 14 000 kWh: SFOC 240.6590161 observed, 240.1709921 ISO.
  it('volume fuel in L, LCV estimated from density (ISO 8217 distillate formula)', () => {
    const row = deriveDailyRow(
      {
        date: '2026-03-02',
        gensetId: 'DG3',
        runningHours: { kind: 'cumulative', readingH: 5020 },
        energy: { kind: 'produced', kwh: 14_000 },
        fuel: { kind: 'volume', value: 4000, unit: 'L', tempC: 40 },
      },
      { ratedKw: 1000, minLoadPct: 30, lot: { grade: 'MDO', density15KgPerM3: 860, sulphurPct: 0.1 }, previous: { runningHoursReadingH: 5000 } },
    );
    expect(row.hoursRun).toBe(20);
    expect(row.lcvBasis).toBe('iso-8217-estimate');
    close(row.lcvKjPerKg, 42_613.4101632);
    close(row.fuelKgAt15, 3369.226226);
    close(row.fuelKgIso, 3362.39389);
    close(row.sfocObservedGPerKwh, 240.6590161);
    close(row.sfocIsoGPerKwh, 240.1709921);
    close(row.co2Kg, 3369.226226 * 3.206);
  });

  // Hand: VLSFO with 45 mm²/s at 50 °C falls in the RMA–RMD family → LFO, Cf 3.151 (MEPC.364(79)). Residual LCV:
  // base = 46.704 − 8.802 × 0.874225 + 3.167 × 0.935 = 41.97021655; × (1 − 0.0063) = 41.70580418; + 0.0471 −
  // 0.002449 = 41.75045518 MJ/kg. 2.5 t → ISO fuel 2500 × 41 750.45518 / 42 700 = 2444.406041 kg; CO2 7877.5 kg.
  it('VLSFO lot mapped by viscosity, LCV from the residual formula', () => {
    const row = deriveDailyRow(
      { ...cleanLog, fuel: { kind: 'mass', value: 2500, unit: 'kg' } },
      { ...MGO_CTX, lot: { grade: 'VLSFO', density15KgPerM3: 935, viscosity50Cst: 45, sulphurPct: 0.5, waterPct: 0.1, ashPct: 0.03 } },
    );
    expect(row.cfFuelType).toBe('light-fuel-oil');
    close(row.lcvKjPerKg, 41_750.45518);
    close(row.fuelKgIso, 2444.406041);
    close(row.co2Kg, 7877.5);
  });

  it('gases use the MEPC.364(79) default LCV; a lot estimate is labelled as such', () => {
    const lng = deriveDailyRow(cleanLog, { ...MGO_CTX, lot: { grade: 'LNG', density15KgPerM3: 450 } });
    expect(lng.lcvBasis).toBe('mepc-default');
    expect(lng.lcvKjPerKg).toBe(48_000);
    // Hand: 2640 kg × 48 000 / 42 700 = 2967.6815 kg.
    close(lng.fuelKgIso, 2967.681499);
    const est = deriveDailyRow(cleanLog, { ...MGO_CTX, lot: { ...MGO_CTX.lot, lcvIsEstimated: true } });
    expect(est.lcvBasis).toBe('lot-estimate');
  });
});

describe('meter replacement and rollover', () => {
  // Hand: rollover of a 6-digit kWh counter recorded as old final 1 000 000, new start 0:
  // (1 000 000 − 999 500) + (11 510 − 0) = 12 010 kWh.
  it('a recorded rollover gives the right delta', () => {
    const row = deriveDailyRow(
      { ...cleanLog, energy: { kind: 'cumulative', readingKwh: 11_510, replacement: { oldFinalReading: 1_000_000, newStartReading: 0 } } },
      { ...MGO_CTX, previous: { runningHoursReadingH: 12_000, energyReadingKwh: 999_500 } },
    );
    expect(row.kwh).toBe(12_010);
    expect(row.readings.energyKwh).toBe(11_510);
    expect(row.flags).toEqual([]);
  });

  // Hand: hour meter replaced: old read 12 007.5 at removal, new one started at 3.0 and reads 15.5 now:
  // (12 007.5 − 12 000) + (15.5 − 3.0) = 7.5 + 12.5 = 20 h.
  it('a recorded replacement gives the right delta', () => {
    expect(meterDelta({ previousReading: 12_000, currentReading: 15.5, replacement: { oldFinalReading: 12_007.5, newStartReading: 3 } })).toEqual({
      ok: true,
      delta: 20,
      replaced: true,
    });
  });

  it('meterDelta reports a drop or a missing previous reading as a result, not an exception', () => {
    expect(meterDelta({ previousReading: 500, currentReading: 480 })).toEqual({ ok: false, reason: 'negative-delta', rawDelta: -20 });
    expect(meterDelta({ previousReading: null, currentReading: 480 })).toEqual({ ok: false, reason: 'previous-missing' });
    expect(meterDelta({ previousReading: 480, currentReading: 480 })).toEqual({ ok: true, delta: 0, replaced: false });
    expect(() => meterDelta({ previousReading: 1, currentReading: Number.NaN })).toThrow(/currentReading/);
  });

  it('an unrecorded drop is flagged, never accepted', () => {
    const row = deriveDailyRow({ ...cleanLog, energy: { kind: 'cumulative', readingKwh: 11_510 } }, MGO_CTX);
    expect(row.kwh).toBeNull();
    expect(row.sfocObservedGPerKwh).toBeNull();
    expect(codes(row)).toEqual(['METER_NEGATIVE_DELTA']);
    expect(row.flags[0].field).toBe('energy');
    expect(row.usable).toBe(false);
  });

  it('an inconsistent replacement is flagged', () => {
    expect(meterDelta({ previousReading: 500, currentReading: 10, replacement: { oldFinalReading: 400, newStartReading: 0 } })).toMatchObject({
      ok: false,
      reason: 'replacement-inconsistent',
    });
    const row = deriveDailyRow(
      { ...cleanLog, runningHours: { kind: 'cumulative', readingH: 2, replacement: { oldFinalReading: 12_010, newStartReading: 5 } } },
      MGO_CTX,
    );
    expect(codes(row)).toEqual(['METER_REPLACEMENT_INCONSISTENT']);
    expect(row.hoursRun).toBeNull();
  });
});

describe('quality flags: each fires, and none on a clean row', () => {
  const run = (patch: Partial<RawDailyLog>, ctx: Partial<DailyRowContext> = {}) => deriveDailyRow({ ...cleanLog, ...patch }, { ...MGO_CTX, ...ctx });
  const hoursRun = (h: number) => ({ runningHours: { kind: 'run' as const, hoursRun: h } });

  const cases: Array<[QualityFlagCode, () => ReturnType<typeof deriveDailyRow>]> = [
    ['HOURS_OVER_24', () => run({ ...hoursRun(25), energy: { kind: 'produced', kwh: 15_000 }, fuel: { kind: 'mass', value: 3300, unit: 'kg' } })],
    ['HOURS_NEGATIVE', () => run(hoursRun(-1))],
    ['METER_NEGATIVE_DELTA', () => run({ runningHours: { kind: 'cumulative', readingH: 11_999 } })],
    ['METER_PREVIOUS_MISSING', () => run({}, { previous: { runningHoursReadingH: 12_000 } })],
    ['METER_REPLACEMENT_INCONSISTENT', () => run({ energy: { kind: 'cumulative', readingKwh: 10, replacement: { oldFinalReading: 5_000_010, newStartReading: 20 } } })],
    ['KWH_OVER_RATED', () => run({ energy: { kind: 'cumulative', readingKwh: 5_021_000 }, fuel: { kind: 'mass', value: 4.62, unit: 't' } })],
    ['SFOC_OUT_OF_BAND', () => run({ fuel: { kind: 'mass', value: 1, unit: 't' } })],
    ['LOW_LOAD', () => run({ energy: { kind: 'cumulative', readingKwh: 5_004_000 }, fuel: { kind: 'mass', value: 1, unit: 't' } })],
    ['FUEL_WITHOUT_HOURS', () => run({ ...hoursRun(0), energy: { kind: 'produced', kwh: 0 }, fuel: { kind: 'mass', value: 50, unit: 'kg' } })],
  ];
  it('a 25 h ship\'s day (clocks retarded) carries 25 h without HOURS_OVER_24; 26 h still flags (common practice)', () => {
    const long = { ...hoursRun(25), energy: { kind: 'produced' as const, kwh: 15_000 }, fuel: { kind: 'mass' as const, value: 3300, unit: 'kg' as const } };
    expect(codes(run({ ...long, dayLengthH: 25 }))).toEqual([]);
    expect(codes(run({ ...long, runningHours: { kind: 'run', hoursRun: 26 }, dayLengthH: 25 }))).toEqual(['HOURS_OVER_24']);
    expect(codes(run({ ...hoursRun(24), energy: long.energy, fuel: long.fuel, dayLengthH: 23 }))).toEqual(['HOURS_OVER_24']);
  });
  for (const [code, make] of cases) {
    it(`${code} fires alone, with field and message`, () => {
      const row = make();
      expect(codes(row)).toEqual([code]);
      expect(row.flags[0].field.length).toBeGreaterThan(0);
      expect(row.flags[0].message.length).toBeGreaterThan(10);
    });
  }

  it('covers every row-level code (series codes are tested with the series)', () => {
    const tested = new Set(cases.map(([c]) => c));
    const rowLevel = QUALITY_FLAG_CODES.filter((c) => c !== 'MISSING_DAY' && c !== 'DUPLICATE_DATE');
    expect(rowLevel.filter((c) => !tested.has(c))).toEqual([]);
  });

  it('boundaries do not fire: 24 h, exactly rated energy, SFOC at the band edge, load at the minimum', () => {
    // 24 h at 1000 kW = 24 000 kWh (exactly rated); fuel 3.6 t → SFOC 150 g/kWh (band edge, common practice band).
    expect(run({ ...hoursRun(24), energy: { kind: 'produced', kwh: 24_000 }, fuel: { kind: 'mass', value: 3.6, unit: 't' } }).flags).toEqual([]);
    // 20 h at 300 kW = 30 % (the minimum); fuel 1.35 t → 225 g/kWh.
    expect(run({ energy: { kind: 'cumulative', readingKwh: 5_006_000 }, fuel: { kind: 'mass', value: 1.35, unit: 't' } }).flags).toEqual([]);
    // A 25 h day (clocks retarded) allows 25 h.
    expect(run({ ...hoursRun(25), energy: { kind: 'produced', kwh: 15_000 }, fuel: { kind: 'mass', value: 3.3, unit: 't' } }, { dayLengthH: 25 }).flags).toEqual([]);
  });

  it('the SFOC band is a parameter', () => {
    expect(codes(run({}, { sfocBandGPerKwh: { min: 150, max: 210 } }))).toEqual(['SFOC_OUT_OF_BAND']);
    expect(run({ fuel: { kind: 'mass', value: 1, unit: 't' } }, { sfocBandGPerKwh: { min: 50, max: 450 } }).flags).toEqual([]);
  });

  it('LOW_LOAD is a warning: the row stays usable', () => {
    const row = cases.find(([c]) => c === 'LOW_LOAD')![1]();
    expect(row.flags[0].severity).toBe('warning');
    expect(row.usable).toBe(true);
  });

  it('throws on malformed input, naming the field', () => {
    expect(() => run({ fuel: { kind: 'mass', value: -1, unit: 't' } })).toThrow(/fuel.value/);
    expect(() => run({ energy: { kind: 'produced', kwh: -5 } })).toThrow(/energy.kwh/);
    expect(() => run({}, { ratedKw: 0 })).toThrow(/ratedKw/);
    expect(() => run({ fuel: { kind: 'volume', value: 1, unit: 'm3', tempC: 300 } })).toThrow(/tempC/);
    expect(() => run({}, { sfocBandGPerKwh: { min: 300, max: 200 } })).toThrow(/sfocBandGPerKwh/);
  });
});
