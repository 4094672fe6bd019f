// The one place ECharts modules are registered. Import only what Kilowatch's charts draw, so the chart chunk stays
// small; a chart that needs another series type or component registers it here.
import { BarChart, LineChart, ScatterChart } from 'echarts/charts';
import { DataZoomComponent, GridComponent, LegendComponent, MarkAreaComponent, TooltipComponent } from 'echarts/components';
import * as echarts from 'echarts/core';
import { CanvasRenderer } from 'echarts/renderers';

echarts.use([BarChart, LineChart, ScatterChart, GridComponent, TooltipComponent, LegendComponent, DataZoomComponent, MarkAreaComponent, CanvasRenderer]);

export { echarts };

/** Colours of the palette in tailwind.config.ts, for series (charts cannot read Tailwind classes). */
export const CHART_COLOURS = {
  series: ['#1d3237', '#c4821a', '#4c747b', '#a32d21', '#2f8a61', '#877c67'],
  axis: '#6f959b',
  grid: '#e2ebec',
  text: '#28444a',
} as const;
