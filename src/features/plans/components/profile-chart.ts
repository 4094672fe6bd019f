import type { EChartsOption } from 'echarts';
import type { ProfilePeriod } from '../../../../shared/schemas/plans';
import { OPERATING_MODE_LABELS } from '../../../../shared/schemas/recommendations';

/** Step chart of a load profile: plant load (kW) over hours from the plan's start, the mode in the tooltip. */
export function profileOption(periods: readonly ProfilePeriod[]): EChartsOption {
  const points: [number, number, string][] = [];
  let t = 0;
  for (const p of periods) {
    const load = Number.isFinite(p.loadKw) ? p.loadKw : 0;
    const mode = OPERATING_MODE_LABELS[p.mode] ?? p.mode;
    points.push([t, load, mode]);
    t += Number.isFinite(p.durationH) ? p.durationH : 0;
  }
  if (points.length) points.push([t, points[points.length - 1][1], points[points.length - 1][2]]);
  return {
    tooltip: {
      trigger: 'axis',
      formatter: (params) => {
        const first = Array.isArray(params) ? params[0] : params;
        const [h, kw, mode] = first.value as [number, number, string];
        return `${h.toFixed(1)} h: ${Math.round(kw)} kW (${mode})`;
      },
    },
    grid: { left: 64, right: 16, top: 24, bottom: 48 },
    xAxis: { type: 'value', name: 'Hours from plan start (h)', nameLocation: 'middle', nameGap: 30, min: 0 },
    yAxis: { type: 'value', name: 'Plant load (kW)' },
    series: [{ name: 'Load', type: 'line', step: 'end', symbol: 'none', areaStyle: { opacity: 0.15 }, data: points }],
  };
}
