import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { useState } from 'react';
import { LOG_FLAG_CODES, type LogFlagCode, type LogListQuery, type LogRow } from '../../../../shared/schemas/logs';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import { QueryView } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDate, formatHours, formatKg, formatKw, formatPct, formatSfoc } from '../../../lib/format';
import { exportLogsUrl, useLogs } from '../api/get-logs';

const features = tableFeatures({});
const col = createColumnHelper<typeof features, LogRow>();
const kwh = (v: number | null) => (v === null ? '–' : `${v.toLocaleString('en-GB', { maximumFractionDigits: 0 })}\u00a0kWh`);

/** Columns the server can sort by (the rest are shown only). */
const SORTABLE: Record<string, NonNullable<LogListQuery['sort']>> = {
  logDate: 'logDate',
  designation: 'genset',
  hoursRun: 'hoursRun',
  kwh: 'kwh',
  avgLoadKw: 'avgLoadKw',
  avgLoadPct: 'avgLoadPct',
  fuelKgAt15: 'fuelKgAt15',
  fuelKgIso: 'fuelKgIso',
  sfocObservedGPerKwh: 'sfocObservedGPerKwh',
  sfocIsoGPerKwh: 'sfocIsoGPerKwh',
  co2Kg: 'co2Kg',
};
const NUMERIC = ['hoursRun', 'kwh', 'avgLoadKw', 'avgLoadPct', 'fuelKgAt15', 'fuelKgIso', 'sfocObservedGPerKwh', 'sfocIsoGPerKwh', 'co2Kg'];

interface LogTableProps {
  vesselId: string;
  sets: { id: string; designation: string }[];
  mayEdit: boolean;
  onEdit: (row: LogRow) => void;
  onExclude: (row: LogRow) => void;
  onDelete: (row: LogRow) => void;
  onRecordReplacement: (row: LogRow) => void;
}

/** The vessel's log with server-side paging, sorting and filters; derived figures carry their units. */
/** Plain words for the flag filter; the code stays beside it, as on the rows' badges. */
const FLAG_FILTER_LABELS: Record<Exclude<LogFlagCode, 'MISSING_DAY'>, string> = {
  HOURS_OVER_24: 'Hours run longer than the day',
  HOURS_NEGATIVE: 'Negative hours run',
  METER_NEGATIVE_DELTA: 'Meter reading went backwards',
  METER_PREVIOUS_MISSING: "No previous day's meter reading",
  METER_REPLACEMENT_INCONSISTENT: 'Meter replacement does not add up',
  KWH_OVER_RATED: 'Energy above the rating × hours',
  SFOC_OUT_OF_BAND: 'SFOC outside the plausible band',
  LOW_LOAD: 'Average load below the minimum load',
  FUEL_WITHOUT_HOURS: 'Fuel logged with no hours run',
  DUPLICATE_DATE: 'Same day logged twice',
  FUEL_LOT_ASSUMED: 'No fuel lot logged, one assumed',
  FUEL_LOT_MISSING: 'No fuel lot registered for the day',
  FUEL_NOT_LOGGED: 'Set ran, no fuel logged',
};

type Query = { page: number; pageSize: number; sort: NonNullable<LogListQuery['sort']>; dir: 'asc' | 'desc'; gensetId?: string; from?: string; to?: string; flag?: LogListQuery['flag'] };

