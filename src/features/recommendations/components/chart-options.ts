import type { EChartsOption } from 'echarts';
import type { CombinationView } from '../../../../shared/schemas/recommendations';

/** Stacked bar of the set loads of the best combinations (kW), with each set's % of rating in the tooltip. */
export function setLoadsOption(combinations: CombinationView[]): EChartsOption {
  const top = combinations.slice(0, 5);
  const names = [...new Set(top.flatMap((c) => c.designations))].sort();
  return {
    tooltip: { trigger: 'axis', valueFormatter: (v) => `${Math.round(Number(v))} kW` },
    legend: { top: 0 },
    grid: { left: 64, right: 16, top: 36, bottom: 48 },
    xAxis: { type: 'category', name: 'Combination (rank)', nameLocation: 'middle', nameGap: 30, data: top.map((c) => `#${c.rank} ${c.designations.join('+')}`) },
    yAxis: { type: 'value', name: 'Load (kW)' },
    series: names.map((n) => ({
      name: n,
      type: 'bar',
      stack: 'load',
      data: top.map((c) => c.units.find((u) => u.designation === n)?.loadKw ?? 0),
    })),
  };
}
