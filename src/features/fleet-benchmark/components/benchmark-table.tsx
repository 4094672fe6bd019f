import {
  columnFilteringFeature,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_includesString,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  tableFeatures,
  useTable,
  type ColumnDef,
} from '@tanstack/react-table';
import { Table, Td, Th } from '../../../components/ui/table';

const features = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
  filterFns: { includesString: filterFn_includesString },
});
export type BenchmarkFeatures = typeof features;
export type BenchmarkColumn<T extends object> = ColumnDef<BenchmarkFeatures, T>;

interface BenchmarkTableProps<T extends object> {
  caption: string;
  data: T[];
  columns: ReadonlyArray<BenchmarkColumn<T>>;
  /** Column ids shown right-aligned with tabular digits. */
  numeric: readonly string[];
  /** How each column's figure is computed, by column id (header tooltip). */
  how: Record<string, string>;
  /** Column id the text filter applies to (vessel name). */
  filterColumn: string;
  filterLabel: string;
  /** data-row attribute of each body row (e.g. the vessel id). */
  rowKey: (row: T) => string;
  name: string;
}

const arrow = (dir: false | 'asc' | 'desc') => (dir === 'asc' ? ' ▲' : dir === 'desc' ? ' ▼' : '');

/**
 * A client-side sortable and filterable table of benchmark rows: click a header to sort (missing figures last),
 * type in the filter to keep matching rows. Each header carries the method text of its figure as a tooltip.
 */
export function BenchmarkTable<T extends object>({ caption, data, columns, numeric, how, filterColumn, filterLabel, rowKey, name }: BenchmarkTableProps<T>) {
  const table = useTable({ features, columns, data });
  const filter = table.getColumn(filterColumn);
  const rows = table.getRowModel().rows;
  return (
    <div className="flex flex-col gap-2" data-table={name}>
      <label className="flex max-w-sm flex-col gap-1 text-small font-semibold text-hull-800 print:hidden">
        {filterLabel}
        <input
          type="search"
          data-filter={name}
          className="rounded-plate border border-hull-200 bg-white px-3 py-1.5 text-body font-normal"
          value={String(filter?.getFilterValue() ?? '')}
          onChange={(e) => filter?.setFilterValue(e.target.value || undefined)}
        />
      </label>
      <Table caption={caption}>
        <thead>
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                return (
                  <Th
                    key={h.id}
                    numeric={numeric.includes(h.column.id)}
                    title={how[h.column.id]}
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
                  >
                    {h.isPlaceholder ? null : h.column.getCanSort() ? (
                      <button type="button" className="uppercase" onClick={h.column.getToggleSortingHandler()} data-sort={h.column.id}>
                        <table.FlexRender header={h} />
                        {arrow(sorted)}
                      </button>
                    ) : (
                      <table.FlexRender header={h} />
                    )}
                  </Th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <Td colSpan={columns.length} className="text-hull-500">
                No row matches the filter.
              </Td>
            </tr>
          ) : (
            rows.map((r) => (
              <tr key={r.id} data-row={rowKey(r.original)}>
                {r.getAllCells().map((c) => (
                  <Td key={c.id} numeric={numeric.includes(c.column.id)} title={how[c.column.id]} data-col={c.column.id}>
                    <table.FlexRender cell={c} />
                  </Td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </Table>
    </div>
  );
}
