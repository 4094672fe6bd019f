// ECharts options of the curves page, built from the API's figures. Only line and scatter series, grid, tooltip,
// legend and mark areas: what src/components/charts/echarts.ts registers.
import type { EChartsOption, LineSeriesOption, ScatterSeriesOption } from 'echarts';
import type { CurveSample, CurveSetDetail, CurveSetFit } from '../../../../shared/schemas/curves';

/** Series colours in the order of the chart palette (tailwind.config.ts), one per set. */
const SET_COLOURS = ['#1d3237', '#c4821a', '#4c747b', '#a32d21', '#2f8a61', '#877c67'];
const OUTLIER_COLOUR = '#a32d21';
const AXIS_NAME = { nameLocation: 'middle', nameGap: 32 } as const;

const fmt = (v: number | null | undefined, digits = 1) => (v === null || v === undefined || !Number.isFinite(v) ? '–' : v.toFixed(digits));

interface TooltipParam {
  seriesName?: string;
  data?: unknown;
  value?: unknown;
}

/** Splits a sampled curve into the part inside the days' load range (solid) and outside it (dashed). */
function curveSeries(name: string, colour: string, samples: CurveSample[], withBand: boolean): (LineSeriesOption | ScatterSeriesOption)[] {
  const item = (s: CurveSample, show: boolean) => ({ value: [s.loadKw, show ? s.sfocGPerKwh : null], lower: s.lowerGPerKwh, upper: s.upperGPerKwh });
  const inside = samples.map((s, i) => item(s, !s.extrapolated || !!(samples[i - 1] && !samples[i - 1].extrapolated) || !!(samples[i + 1] && !samples[i + 1].extrapolated)));
  const outside = samples.map((s, i) => item(s, s.extrapolated || !!samples[i - 1]?.extrapolated || !!samples[i + 1]?.extrapolated));
  const out: (LineSeriesOption | ScatterSeriesOption)[] = [
    { type: 'line', name, data: inside, showSymbol: false, lineStyle: { color: colour, width: 2.5 }, itemStyle: { color: colour }, z: 4 },
    {
      type: 'line',
      name: `${name} (extrapolated)`,
      data: outside,
      showSymbol: false,
      lineStyle: { color: colour, width: 2, type: 'dashed' },
      itemStyle: { color: colour },
      z: 4,
    },
  ];
  if (withBand) {
    const stack = `band-${name}`;
    out.push(
      {
        type: 'line',
        name: `${name} 95 % band`,
        stack,
        data: samples.map((s) => [s.loadKw, s.lowerGPerKwh]),
        showSymbol: false,
        lineStyle: { opacity: 0 },
        tooltip: { show: false },
        silent: true,
      },
      {
        type: 'line',
        name: `${name} 95 % band`,
        stack,
        data: samples.map((s) => [s.loadKw, s.upperGPerKwh !== null && s.lowerGPerKwh !== null ? s.upperGPerKwh - s.lowerGPerKwh : null]),
        showSymbol: false,
        lineStyle: { opacity: 0 },
        areaStyle: { color: colour, opacity: 0.18 },
        tooltip: { show: false },
        silent: true,
      },
    );
  }
  return out;
}

function shopSeries(name: string, colour: string, set: CurveSetFit): LineSeriesOption {
  return {
    type: 'line',
    name,
    data: set.shopTest.map((p) => ({ value: [(p.loadPct * set.ratedKw) / 100, p.sfocGPerKwh], loadPct: p.loadPct })),
    symbol: 'diamond',
    symbolSize: 7,
    lineStyle: { color: colour, width: 1.5, type: 'dotted' },
    itemStyle: { color: colour },
    z: 3,
  };
}

function curveTooltip(params: TooltipParam | TooltipParam[]): string {
  const list = Array.isArray(params) ? params : [params];
  const rows: string[] = [];
  let load: number | null = null;
  for (const p of list) {
    const d = p.data as { value?: [number, number | null]; lower?: number | null; upper?: number | null; date?: string; weight?: number; loadPct?: number } | [number, number];
    const value = Array.isArray(d) ? d : d?.value;
    if (!value || value[1] === null || value[1] === undefined) continue;
    load ??= value[0];
    let text = `${p.seriesName}: ${fmt(value[1])} g/kWh`;
    if (!Array.isArray(d) && d.lower !== undefined) text += ` (95 % band ${fmt(d.lower)}–${fmt(d.upper)} g/kWh)`;
    if (!Array.isArray(d) && d.date) text += ` on ${d.date}${d.weight !== undefined ? `, robust weight ${fmt(d.weight, 2)}` : ''}`;
    rows.push(text);
  }
  return rows.length ? [`Load ${fmt(load, 0)} kW`, ...rows].join('<br/>') : '';
}

function axes(maxKw: number): Pick<EChartsOption, 'xAxis' | 'yAxis' | 'grid'> {
  return {
    grid: { left: 64, right: 24, top: 48, bottom: 56 },
    xAxis: { type: 'value', name: 'Load (kW)', ...AXIS_NAME, min: 0, max: Math.ceil(maxKw / 100) * 100 },
    yAxis: { type: 'value', name: 'SFOC (g/kWh)', ...AXIS_NAME, nameGap: 44, scale: true },
  };
}

