import { createColumnHelper, tableFeatures, useTable, type ColumnDef } from '@tanstack/react-table';
import type { CurveFitStats, CurveSetFit } from '../../../../shared/schemas/curves';
import { Badge } from '../../../components/ui/badge';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDate, formatKw, formatPct, formatSfoc } from '../../../lib/format';

const sci = (v: number | null, unit: string) => (v === null || !Number.isFinite(v) ? '–' : `${v.toPrecision(4)}\u00a0${unit}`);
const plain = (v: number | null, digits: number) => (v === null || !Number.isFinite(v) ? '–' : v.toFixed(digits));

const features = tableFeatures({});
type Features = typeof features;

/** A TanStack table with the house Table look; `numeric` columns right-aligned. */
function DataTable<T extends object>({ caption, data, columns, numeric }: { caption: string; data: T[]; columns: ReadonlyArray<ColumnDef<Features, T>>; numeric: string[] }) {
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
          <tr key={r.id}>
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

/** Coefficients with standard errors and the fit's statistics. */
export function CoefficientTable({ set, fit }: { set: CurveSetFit; fit: CurveFitStats }) {
  const held = (k: 'a' | 'c') => (fit.activeConstraints.includes(k) ? ' (held at 0 by its bound)' : '');
  const rows: [string, string][] = [
    ['a (no-load fuel rate; fuel rate = a + b·P + c·P², P in kW)', `${sci(fit.coefficients.a, 'kg/h')} ± ${sci(fit.standardErrors.a, 'kg/h')}${held('a')}`],
    ['b (fuel per kWh, linear term)', `${sci(fit.coefficients.b, 'kg/kWh')} ± ${sci(fit.standardErrors.b, 'kg/kWh')}`],
    ['c (curvature, quadratic term)', `${sci(fit.coefficients.c, 'kg/(h·kW²)')} ± ${sci(fit.standardErrors.c, 'kg/(h·kW²)')}${held('c')}`],
    ['R²', plain(fit.rSquared, 4)],
    ['Residual SD (day of average hours)', fit.residualSdKgPerH === null ? '–' : `${fit.residualSdKgPerH.toFixed(2)}\u00a0kg/h`],
    ['Days fitted', `${fit.days} of ${set.daysLogged} logged`],
    [
      'Days left out',
      `${set.daysLeftOut.excluded} excluded, ${set.daysLeftOut.flagged} with an error flag or no fuel, ${set.daysLeftOut.shorePower} on shore power, ${set.daysLeftOut.notRun} not run`,
    ],
    ['Load range covered', `${formatKw(fit.loadRangeKw.min)} to ${formatKw(fit.loadRangeKw.max)} (${formatPct(fit.loadSpanPct)} of rating)`],
    [
      'Shop-test prior',
      fit.priorUsed ? `used, worth ${fit.priorWeightDays.toFixed(1)} days (${formatPct(100 * fit.priorWeightShare)} of the weight)` : 'not needed',
    ],
    ['Robust weighting', fit.robust === 'none' ? 'none' : `${fit.robust}, tuning ${fit.robustTuning ?? '–'}, ${fit.iterations} iterations${fit.converged ? '' : ' (not converged)'}`],
    ['Lowest SFOC', `${formatSfoc(fit.lowestSfoc.sfocGPerKwh)} at ${formatKw(fit.lowestSfoc.loadKw)}${fit.lowestSfoc.extrapolated ? ' (extrapolated)' : ''}`],
  ];
  return (
    <Table caption={`Fit of ${set.designation}`}>
      <tbody>
        {rows.map(([k, v]) => (
          <tr key={k}>
            <Th className="w-1/3 normal-case">{k}</Th>
            <Td className="figures">{v}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

type AtLoad = CurveFitStats['atLoads'][number];
const atLoad = createColumnHelper<Features, AtLoad>();
const atLoadColumns = atLoad.columns([
  atLoad.accessor('loadPct', { header: 'Load', cell: (c) => `${formatPct(c.getValue())} (${formatKw(c.row.original.loadKw)})` }),
  atLoad.accessor('sfocGPerKwh', {
    header: 'SFOC fitted',
    cell: (c) => (
      <>
        {formatSfoc(c.getValue())} {c.row.original.extrapolated ? <Badge tone="accent">extrapolated</Badge> : null}
      </>
    ),
  }),
  atLoad.display({
    id: 'band',
    header: '95 % band',
    cell: (c) => `${formatSfoc(c.row.original.lowerGPerKwh)} to ${formatSfoc(c.row.original.upperGPerKwh)}`,
  }),
  atLoad.accessor('shopSfocGPerKwh', { header: 'Shop test', cell: (c) => formatSfoc(c.getValue()) }),
  atLoad.accessor('offsetFromShopGPerKwh', {
    header: 'Offset from shop test',
    cell: (c) => (c.getValue() === null ? '–' : `${(c.getValue() as number) >= 0 ? '+' : ''}${formatSfoc(c.getValue())}`),
  }),
]);

/** SFOC at 50/75/85/100 % of rating with band and offset from the shop test. */
export function AtLoadsTable({ fit }: { fit: CurveFitStats }) {
  return <DataTable caption="SFOC at reported loads" data={fit.atLoads} columns={atLoadColumns} numeric={['sfocGPerKwh', 'band', 'shopSfocGPerKwh', 'offsetFromShopGPerKwh']} />;
}

type Outlier = CurveFitStats['outliers'][number];
const outlier = createColumnHelper<Features, Outlier>();
const outlierColumns = outlier.columns([
  outlier.accessor('date', { header: 'Day', cell: (c) => formatDate(c.getValue()) }),
  outlier.accessor('loadKw', { header: 'Load', cell: (c) => formatKw(c.getValue()) }),
  outlier.accessor('fuelKgPerH', { header: 'Fuel rate (ISO)', cell: (c) => `${c.getValue().toFixed(1)}\u00a0kg/h` }),
  outlier.accessor('residualKgPerH', { header: 'Residual', cell: (c) => `${c.getValue() >= 0 ? '+' : ''}${c.getValue().toFixed(1)}\u00a0kg/h` }),
  outlier.accessor('standardizedResidual', { header: 'Standardised', cell: (c) => c.getValue().toFixed(1) }),
  outlier.accessor('robustWeight', { header: 'Weight kept', cell: (c) => c.getValue().toFixed(2) }),
]);

/** Days the robust fit down-weighted (weight below 0.5), kept in the fit with their weight. */
export function OutlierTable({ fit }: { fit: CurveFitStats }) {
  if (!fit.outliers.length) return <p className="text-small text-hull-600">No day was down-weighted below half weight.</p>;
  return (
    <DataTable
      caption="Down-weighted days"
      data={fit.outliers}
      columns={outlierColumns}
      numeric={['loadKw', 'fuelKgPerH', 'residualKgPerH', 'standardizedResidual', 'robustWeight']}
    />
  );
}
