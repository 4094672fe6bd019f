import { Link } from 'react-router-dom';
import type { FleetBenchmark } from '../../../shared/schemas/fleet';
import { LazyChart } from '../../components/charts/lazy-chart';
import { Alert } from '../../components/ui/alert';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, LoadingState, QueryView } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { formatDate, formatKw } from '../../lib/format';
import { useFleetBenchmark } from '../../features/fleet-benchmark/api/get-fleet-benchmark';
import { BenchmarkTable } from '../../features/fleet-benchmark/components/benchmark-table';
import { avoidableRankingOption, monthlyTrendOption, sisterCurvesOption } from '../../features/fleet-benchmark/components/chart-options';
import { howByColumn, SET_NUMERIC, setColumns, VESSEL_NUMERIC, vesselColumns } from '../../features/fleet-benchmark/components/columns';
import { latestDate, PeriodPicker, usePeriodParam } from '../../features/reports/components/period';
import { useVessels } from '../../features/vessels/api/get-vessels';
import { RequireCapability } from '../signed-in';

function Method({ text }: { text: string | undefined }) {
  return text ? <p className="mt-2 text-small text-hull-600">{text}</p> : null;
}

function Benchmark({ b }: { b: FleetBenchmark }) {
  const how = howByColumn(b.method);
  return (
    <>
      <Alert tone="error">{b.caution}</Alert>
      <Panel title={`Vessels, ${formatDate(b.from)} to ${formatDate(b.to)}`}>
        <BenchmarkTable name="vessels" caption="Fleet benchmark per vessel" data={b.vessels} columns={vesselColumns} numeric={VESSEL_NUMERIC} how={how} filterColumn="vessel" filterLabel="Filter by vessel" rowKey={(v) => v.vesselId} />
        <p className="mt-2 text-caption text-hull-500">Hover a header or figure for how it is computed; click a header to sort.</p>
      </Panel>
      <Panel title="Sets">
        <BenchmarkTable name="sets" caption="Fleet benchmark per set" data={b.sets} columns={setColumns} numeric={SET_NUMERIC} how={how} filterColumn="vessel" filterLabel="Filter sets by vessel" rowKey={(s) => s.gensetId} />
      </Panel>
      <Panel title="Ranking of avoidable fuel">
        {b.vessels.some((v) => v.avoidablePct !== null) ? (
          <LazyChart option={avoidableRankingOption(b)} heightPx={Math.max(200, 48 * b.vessels.length)} label="Vessels ranked by avoidable fuel in percent of modelled actual fuel" />
        ) : (
          <p className="text-small text-hull-600">No vessel could be costed in this period.</p>
        )}
        <Method text={b.method.avoidable} />
      </Panel>
      <Panel title="Sister sets: curves of sets of the same rating">
        {b.sisterCurves.length === 0 ? (
          <p className="text-small text-hull-600">No rating is shared by sets on more than one vessel.</p>
        ) : (
          <div className="flex flex-col gap-6">
            {b.sisterCurves.map((g) => (
              <div key={g.ratedKw}>
                <h3 className="text-lead font-semibold">Sets rated {formatKw(g.ratedKw)}</h3>
                <LazyChart option={sisterCurvesOption(g)} heightPx={300} label={`SFOC in g/kWh against load in percent of rating of the ${formatKw(g.ratedKw)} sets`} />
              </div>
            ))}
          </div>
        )}
        <Method text={b.method.sfoc75} />
      </Panel>
      <Panel title="Monthly trend">
        {b.monthly.length === 0 ? (
          <p className="text-small text-hull-600">No month with logs in this period.</p>
        ) : (
          <LazyChart option={monthlyTrendOption(b)} heightPx={340} label="Plant SFOC in g/kWh and avoidable fuel in percent per vessel and month" />
        )}
        <Method text={b.method.plantSfoc} />
      </Panel>
      <Panel title="How the figures are computed">
        <ul className="list-disc pl-5 text-small text-hull-700" data-method>
          {Object.entries(b.method).map(([k, text]) => (
            <li key={k}>{text}</li>
          ))}
        </ul>
      </Panel>
    </>
  );
}

function BenchmarkPage({ latestLogDate }: { latestLogDate: string | null }) {
  const [period, setPeriod] = usePeriodParam(latestLogDate);
  const query = useFleetBenchmark(period);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Fleet benchmark"
        description="Vessels and sets compared over a period: SFOC, load, low-load running, avoidable fuel, drift and running-hour balance."
        actions={
          <Link to={paths.fleetReport.href()} className="text-small font-semibold underline" data-action="open-fleet-report">
            Monthly fleet report
          </Link>
        }
      />
      <PeriodPicker idPrefix="benchmark" period={period} onChange={setPeriod} />
      <QueryView
        query={query}
        loadingLabel="Comparing the fleet…"
        isEmpty={(b) => b.vessels.length === 0}
        empty={<EmptyState title="No vessel to compare" next="Add vessels and import their engine-room logs, or choose another period." />}
      >
        {(b) => <Benchmark b={b} />}
      </QueryView>
    </div>
  );
}

/** Opens on the month of the fleet's latest logged day. */
function BenchmarkOnLatestMonth() {
  const vessels = useVessels();
  if (vessels.isPending) return <LoadingState label="Finding the latest logged month…" />;
  return <BenchmarkPage latestLogDate={latestDate((vessels.data ?? []).map((v) => v.lastLogDate))} />;
}

/** Fleet benchmarking for superintendents, energy officers and administrators. */
export function Component() {
  return (
    <RequireCapability capability="reports:read" title="Fleet benchmark">
      <BenchmarkOnLatestMonth />
    </RequireCapability>
  );
}
