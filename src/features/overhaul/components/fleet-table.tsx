import { createColumnHelper } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { FleetOverhaulRow } from '../../../../shared/schemas/overhaul';
import { formatHours } from '../../../lib/format';
import { DataTable, type OverhaulTableFeatures } from './data-table';
import { DueDate, HoursLeft } from './due-cells';

const col = createColumnHelper<OverhaulTableFeatures, FleetOverhaulRow>();

/** Every set of every vessel by due date; the vessel links to its planner (`vesselHref`). */
export function FleetDueTable({ rows, vesselHref }: { rows: FleetOverhaulRow[]; vesselHref: (vesselId: string) => string }) {
  const columns = col.columns([
    col.display({ id: 'due', header: 'Due', cell: (c) => <DueDate item={c.row.original} /> }),
    col.accessor('vesselName', { header: 'Vessel', cell: (c) => <Link className="underline" to={vesselHref(c.row.original.vesselId)}>{c.getValue()}</Link> }),
    col.accessor('designation', { header: 'Set' }),
    col.accessor('kind', { header: 'Maintenance' }),
    col.display({ id: 'left', header: 'Hours left', cell: (c) => <HoursLeft item={c.row.original} /> }),
    col.accessor('usageHPerDay', { header: 'Recent usage', cell: (c) => (c.getValue() === null ? '–' : `${(c.getValue() as number).toFixed(1)}\u00a0h/day`) }),
    col.accessor('intervalHours', { header: 'Interval', cell: (c) => formatHours(c.getValue()) }),
  ]);
  return <DataTable caption="Every set of the fleet by due date" data={rows} columns={columns} numeric={['left', 'usageHPerDay', 'intervalHours']} />;
}