export function LogTable({ vesselId, sets, mayEdit, onEdit, onExclude, onDelete, onRecordReplacement }: LogTableProps) {
  const [q, setQ] = useState<Query>({ page: 1, pageSize: 50, sort: 'logDate', dir: 'desc' });
  const logs = useLogs(vesselId, q);
  const set = (patch: Partial<Query>) => setQ((old) => ({ ...old, page: 1, ...patch }));
  const columns = col.columns([
    col.accessor('logDate', { header: 'Date', cell: (c) => <span className="whitespace-nowrap">{formatDate(c.getValue())}</span> }),
    col.accessor('designation', { header: 'Set' }),
    col.accessor((r) => r.derived.hoursRun, { id: 'hoursRun', header: 'Hours run', cell: (c) => formatHours(c.getValue()) }),
    col.accessor((r) => r.derived.kwh, { id: 'kwh', header: 'Energy', cell: (c) => kwh(c.getValue()) }),
    col.accessor((r) => r.derived.avgLoadKw, { id: 'avgLoadKw', header: 'Avg load', cell: (c) => formatKw(c.getValue()) }),
    col.accessor((r) => r.derived.avgLoadPct, { id: 'avgLoadPct', header: 'Load of rating', cell: (c) => formatPct(c.getValue()) }),
    col.accessor((r) => r.derived.fuelKgAt15, { id: 'fuelKgAt15', header: 'Fuel at 15 °C', cell: (c) => formatKg(c.getValue()) }),
    col.accessor((r) => r.derived.fuelKgIso, { id: 'fuelKgIso', header: 'Fuel, ISO LCV', cell: (c) => formatKg(c.getValue()) }),
    col.accessor((r) => r.derived.sfocObservedGPerKwh, { id: 'sfocObservedGPerKwh', header: 'SFOC observed', cell: (c) => formatSfoc(c.getValue()) }),
    col.accessor((r) => r.derived.sfocIsoGPerKwh, { id: 'sfocIsoGPerKwh', header: 'SFOC ISO', cell: (c) => formatSfoc(c.getValue()) }),
    col.accessor((r) => r.derived.co2Kg, { id: 'co2Kg', header: 'CO₂', cell: (c) => formatKg(c.getValue()) }),
    col.display({
      id: 'flags',
      header: 'Flags',
      cell: (c) => (
        <div className="flex flex-wrap gap-1">
          {c.row.original.excludedFromFit ? <Badge tone="neutral">excluded: {c.row.original.excludeReason}</Badge> : null}
          {c.row.original.flags.map((f) => (
            <span key={`${f.code}-${f.field}`} title={f.message}>
              <Badge tone={f.severity === 'error' ? 'bad' : 'accent'}>{f.code}</Badge>
            </span>
          ))}
        </div>
      ),
    }),
    col.display({
      id: 'actions',
      header: '',
      cell: (c) =>
        mayEdit ? (
          <div className="flex gap-2">
            <Button size="sm" variant="secondary" onClick={() => onEdit(c.row.original)}>Edit</Button>
            <Button size="sm" variant="secondary" onClick={() => onExclude(c.row.original)}>{c.row.original.excludedFromFit ? 'Include' : 'Exclude'}</Button>
            {c.row.original.flags.some((f) => f.code === 'METER_NEGATIVE_DELTA') ? (
              <Button size="sm" variant="secondary" onClick={() => onRecordReplacement(c.row.original)}>Record meter change</Button>
            ) : null}
            <Button size="sm" variant="secondary" onClick={() => onDelete(c.row.original)}>Delete</Button>
          </div>
        ) : null,
    }),
  ]);
  const table = useTable({ features, columns, data: logs.data?.rows ?? [] });
  const pages = logs.data ? Math.max(1, Math.ceil(logs.data.total / logs.data.pageSize)) : 1;
  const sortBy = (id: string) => {
    const key = SORTABLE[id];
    if (!key) return;
    setQ((old) => ({ ...old, page: 1, sort: key, dir: old.sort === key && old.dir === 'desc' ? 'asc' : 'desc' }));
  };
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Set" htmlFor="f-set">
          <Select id="f-set" value={q.gensetId ?? ''} onChange={(e) => set({ gensetId: e.target.value || undefined })}>
            <option value="">All sets</option>
            {sets.map((s) => (
              <option key={s.id} value={s.id}>{s.designation}</option>
            ))}
          </Select>
        </Field>
        <Field label="From" htmlFor="f-from">
          <Input id="f-from" type="date" value={q.from ?? ''} onChange={(e) => set({ from: e.target.value || undefined })} />
        </Field>
        <Field label="To" htmlFor="f-to">
          <Input id="f-to" type="date" value={q.to ?? ''} onChange={(e) => set({ to: e.target.value || undefined })} />
        </Field>
        <Field label="Flag" htmlFor="f-flag">
          <Select id="f-flag" value={q.flag ?? ''} onChange={(e) => set({ flag: (e.target.value || undefined) as LogListQuery['flag'] })}>
            <option value="">Any</option>
            {LOG_FLAG_CODES.filter((c) => c !== 'MISSING_DAY').map((c) => (
              <option key={c} value={c}>{FLAG_FILTER_LABELS[c]} ({c})</option>
            ))}
          </Select>
        </Field>
        <a className="text-small font-semibold underline" href={exportLogsUrl(vesselId, { gensetId: q.gensetId, from: q.from, to: q.to })}>
          Export CSV
        </a>
      </div>
      <QueryView query={logs} loadingLabel="Loading the log…">
        {(data) =>
          data.rows.length === 0 ? (
            <p className="text-small text-hull-600">No logged days match these filters. Import a CSV or enter a day by hand.</p>
          ) : (
            <>
              {data.missingDays.length ? (
                <p className="text-small text-hull-600">
                  {data.missingDays.length} missing day(s) between logged days (MISSING_DAY), e.g. {data.missingDays.slice(0, 3).map((m) => `${m.designation} ${m.date}`).join(', ')}.
                </p>
              ) : null}
              <Table caption="Daily genset log with derived figures">
                <thead>
                  {table.getHeaderGroups().map((hg) => (
                    <tr key={hg.id}>
                      {hg.headers.map((h) => (
                        <Th key={h.id} numeric={NUMERIC.includes(h.column.id)} aria-sort={SORTABLE[h.column.id] === q.sort ? (q.dir === 'asc' ? 'ascending' : 'descending') : undefined}>
                          {SORTABLE[h.column.id] ? (
                            <button type="button" className="uppercase" onClick={() => sortBy(h.column.id)}>
                              <table.FlexRender header={h} />
                              {SORTABLE[h.column.id] === q.sort ? (q.dir === 'asc' ? ' ▲' : ' ▼') : ''}
                            </button>
                          ) : (
                            <table.FlexRender header={h} />
                          )}
                        </Th>
                      ))}
                    </tr>
                  ))}
                </thead>
                <tbody>
                  {table.getRowModel().rows.map((r) => (
                    <tr key={r.id}>
                      {r.getAllCells().map((c) => (
                        <Td key={c.id} numeric={NUMERIC.includes(c.column.id)}>
                          <table.FlexRender cell={c} />
                        </Td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </Table>
              <div className="flex items-center gap-3 text-small">
                <Button size="sm" variant="secondary" disabled={q.page <= 1} onClick={() => setQ((o) => ({ ...o, page: o.page - 1 }))}>Previous</Button>
                <span>
                  Page {data.page} of {pages} · {data.total} {data.total === 1 ? 'set-day' : 'set-days'} (one row per set and day)
                </span>
                <Button size="sm" variant="secondary" disabled={q.page >= pages} onClick={() => setQ((o) => ({ ...o, page: o.page + 1 }))}>Next</Button>
              </div>
            </>
          )
        }
      </QueryView>
    </div>
  );
}
