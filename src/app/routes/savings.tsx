import { Link, useParams } from 'react-router-dom';
import { SAVINGS_METHOD, type IntervalAmountView, type VesselSavingsReport } from '../../../shared/schemas/savings';
import { LazyChart } from '../../components/charts/lazy-chart';
import { Alert } from '../../components/ui/alert';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { Table, Td, Th } from '../../components/ui/table';
import { formatDate, formatHours, formatKg, formatPct, formatTonnes } from '../../lib/format';
import { paths } from '../../config/paths';
import { PeriodPicker, usePeriodParam } from '../../features/reports/components/period';
import { useVesselSavings } from '../../features/savings/api/get-vessel-savings';
import { useVessel } from '../../features/vessels/api/get-vessel';
import { dailySavingsOption, monthlyFuelOption } from '../../features/savings/components/savings-chart-options';

const withInterval = (a: IntervalAmountView, format: (v: number) => string) => `${format(a.value)} (${format(a.lower)} to ${format(a.upper)})`;
const money = (currency: string) => (v: number) => `${Math.round(v).toLocaleString()} ${currency}`;

function Figure({ label, value, how }: { label: string; value: string; how: string }) {
  return (
    <div className="flex flex-col" title={how}>
      <span className="text-small text-hull-600">{label}</span>
      <span className="figures text-lg font-semibold">{value}</span>
      <span className="text-small text-hull-500 print:hidden">{how}</span>
    </div>
  );
}

function Summary({ r }: { r: VesselSavingsReport }) {
  const p = r.period;
  const level = `${Math.round(r.level * 100)} % interval`;
  return (
    <Panel title={`Period ${formatDate(r.from)} to ${formatDate(r.to)} (${p.days} days costed)`}>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <Figure label={`Avoidable fuel, t (${level})`} value={withInterval(p.avoidableFuelT, (v) => formatTonnes(v))} how={SAVINGS_METHOD.avoidable} />
        <Figure label={`Avoidable CO2, t (${level})`} value={withInterval(p.co2.avoidableT, (v) => formatTonnes(v))} how={SAVINGS_METHOD.co2} />
        <Figure
          label={`Avoidable cost, ${r.currency} (${level})`}
          value={p.cost ? withInterval(p.cost.avoidable, money(p.cost.currency)) : 'no fuel prices set'}
          how={SAVINGS_METHOD.cost}
        />
        <Figure label="Measured fuel" value={formatTonnes(p.measuredFuelT)} how={SAVINGS_METHOD.measured} />
        <Figure label="Residual, measured − modelled" value={`${formatTonnes(p.residualT)} (${formatPct(p.residualPct)})`} how={SAVINGS_METHOD.residual} />
        <Figure label="Avoidable share of modelled actual" value={formatPct(p.avoidablePct)} how={SAVINGS_METHOD.avoidable} />
        <Figure label="Equal vs optimal split, sets run" value={formatTonnes(p.splitSavingActualSetsT)} how={SAVINGS_METHOD.split} />
        <Figure label="Low-load running hours" value={formatHours(p.lowLoadHours)} how={SAVINGS_METHOD.lowLoad} />
        <Figure label="Energy" value={`${p.energyMwh.toFixed(1)} MWh`} how="Σ kWh of the sets that ran, from the logs." />
      </div>
    </Panel>
  );
}

function Adoption({ r }: { r: VesselSavingsReport }) {
  const a = r.adoption;
  return (
    <Panel title="Before and after following the recommendations">
      {a ? (
        <p className="figures" title={SAVINGS_METHOD.adoption}>
          From {formatDate(a.adoptedFrom)} ({a.source === 'chief_engineer' ? 'marked by the chief engineer' : 'days matching the recommendation'}): plant SFOC changed by{' '}
          {a.changeGPerKwh.toFixed(1)} g/kWh at equal load ({Math.round(a.level * 100)} % interval {a.changeLowerGPerKwh.toFixed(1)} to {a.changeUpperGPerKwh.toFixed(1)} g/kWh,{' '}
          {a.changePct.toFixed(1)} %), fuel saved after adoption {formatTonnes(a.fuelSavedAfterT.value)} ({formatTonnes(a.fuelSavedAfterT.lower)} to{' '}
          {formatTonnes(a.fuelSavedAfterT.upper)}); {a.daysBefore} days before, {a.daysAfter} after.
        </p>
      ) : (
        <p className="text-small text-hull-600">{r.adoptionUnavailable}</p>
      )}
    </Panel>
  );
}

