/**
 * Monthly reports of a vessel and of the fleet: one content (key figures, tables with units in the headers, the
 * method and the caution) shown as a printable page and downloaded as CSV or XLSX (exceljs).
 */
import ExcelJS from 'exceljs';
import { dateOfDayNumber, dayNumber } from '../../optimizer/index';
import { FLEET_METHOD } from '../../shared/schemas/fleet';
import { reportQuerySchema, type MonthlyReport, type ReportTable } from '../../shared/schemas/reports';
import type { IntervalAmountView, SavingsTotalsView, VesselSavingsReport } from '../../shared/schemas/savings';
import type { Actor, AppDeps } from '../context';
import { writeCsv } from '../lib/csv';
import { parseBody } from '../lib/parse';
import { computeFleetBenchmark } from './fleet';
import { computeVesselSavings } from './savings';

const LEVEL = 0.95;

/** First and last day of a month YYYY-MM. */
export function monthBounds(month: string): { from: string; to: string } {
  const [y, m] = month.split('-').map(Number);
  const next = m === 12 ? `${y + 1}-01-01` : `${y}-${String(m + 1).padStart(2, '0')}-01`;
  return { from: `${month}-01`, to: dateOfDayNumber(dayNumber(next) - 1) };
}

/** The month before the month of a date (the period a report sent on that date covers). */
export function previousMonth(now: Date): string {
  const y = now.getUTCFullYear();
  const m = now.getUTCMonth(); // 0-based: the previous month's 1-based number
  return m === 0 ? `${y - 1}-12` : `${y}-${String(m).padStart(2, '0')}`;
}

const r = (x: number | null | undefined, digits: number): number | null => (x === null || x === undefined || !Number.isFinite(x) ? null : Number(x.toFixed(digits)));
const text = (x: number | null | undefined, digits: number, unit: string) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : `${x.toFixed(digits)} ${unit}`);
const interval = (a: IntervalAmountView, digits: number, unit: string, level: number) =>
  `${a.value.toFixed(digits)} ${unit} (${Math.round(level * 100)} % interval ${a.lower.toFixed(digits)} to ${a.upper.toFixed(digits)} ${unit})`;

function totalsRow(t: SavingsTotalsView): (string | number | null)[] {
  return [
    t.label,
    t.days,
    r(t.energyMwh, 2),
    r(t.measuredFuelT, 3),
    r(t.modelledActualFuelT, 3),
    r(t.recommendedFuelT, 3),
    r(t.avoidableFuelT.value, 3),
    r(t.avoidableFuelT.lower, 3),
    r(t.avoidableFuelT.upper, 3),
    r(t.avoidablePct, 2),
    r(t.co2.avoidableT.value, 3),
    r(t.cost?.avoidable.value, 0),
    r(t.lowLoadHours, 1),
    r(t.splitSavingActualSetsT, 3),
  ];
}

const totalsHeaders = (currency: string) => [
  'Period',
  'Days',
  'Energy (MWh)',
  'Measured fuel (t)',
  'Modelled actual fuel (t)',
  'Recommended fuel (t)',
  'Avoidable fuel (t)',
  'Avoidable lower (t)',
  'Avoidable upper (t)',
  'Avoidable (%)',
  'Avoidable CO2 (t)',
  `Avoidable cost (${currency})`,
  'Low-load hours (h)',
  'Equal vs optimal split, sets run (t)',
];

function savingsSummary(s: VesselSavingsReport): MonthlyReport['summary'] {
  const p = s.period;
  const out = [
    { label: 'Energy (MWh)', value: text(p.energyMwh, 1, 'MWh') },
    { label: 'Measured fuel (t)', value: text(p.measuredFuelT, 2, 't') },
    { label: 'Avoidable fuel (t)', value: interval(p.avoidableFuelT, 2, 't', s.level) },
    { label: 'Avoidable CO2 (t)', value: interval(p.co2.avoidableT, 2, 't', s.level) },
  ];
  if (p.cost) out.push({ label: `Avoidable cost (${p.cost.currency})`, value: interval(p.cost.avoidable, 0, p.cost.currency, s.level) });
  out.push({ label: 'Low-load running hours (h)', value: text(p.lowLoadHours, 1, 'h') });
  if (s.adoption) {
    out.push({
      label: 'Since adoption, SFOC change at equal load (g/kWh)',
      value: `${s.adoption.changeGPerKwh.toFixed(1)} g/kWh (${s.adoption.changeLowerGPerKwh.toFixed(1)} to ${s.adoption.changeUpperGPerKwh.toFixed(1)})`,
    });
  }
  return out;
}

