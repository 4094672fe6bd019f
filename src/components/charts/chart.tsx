import ReactEChartsCore from 'echarts-for-react/esm/core';
import type { EChartsOption } from 'echarts';
import { CHART_COLOURS, echarts } from './echarts';

export interface ChartProps {
  option: EChartsOption;
  /** Height in CSS pixels. */
  heightPx?: number;
  /** Text alternative read by screen readers in place of the canvas. */
  label: string;
}

/**
 * One ECharts chart with Kilowatch's colours and font. Do not import this file from a page directly: pages use
 * LazyChart from ./lazy-chart so ECharts loads only on pages that draw a chart.
 */
export default function Chart({ option, heightPx = 320, label }: ChartProps) {
  return (
    <div role="img" aria-label={label}>
      <ReactEChartsCore
        echarts={echarts}
        option={{
          color: [...CHART_COLOURS.series],
          textStyle: { fontFamily: '"Nunito Sans", sans-serif', color: CHART_COLOURS.text },
          ...option,
        }}
        style={{ height: heightPx }}
        notMerge
        lazyUpdate
      />
    </div>
  );
}
