import { tableFeatures, useTable, type ColumnDef } from '@tanstack/react-table';
import { Table, Td, Th } from '../../../components/ui/table';

const features = tableFeatures({});
export type OverhaulTableFeatures = typeof features;
export type OverhaulColumn<T extends object> = ColumnDef<OverhaulTableFeatures, T>;

/** A TanStack table with the house Table look; `numeric` columns right-aligned. */
export function DataTable<T extends object>({ caption, data, columns, numeric = [], rowTone }: { caption: string; data: T[]; columns: ReadonlyArray<OverhaulColumn<T>>; numeric?: string[]; rowTone?: (row: T) => string }) {
  const table = useTable({ features, columns, data });
  return (
    <Table caption={caption}>
      <thead>
        {table.getHeaderGroups().map((hg) => (
          <tr key={hg.id}>
            {hg.headers.map((h) => (
              <Th key={h.id} numeric={numeric.includes(h.column.id)}>
                {h.isPlaceholder ? null : <table.FlexRender header={h} />}
              </Th>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((r) => (
          <tr key={r.id} className={rowTone?.(r.original) ?? ''}>
            {r.getAllCells().map((c) => (
              <Td key={c.id} numeric={numeric.includes(c.column.id)}>
                <table.FlexRender cell={c} />
              </Td>
            ))}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