function DayTable({ r }: { r: VesselSavingsReport }) {
  return (
    <Table caption="Logged days: actual against recommended, costed with the same curves">
      <thead>
        <tr>
          <Th>Date</Th>
          <Th>Sets run</Th>
          <Th numeric title={SAVINGS_METHOD.measured}>Measured (kg)</Th>
          <Th numeric title={SAVINGS_METHOD.modelledActual}>Modelled actual (kg)</Th>
          <Th numeric title={SAVINGS_METHOD.residual}>Residual (%)</Th>
          <Th title={SAVINGS_METHOD.recommended}>Recommended sets</Th>
          <Th numeric title={SAVINGS_METHOD.avoidable}>Avoidable (kg, interval)</Th>
          <Th numeric title={SAVINGS_METHOD.split}>Split saving (kg)</Th>
          <Th numeric title={SAVINGS_METHOD.lowLoad}>Low-load (h)</Th>
        </tr>
      </thead>
      <tbody>
        {r.days.map((d) => (
          <tr key={d.date}>
            <Td>{formatDate(d.date)}</Td>
            <Td>{d.actualSets.map((s) => `${s.designation} ${s.loadPct.toFixed(0)} %`).join(', ')}</Td>
            <Td numeric>{formatKg(d.measuredFuelKg)}</Td>
            <Td numeric>{formatKg(d.modelledActualFuelKg)}</Td>
            <Td numeric>{formatPct(d.residualPct)}</Td>
            <Td>{d.modes.map((m) => `${m.mode} ${m.hours} h: ${m.feasible ? m.sets.join(' + ') : 'none feasible'}`).join('; ')}</Td>
            <Td numeric>
              {d.avoidableFuelKg === null ? '—' : `${formatKg(d.avoidableFuelKg)} (${formatKg(d.avoidableLowerKg)} to ${formatKg(d.avoidableUpperKg)})`}
            </Td>
            <Td numeric>{formatKg(d.splitSavingActualSetsKg)}</Td>
            <Td numeric>{formatHours(d.lowLoadHours)}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

function SavingsPage({ vesselId, latestLogDate }: { vesselId: string; latestLogDate: string | null | undefined }) {
  const [period, setPeriod] = usePeriodParam(latestLogDate);
  const query = useVesselSavings(vesselId, period);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Savings"
        description="What was burned against what the recommendation would have burned, with an honest interval."
        actions={
          <Link to={paths.vesselReport.href(vesselId, period.from.slice(0, 7))} className="text-small font-semibold underline print:hidden" data-action="open-report">
            Monthly report
          </Link>
        }
      />
      <PeriodPicker idPrefix="savings" period={period} onChange={setPeriod} />
      {query.isPending ? (
        <LoadingState label="Costing the logged days…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => query.refetch()} />
      ) : query.data.days.length === 0 ? (
        <EmptyState title="No costed days in this period" next="Import the engine-room logs and mode hours of these days, or choose another period." />
      ) : (
        <>
          <Alert tone="info">{query.data.caution}</Alert>
          {query.data.warnings.map((w) => (
            <Alert key={w} tone="info">
              {w}
            </Alert>
          ))}
          <Summary r={query.data} />
          <Panel title="Avoidable fuel per day">
            <LazyChart option={dailySavingsOption(query.data)} heightPx={320} label="Avoidable fuel per day in kg with its interval, and the equal-versus-optimal split saving" />
          </Panel>
          <Panel title="Fuel per month">
            <LazyChart option={monthlyFuelOption(query.data)} heightPx={280} label="Measured, modelled-actual and recommended fuel per month in tonnes" />
          </Panel>
          <Adoption r={query.data} />
          <DayTable r={query.data} />
          {query.data.skippedDays.length ? (
            <Panel title="Days left out">
              <ul className="text-small">
                {query.data.skippedDays.map((d) => (
                  <li key={d.date}>
                    {formatDate(d.date)}: {d.reason}
                  </li>
                ))}
              </ul>
            </Panel>
          ) : null}
        </>
      )}
    </div>
  );
}

/** A vessel's savings; opens on the month of its latest logged day. */
export function Component() {
  const { vesselId = '' } = useParams();
  const vessel = useVessel(vesselId);
  if (vessel.isPending) return <LoadingState label="Finding the latest logged month…" />;
  return <SavingsPage vesselId={vesselId} latestLogDate={vessel.data?.lastLogDate} />;
}
