import { createColumnHelper } from '@tanstack/react-table';
import type { MaintenanceDue, SetOverhaul, WorkWindow } from '../../../../shared/schemas/overhaul';
import { formatDate, formatHours } from '../../../lib/format';
import { DataTable, type OverhaulTableFeatures } from './data-table';
import { DueDate, HoursLeft } from './due-cells';

type Row = MaintenanceDue & { designation: string; asOfDate: string | null; usage: SetOverhaul['usage'] };
const col = createColumnHelper<OverhaulTableFeatures, Row>();

function usageText(u: SetOverhaul['usage']): string {
  const rate = u.hPerDay === null ? (u.note ?? 'no rate') : `${u.hPerDay.toFixed(1)}\u00a0h/day`;
  return u.source === 'plan' ? `plan ${formatHours(u.planHours)}, then ${rate}` : rate;
}

/** Every maintenance kind of every set of one vessel: hours since, interval, hours left, forecast due date. */
export function DueTable({ sets, windows }: { sets: SetOverhaul[]; windows: WorkWindow[] }) {
  const place = new Map(windows.map((w) => [w.id, w.place]));
  const rows: Row[] = sets.flatMap((s) => s.items.map((i) => ({ ...i, designation: s.designation, asOfDate: s.asOfDate, usage: s.usage })));
  const columns = col.columns([
    col.accessor('designation', { header: 'Set' }),
    col.accessor('kind', { header: 'Maintenance' }),
    col.accessor('hoursSince', { header: 'Hours since', cell: (c) => formatHours(c.getValue()) }),
    col.display({
      id: 'interval',
      header: 'Interval',
      cell: (c) => `${formatHours(c.row.original.intervalHours)}${c.row.original.intervalMonths ? ` or ${c.row.original.intervalMonths} months` : ''}`,
    }),
    col.display({ id: 'left', header: 'Hours left', cell: (c) => <HoursLeft item={c.row.original} /> }),
    col.accessor('dueAtMeterReadingH', { header: 'Due at meter', cell: (c) => formatHours(c.getValue()) }),
    col.display({ id: 'usage', header: 'Usage', cell: (c) => usageText(c.row.original.usage) }),
    col.display({ id: 'due', header: 'Due', cell: (c) => <DueDate item={c.row.original} windowPlace={c.row.original.windowId ? place.get(c.row.original.windowId) : null} /> }),
    col.display({
      id: 'last',
      header: 'Counted from',
      cell: (c) => (c.row.original.basis === 'recorded' ? formatDate(c.row.original.lastDoneOn) : 'new (no work recorded)'),
    }),
  ]);
  return <DataTable caption="Hours and due dates per set" data={rows} columns={columns} numeric={['hoursSince', 'left', 'dueAtMeterReadingH']} />;
}