function dayTable(s: VesselSavingsReport): ReportTable {
  return {
    title: 'Days',
    headers: ['Date', 'Grade', 'Energy (kWh)', 'Sets run', 'Measured fuel (kg)', 'Modelled actual (kg)', 'Residual (%)', 'Recommended (kg)', 'Recommended sets', 'Avoidable (kg)', 'Avoidable lower (kg)', 'Avoidable upper (kg)', 'Low-load hours (h)'],
    rows: s.days.map((d) => [
      d.date,
      d.grade,
      r(d.energyKwh, 0),
      d.actualSets.map((x) => x.designation).join(' + '),
      r(d.measuredFuelKg, 0),
      r(d.modelledActualFuelKg, 0),
      r(d.residualPct, 1),
      r(d.recommendedFuelKg, 0),
      d.modes.map((m) => `${m.mode}: ${m.feasible ? m.sets.join(' + ') : 'none feasible'}`).join('; '),
      r(d.avoidableFuelKg, 0),
      r(d.avoidableLowerKg, 0),
      r(d.avoidableUpperKg, 0),
      r(d.lowLoadHours, 1),
    ]),
  };
}

/** The monthly report of a vessel the actor may see. */
export async function buildVesselReport(deps: AppDeps, actor: Actor, vesselId: string, month: string): Promise<MonthlyReport> {
  const { from, to } = monthBounds(month);
  const s = await computeVesselSavings(deps, actor, vesselId, { from, to, level: LEVEL });
  return {
    kind: 'vessel',
    title: `${s.vesselName}: savings report ${month}`,
    companyName: actor.companyName,
    vesselId,
    month,
    from,
    to,
    generatedAt: deps.now().toISOString(),
    currency: s.currency,
    summary: savingsSummary(s),
    tables: [
      { title: 'Totals', headers: totalsHeaders(s.currency), rows: [totalsRow(s.period)] },
      dayTable(s),
      { title: 'Curves used', headers: ['Set', 'Curve', 'Note', 'Uncertainty counted'], rows: s.curves.map((c) => [c.designation, c.source === 'fit' ? 'fit' : 'shop test', c.note, c.hasCovariance ? 'yes' : 'no']) },
    ],
    warnings: [...s.warnings, ...s.skippedDays.map((d) => `${d.date} left out: ${d.reason}`)],
    method: s.method,
    caution: s.caution,
  };
}

/** The monthly report of every vessel the actor may see. */
export async function buildFleetReport(deps: AppDeps, actor: Actor, month: string): Promise<MonthlyReport> {
  const { from, to } = monthBounds(month);
  const b = await computeFleetBenchmark(deps, actor, { from, to, level: LEVEL });
  const periods = b.savings.filter((s): s is VesselSavingsReport => s !== null && s.period.days > 0);
  const sum = (f: (s: VesselSavingsReport) => number) => periods.reduce((acc, s) => acc + f(s), 0);
  const warnings = b.vessels.filter((v) => v.savingsUnavailable).map((v) => `${v.vesselName}: ${v.savingsUnavailable}`);
  return {
    kind: 'fleet',
    title: `Fleet savings and benchmark report ${month}`,
    companyName: actor.companyName,
    vesselId: null,
    month,
    from,
    to,
    generatedAt: deps.now().toISOString(),
    currency: b.currency,
    summary: [
      { label: 'Vessels', value: String(b.vessels.length) },
      { label: 'Energy (MWh)', value: text(sum((s) => s.period.energyMwh), 1, 'MWh') },
      // Fleet sums of the point estimates; each vessel's interval is in the table (curves differ per vessel).
      { label: 'Avoidable fuel, sum of vessels (t)', value: text(sum((s) => s.period.avoidableFuelT.value), 2, 't') },
      { label: 'Avoidable CO2, sum of vessels (t)', value: text(sum((s) => s.period.co2.avoidableT.value), 2, 't') },
      { label: 'Drift alerts', value: String(b.vessels.reduce((n, v) => n + v.driftAlerts, 0)) },
    ],
    tables: [
      {
        title: 'Vessels',
        headers: ['Vessel', 'Sets', 'Energy (MWh)', 'Plant SFOC ISO (g/kWh)', 'Load factor (%)', 'Low-load share (%)', 'Avoidable fuel (t)', 'Avoidable lower (t)', 'Avoidable upper (t)', 'Avoidable (%)', 'Avoidable CO2 (t)', 'Drift alerts', 'Hours since overhaul spread (h)', 'Hours CV (%)', 'Least hours to overhaul (h)'],
        rows: b.vessels.map((v) => [
          v.vesselName,
          v.setCount,
          r(v.energyMwh, 2),
          r(v.plantSfocIsoGPerKwh, 1),
          r(v.avgLoadFactorPct, 1),
          r(v.lowLoadHoursSharePct, 1),
          r(v.avoidableFuelT?.value, 3),
          r(v.avoidableFuelT?.lower, 3),
          r(v.avoidableFuelT?.upper, 3),
          r(v.avoidablePct, 2),
          r(v.avoidableCo2T?.value, 3),
          v.driftAlerts,
          r(v.hoursSinceOverhaulSpreadH, 0),
          r(v.periodHoursCvPct, 1),
          r(v.minHoursToOverhaulH, 0),
        ]),
      },
      {
        title: 'Sets',
        headers: ['Vessel', 'Set', 'Rating (kW)', 'Curve', 'Hours run (h)', 'SFOC ISO (g/kWh)', 'SFOC at 75 % (g/kWh)', 'Load factor (%)', 'Low-load share (%)', 'Drift alert', 'Hours since overhaul (h)', 'Hours to next overhaul (h)'],
        rows: b.sets.map((s) => [
          s.vesselName,
          s.designation,
          s.ratedKw,
          s.curveSource === 'fit' ? 'fit' : 'shop test',
          r(s.hoursRun, 1),
          r(s.sfocIsoGPerKwh, 1),
          r(s.sfoc75GPerKwh, 1),
          r(s.avgLoadFactorPct, 1),
          r(s.lowLoadHoursSharePct, 1),
          s.driftAlert ? 'yes' : 'no',
          r(s.hoursSinceOverhaulH, 0),
          r(s.hoursToNextOverhaulH, 0),
        ]),
      },
    ],
    warnings,
    method: [...Object.values(FLEET_METHOD), ...(periods[0]?.method ?? [])],
    caution: b.caution,
  };
}