/** All sets of a vessel on one chart: fitted curve (dashed where extrapolated), 95 % band, shop test. */
export function vesselCurvesOption(sets: CurveSetFit[]): EChartsOption {
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [];
  sets.forEach((set, i) => {
    const colour = SET_COLOURS[i % SET_COLOURS.length];
    // from 25 % of rating: below it the band of a thinly logged set would set the scale for all
    if (set.fit) series.push(...curveSeries(set.designation, colour, set.fit.samples.filter((x) => x.loadKw >= 0.25 * set.ratedKw - 1e-9), true));
    if (set.shopTest.length) series.push(shopSeries(`${set.designation} shop test`, colour, set));
  });
  return {
    ...axes(Math.max(...sets.map((s) => s.ratedKw), 100)),
    legend: { top: 0, type: 'scroll', data: sets.flatMap((s) => [s.designation, ...(s.shopTest.length ? [`${s.designation} shop test`] : [])]) },
    tooltip: { trigger: 'axis', formatter: curveTooltip as never },
    series,
  };
}

/** One set: daily points shaded by age, outliers marked, fitted curve with band, shop test. */
export function setCurveOption(set: CurveSetDetail): EChartsOption {
  const colour = SET_COLOURS[0];
  const n = set.points.length;
  const pointItem = (p: CurveSetDetail['points'][number], i: number) => ({
    value: [p.loadKw, p.sfocGPerKwh],
    date: p.date,
    weight: p.robustWeight,
    // oldest day faint, newest day solid
    itemStyle: { opacity: n > 1 ? 0.2 + (0.8 * i) / (n - 1) : 1 },
  });
  const inliers = set.points.map((p, i) => (p.robustWeight >= 0.5 ? pointItem(p, i) : null)).filter((x) => x !== null);
  const outliers = set.points.map((p, i) => (p.robustWeight < 0.5 ? pointItem(p, i) : null)).filter((x) => x !== null);
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [
    { type: 'scatter', name: 'Daily points', data: inliers, symbolSize: 6, itemStyle: { color: '#4c747b' }, z: 2 },
    { type: 'scatter', name: 'Outliers (down-weighted)', data: outliers, symbol: 'triangle', symbolSize: 9, itemStyle: { color: OUTLIER_COLOUR }, z: 5 },
  ];
  if (set.fit) series.push(...curveSeries('Fitted curve', colour, set.fit.samples, true));
  if (set.shopTest.length) series.push(shopSeries('Shop test', '#c4821a', set));
  return {
    ...axes(set.ratedKw),
    legend: { top: 0, data: ['Daily points', 'Outliers (down-weighted)', 'Fitted curve', 'Fitted curve (extrapolated)', 'Shop test'] },
    tooltip: { trigger: 'item', formatter: curveTooltip as never },
    series,
  };
}

/** SFOC at the reference load against running hours since overhaul, with the fitted slope and the alert level. */
export function driftOption(set: CurveSetDetail): EChartsOption | null {
  const d = set.drift;
  if (!d || d.daySfoc.length === 0) return null;
  const maxH = Math.max(...d.daySfoc.map((p) => p.hoursSinceOverhaul));
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [
    {
      type: 'scatter',
      name: 'Day at reference load',
      data: d.daySfoc.map((p) => ({ value: [p.hoursSinceOverhaul, p.sfocGPerKwh], date: p.date })),
      symbolSize: 5,
      itemStyle: { color: '#4c747b', opacity: 0.7 },
      markArea: {
        silent: true,
        itemStyle: { color: 'rgba(196,130,26,0.08)' },
        data: [
          [{ name: 'Baseline', xAxis: 0 }, { xAxis: Math.min(500, maxH) }],
          [{ name: 'Latest 500 h', xAxis: Math.max(0, maxH - 500) }, { xAxis: maxH }],
        ],
      },
    },
  ];
  if (d.slopeGPerKwhPer1000h !== null && d.interceptGPerKwh !== null) {
    const at = (h: number) => d.interceptGPerKwh! + (d.slopeGPerKwhPer1000h! * h) / 1000;
    series.push({ type: 'line', name: 'Fitted drift', data: [[0, at(0)], [maxH, at(maxH)]], showSymbol: false, lineStyle: { color: '#1d3237', width: 2 } });
  }
  if (d.baselineSfocGPerKwh !== null && d.thresholdGPerKwh !== null) {
    const level = d.baselineSfocGPerKwh + d.thresholdGPerKwh;
    series.push({
      type: 'line',
      name: 'Alert level (baseline + threshold)',
      data: [[0, level], [maxH, level]],
      showSymbol: false,
      lineStyle: { color: OUTLIER_COLOUR, width: 1.5, type: 'dashed' },
    });
  }
  return {
    grid: { left: 64, right: 24, top: 48, bottom: 56 },
    xAxis: { type: 'value', name: 'Running hours since overhaul (h)', ...AXIS_NAME },
    yAxis: { type: 'value', name: `SFOC at ${fmt(d.referenceLoadKw, 0)} kW (g/kWh)`, ...AXIS_NAME, nameGap: 44, scale: true },
    legend: { top: 0 },
    tooltip: {
      trigger: 'item',
      formatter: ((p: TooltipParam) => {
        const d2 = p.data as { value?: [number, number]; date?: string } | [number, number];
        const v = Array.isArray(d2) ? d2 : d2.value;
        if (!v) return '';
        const date = !Array.isArray(d2) && d2.date ? ` (${d2.date})` : '';
        return `${p.seriesName}${date}<br/>${fmt(v[0], 0)} h since overhaul: ${fmt(v[1])} g/kWh`;
      }) as never,
    },
    series,
  };
}
