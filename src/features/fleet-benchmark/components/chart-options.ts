import type { EChartsOption } from 'echarts';
import type { FleetBenchmark, SisterCurveGroup } from '../../../../shared/schemas/fleet';

const fixed = (digits: number, unit: string) => (v: unknown) => (typeof v === 'number' ? `${v.toFixed(digits)} ${unit}` : '–');

/** SFOC (g/kWh) against load (% of rating) of every set of one rating, one line per vessel and set. */
export function sisterCurvesOption(group: SisterCurveGroup): EChartsOption {
  return {
    tooltip: { trigger: 'axis', valueFormatter: fixed(1, 'g/kWh') },
    legend: { top: 0, type: 'scroll' },
    grid: { left: 64, right: 24, top: 40, bottom: 48 },
    xAxis: { type: 'value', name: 'Load (% of rating)', nameLocation: 'middle', nameGap: 30, min: 'dataMin', max: 'dataMax', axisLabel: { formatter: '{value} %' } },
    yAxis: { type: 'value', name: 'SFOC (g/kWh)', nameLocation: 'middle', nameGap: 48, scale: true },
    series: group.sets.map((s) => ({
      name: `${s.vesselName} ${s.designation}${s.curveSource === 'shop_test' ? ' (shop test)' : ''}`,
      type: 'line',
      symbol: 'none',
      smooth: true,
      lineStyle: s.curveSource === 'shop_test' ? { type: 'dashed' } : undefined,
      data: s.points.map((p) => [p.loadPct, p.sfocGPerKwh]),
    })),
  };
}

/** Vessels ranked by avoidable fuel (% of modelled actual), highest first, with tonnes in the tooltip. */
export function avoidableRankingOption(b: FleetBenchmark): EChartsOption {
  const ranked = b.vessels.filter((v) => v.avoidablePct !== null).sort((a, c) => (c.avoidablePct ?? 0) - (a.avoidablePct ?? 0));
  return {
    tooltip: {
      trigger: 'axis',
      formatter: (params: unknown) => {
        const p = (Array.isArray(params) ? params[0] : params) as { dataIndex: number };
        const v = ranked[p.dataIndex];
        const t = v.avoidableFuelT;
        return `${v.vesselName}<br/>Avoidable fuel: ${v.avoidablePct?.toFixed(1)} %${t ? `, ${t.value.toFixed(2)} t (${t.lower.toFixed(2)} to ${t.upper.toFixed(2)} t)` : ''}`;
      },
    },
    grid: { left: 140, right: 32, top: 32, bottom: 48 },
    xAxis: { type: 'value', name: 'Avoidable fuel (% of modelled actual)', nameLocation: 'middle', nameGap: 30, axisLabel: { formatter: '{value} %' } },
    // inverse: the first vessel on top, so the axis start (and its title) is at the top.
    yAxis: { type: 'category', inverse: true, data: ranked.map((v) => v.vesselName), name: 'Vessel', nameLocation: 'start' },
    series: [{ name: 'Avoidable fuel (%)', type: 'bar', data: ranked.map((v) => v.avoidablePct) }],
  };
}

/** Monthly plant SFOC (ISO, g/kWh) per vessel, and avoidable fuel (%) on a second axis. */
export function monthlyTrendOption(b: FleetBenchmark): EChartsOption {
  const months = [...new Set(b.monthly.map((m) => m.month))].sort();
  const names = [...new Set(b.monthly.map((m) => m.vesselName))].sort();
  const at = (name: string, month: string) => b.monthly.find((m) => m.vesselName === name && m.month === month);
  return {
    tooltip: { trigger: 'axis' },
    legend: { top: 0, type: 'scroll' },
    grid: { left: 64, right: 64, top: 40, bottom: 48 },
    xAxis: { type: 'category', data: months, name: 'Month', nameLocation: 'middle', nameGap: 30 },
    yAxis: [
      { type: 'value', name: 'Plant SFOC ISO (g/kWh)', nameLocation: 'middle', nameGap: 48, scale: true },
      { type: 'value', name: 'Avoidable fuel (%)', nameLocation: 'middle', nameGap: 40, splitLine: { show: false } },
    ],
    series: names.flatMap((name) => [
      { name: `${name}: SFOC (g/kWh)`, type: 'line' as const, data: months.map((m) => at(name, m)?.plantSfocIsoGPerKwh ?? null), tooltip: { valueFormatter: fixed(1, 'g/kWh') } },
      {
        name: `${name}: avoidable (%)`,
        type: 'line' as const,
        yAxisIndex: 1,
        lineStyle: { type: 'dotted' as const },
        data: months.map((m) => at(name, m)?.avoidablePct ?? null),
        tooltip: { valueFormatter: fixed(1, '%') },
      },
    ]),
  };
}
