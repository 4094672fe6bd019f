import type { EChartsOption } from 'echarts';
import type { VesselSavingsReport } from '../../../../shared/schemas/savings';

/** Daily avoidable fuel (kg) with its interval as an error band, and the equal-vs-optimal split saving. */
export function dailySavingsOption(report: VesselSavingsReport): EChartsOption {
  const days = report.days;
  return {
    tooltip: { trigger: 'axis', valueFormatter: (v) => (typeof v === 'number' ? `${v.toFixed(0)} kg` : String(v)) },
    legend: { top: 0 },
    grid: { left: 64, right: 24, top: 36, bottom: 48 },
    xAxis: { type: 'category', data: days.map((d) => d.date), name: 'Date', nameLocation: 'middle', nameGap: 32 },
    yAxis: { type: 'value', name: 'Fuel (kg)', nameLocation: 'middle', nameGap: 48 },
    series: [
      { name: 'Avoidable fuel (kg)', type: 'bar', data: days.map((d) => d.avoidableFuelKg) },
      { name: 'Interval lower (kg)', type: 'line', symbol: 'none', lineStyle: { type: 'dashed' }, data: days.map((d) => d.avoidableLowerKg) },
      { name: 'Interval upper (kg)', type: 'line', symbol: 'none', lineStyle: { type: 'dashed' }, data: days.map((d) => d.avoidableUpperKg) },
      { name: 'Equal vs optimal split, sets run (kg)', type: 'line', data: days.map((d) => d.splitSavingActualSetsKg) },
    ],
  };
}

/** Measured against modelled-actual and recommended fuel per month (t). */
export function monthlyFuelOption(report: VesselSavingsReport): EChartsOption {
  const m = report.byMonth;
  return {
    tooltip: { trigger: 'axis', valueFormatter: (v) => (typeof v === 'number' ? `${v.toFixed(2)} t` : String(v)) },
    legend: { top: 0 },
    grid: { left: 64, right: 24, top: 36, bottom: 48 },
    xAxis: { type: 'category', data: m.map((x) => x.label), name: 'Month', nameLocation: 'middle', nameGap: 32 },
    yAxis: { type: 'value', name: 'Fuel (t)', nameLocation: 'middle', nameGap: 48 },
    series: [
      { name: 'Measured (t)', type: 'bar', data: m.map((x) => x.measuredFuelT) },
      { name: 'Modelled actual (t)', type: 'bar', data: m.map((x) => x.modelledActualFuelT) },
      { name: 'Recommended (t)', type: 'bar', data: m.map((x) => x.recommendedFuelT) },
    ],
  };
}
