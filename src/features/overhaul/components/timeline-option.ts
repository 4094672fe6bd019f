import type { EChartsOption } from 'echarts';
import { WORK_WINDOW_LABELS, type SetOverhaul, type WorkWindow } from '../../../../shared/schemas/overhaul';

const DAY_MS = 86_400_000;
const toMs = (date: string) => Date.parse(`${date}T00:00:00Z`);

/**
 * Timeline of one vessel: a row per set, a point per maintenance kind at its forecast due date, the work windows
 * shaded across all rows (port calls light, dry docks darker). Time axis in dates, tooltips with hours left.
 */
export function timelineOption(sets: SetOverhaul[], windows: WorkWindow[]): EChartsOption {
  const names = sets.map((s) => s.designation);
  const kinds = [...new Set(sets.flatMap((s) => s.items.map((i) => i.kind)))];
  const dues = sets.flatMap((s) => s.items.filter((i) => i.dueDate).map((i) => toMs(i.dueDate as string)));
  const today = sets.map((s) => s.asOfDate).filter((d): d is string => !!d).sort().at(-1);
  const start = today ? toMs(today) : Math.min(...dues, Date.now());
  const end = Math.max(start + 90 * DAY_MS, ...dues.map((d) => d + 14 * DAY_MS), ...windows.map((w) => toMs(w.endsOn) + 7 * DAY_MS));
  const shade = (kind: WorkWindow['kind']) => (kind === 'dry_dock' ? 'rgba(196, 130, 26, 0.30)' : 'rgba(76, 116, 123, 0.18)');
  return {
    grid: { left: 70, right: 24, top: 48, bottom: 70 },
    legend: { top: 0 },
    tooltip: {
      trigger: 'item',
      formatter: (p: unknown) => {
        // A shaded work window: its kind and place (narrow windows carry no label of their own).
        const item = p as { componentType?: string; name?: string };
        if (item.componentType === 'markArea') return item.name ?? '';
        const v = (p as { data: { value: [number, string]; hoursLeft: number; kind: string; governedBy: string | null } }).data;
        const date = new Date(v.value[0]).toISOString().slice(0, 10);
        return `${v.value[1]} ${v.kind}<br/>due ${date}${v.governedBy ? ` (by ${v.governedBy})` : ''}<br/>${Math.round(v.hoursLeft)} h left`;
      },
    },
    xAxis: { type: 'time', name: 'Forecast due date', nameLocation: 'middle', nameGap: 30, min: start, max: end },
    yAxis: { type: 'category', data: names, name: 'Set', inverse: true },
    dataZoom: [{ type: 'slider', xAxisIndex: 0, bottom: 8, height: 18 }],
    series: [
      ...kinds.map((kind, k) => ({
        name: kind,
        type: 'scatter' as const,
        symbolSize: 14,
        symbol: ['circle', 'diamond', 'triangle', 'rect', 'pin'][k % 5],
        data: sets.flatMap((s) =>
          s.items
            .filter((i) => i.kind === kind && i.dueDate)
            .map((i) => ({ value: [toMs(i.dueDate as string), s.designation] as [number, string], hoursLeft: i.hoursLeft, kind, governedBy: i.governedBy })),
        ),
        ...(k === 0
          ? {
              markArea: {
                silent: false,
                label: { show: true, position: 'insideTop' as const, fontSize: 10 },
                // Port calls of a few days are too narrow for a label: theirs shows on hover; dry docks keep theirs.
                data: windows.map((w) => [
                  {
                    name: `${WORK_WINDOW_LABELS[w.kind]} ${w.place}`,
                    xAxis: toMs(w.startsOn),
                    itemStyle: { color: shade(w.kind) },
                    ...(toMs(w.endsOn) - toMs(w.startsOn) < 7 * DAY_MS ? { label: { show: false } } : {}),
                  },
                  { xAxis: toMs(w.endsOn) + DAY_MS },
                ]) as never,
              },
            }
          : {}),
      })),
    ],
  };
}