/** CSV of a report: key figures, each table under its title, then method and caution. */
export function reportCsv(report: MonthlyReport): string {
  const rows: (string | number | null)[][] = [[report.companyName], [report.from, report.to], []];
  for (const s of report.summary) rows.push([s.label, s.value]);
  for (const t of report.tables) {
    rows.push([], [t.title], t.headers, ...t.rows);
  }
  rows.push([], ['Method'], ...report.method.map((m) => [m]), [], ['Caution', report.caution]);
  for (const w of report.warnings) rows.push(['Note', w]);
  // The header row is as wide as the widest row (the CSV writer keeps as many columns as there are headers).
  const width = Math.max(1, ...rows.map((row) => row.length));
  return writeCsv([report.title, ...Array<string>(width - 1).fill('')], rows);
}

/** XLSX of a report (exceljs): a summary sheet with method and caution, one sheet per table. */
export async function reportXlsx(report: MonthlyReport): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Kilowatch';
  wb.created = new Date(report.generatedAt);
  const summary = wb.addWorksheet('Summary');
  summary.addRow([report.title]).font = { bold: true, size: 14 };
  summary.addRow([report.companyName]);
  summary.addRow(['Period', `${report.from} to ${report.to}`]);
  summary.addRow([]);
  for (const s of report.summary) summary.addRow([s.label, s.value]);
  summary.addRow([]);
  summary.addRow(['Method']).font = { bold: true };
  for (const m of report.method) summary.addRow([m]);
  summary.addRow([]);
  summary.addRow(['Caution', report.caution]).font = { bold: true };
  for (const w of report.warnings) summary.addRow(['Note', w]);
  summary.getColumn(1).width = 48;
  summary.getColumn(2).width = 60;
  for (const t of report.tables) {
    const ws = wb.addWorksheet(t.title.slice(0, 31));
    ws.addRow(t.headers).font = { bold: true };
    for (const row of t.rows) ws.addRow(row);
    t.headers.forEach((h, i) => (ws.getColumn(i + 1).width = Math.max(12, Math.min(40, h.length + 2))));
    ws.views = [{ state: 'frozen', ySplit: 1 }];
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}

export const reportFileName = (report: MonthlyReport, ext: 'csv' | 'xlsx') =>
  `kilowatch-${report.kind === 'vessel' ? report.title.split(':')[0].replace(/[^A-Za-z0-9]+/g, '-').toLowerCase() : 'fleet'}-${report.month}.${ext}`;

export async function getVesselReport(deps: AppDeps, actor: Actor, vesselId: string, rawQuery: unknown): Promise<MonthlyReport> {
  return buildVesselReport(deps, actor, vesselId, parseBody(reportQuerySchema, rawQuery, 'report month').month);
}

export async function getFleetReport(deps: AppDeps, actor: Actor, rawQuery: unknown): Promise<MonthlyReport> {
  return buildFleetReport(deps, actor, parseBody(reportQuerySchema, rawQuery, 'report month').month);
}
