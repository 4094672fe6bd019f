import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { CURVE_WINDOW_LABELS, type CurveSetDetail, type CurveSetFit } from '../../../shared/schemas/curves';
import { LazyChart } from '../../components/charts/lazy-chart';
import { Alert } from '../../components/ui/alert';
import { Badge } from '../../components/ui/badge';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, ErrorState, LoadingState, QueryView } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { formatDate, formatHours, formatKw, formatSfoc } from '../../lib/format';
import { useSetCurve } from '../../features/curves/api/get-set-curve';
import { useVesselCurves, type CurveWindowChoice } from '../../features/curves/api/get-vessel-curves';
import { driftOption, setCurveOption, vesselCurvesOption } from '../../features/curves/components/chart-options';
import { VesselDriftBadge } from '../../features/curves/components/drift-badge';
import { AtLoadsTable, CoefficientTable, OutlierTable } from '../../features/curves/components/fit-tables';
import { MethodNotes } from '../../features/curves/components/method-notes';
import { WindowSelector } from '../../features/curves/components/window-selector';
import { useVessel } from '../../features/vessels/api/get-vessel';

function windowText(set: CurveSetFit): string {
  const w = set.window;
  const dates = w.from && w.to ? `${formatDate(w.from)} to ${formatDate(w.to)}` : 'no logs';
  if (w.kind !== 'since_overhaul') return dates;
  return w.overhaul ? `${dates}, after the ${w.overhaul.kind} of ${formatDate(w.overhaul.doneOn)} at ${formatHours(w.overhaul.runningHours)}` : `${dates} (no overhaul recorded: all logs)`;
}

function DriftPanel({ set }: { set: CurveSetDetail }) {
  const d = set.drift;
  if (!d) {
    return <p className="text-small text-hull-600">Drift is judged on the window since the last overhaul; choose that window to see it.</p>;
  }
  const option = driftOption(set);
  return (
    <div className="flex flex-col gap-3">
      {d.alert ? (
        <Alert tone="error">
          <strong>Drift alert:</strong> the latest 500 running hours average {formatSfoc(d.latestSfocGPerKwh)} at {formatKw(d.referenceLoadKw)}, {formatSfoc(d.excessGPerKwh)}{' '}
          above the first 500 h after overhaul ({formatSfoc(d.baselineSfocGPerKwh)}). With {Math.round(d.confidence * 100)} % confidence the excess is at least{' '}
          {formatSfoc(d.excessLowerBoundGPerKwh)}, above the threshold of {formatSfoc(d.thresholdGPerKwh)} (2 % of baseline).
        </Alert>
      ) : d.alertUnavailable ? (
        <Alert tone="info">No drift judgement yet: {d.alertUnavailable}</Alert>
      ) : (
        <Alert tone="success">
          No drift alert: the latest 500 h are {formatSfoc(d.excessGPerKwh)} from the baseline; the {Math.round(d.confidence * 100)} % lower bound{' '}
          {formatSfoc(d.excessLowerBoundGPerKwh)} does not exceed the threshold {formatSfoc(d.thresholdGPerKwh)}.
        </Alert>
      )}
      <p className="figures text-small text-hull-700">
        Slope {d.slopeGPerKwhPer1000h === null ? '–' : `${d.slopeGPerKwhPer1000h.toFixed(2)} g/kWh per 1000 h`} (95 % interval{' '}
        {d.slopeInterval.lower === null ? '–' : d.slopeInterval.lower.toFixed(2)} to {d.slopeInterval.upper === null ? '–' : d.slopeInterval.upper.toFixed(2)} g/kWh per
        1000 h) at the reference load {formatKw(d.referenceLoadKw)} ({d.referenceBasis === 'median' ? 'the set’s median daily load' : '75 % of rating'}), {d.days} days.
      </p>
      {option ? <LazyChart option={option} heightPx={300} label={`SFOC of ${set.designation} at ${Math.round(d.referenceLoadKw)} kW against running hours since overhaul`} /> : null}
    </div>
  );
}

function SetView({ vesselId, gensetId, curveWindow }: { vesselId: string; gensetId: string; curveWindow: CurveWindowChoice }) {
  const detail = useSetCurve(vesselId, gensetId, curveWindow);
  return (
    <QueryView query={detail} loadingLabel="Fitting the set’s curve…">
      {(set) =>
        set.fit ? (
          <div className="flex flex-col gap-6">
            <p className="text-small text-hull-600">
              {CURVE_WINDOW_LABELS[set.window.kind]}: {windowText(set)}. Fitted {set.fittedAt ? formatDate(set.fittedAt) : '–'}
              {set.refitted ? ' (refitted now: the logs changed)' : ''}.
            </p>
            {set.fit.warnings.length ? (
              <Alert tone="info">
                {set.fit.warnings.map((w) => (
                  <span key={w} className="block">
                    {w}
                  </span>
                ))}
              </Alert>
            ) : null}
            <LazyChart
              option={setCurveOption(set)}
              heightPx={380}
              label={`SFOC of ${set.designation} against load: ${set.points.length} daily points, fitted curve with 95 % band, shop test`}
            />
            <p className="text-caption text-hull-500">Points fade with age (oldest faint). Triangles: days down-weighted by the robust fit. Dashed: extrapolated beyond the days’ loads.</p>
            <div className="flex flex-col gap-6">
              <CoefficientTable set={set} fit={set.fit} />
              <AtLoadsTable fit={set.fit} />
            </div>
            <div>
              <h3 className="mb-2 font-semibold text-hull-800">Outliers</h3>
              <OutlierTable fit={set.fit} />
            </div>
            <div>
              <h3 className="mb-2 font-semibold text-hull-800">Drift since overhaul</h3>
              <DriftPanel set={set} />
            </div>
          </div>
        ) : (
          <EmptyState title={`No curve for ${set.designation} in this window`} next={set.reason ?? 'Import the engine-room logs of this set.'} />
        )
      }
    </QueryView>
  );
}

function CurvesPage({ vesselId, vesselName }: { vesselId: string; vesselName: string }) {
  const [curveWindow, setCurveWindow] = useState<CurveWindowChoice>({ kind: 'since_overhaul' });
  const [selected, setSelected] = useState<string | null>(null);
  const curves = useVesselCurves(vesselId, curveWindow);
  const sets = curves.data?.sets ?? [];
  const current = selected ?? sets.find((s) => s.fit)?.gensetId ?? null;

  return (
    <>
      <PageHeader
        title={`Fuel curves: ${vesselName}`}
        description="SFOC per genset fitted from its own engine-room logs, with how far to trust it, and drift since the last overhaul."
        actions={
          <Link to={paths.vessel.href(vesselId)} className="text-small underline">
            Back to the vessel
          </Link>
        }
      />
      <div className="mb-4 flex flex-wrap items-end justify-between gap-4">
        <WindowSelector value={curveWindow} onChange={setCurveWindow} />
        <VesselDriftBadge vesselId={vesselId} />
      </div>
      <div className="mb-6">
        <Alert tone="info">
          Kilowatch advises; the vessel’s power management system, the maker’s limits, class rules, local regulations and the chief engineer decide. A curve
          outside its logged load range (dashed) is an extrapolation.
        </Alert>
      </div>
      <QueryView
        query={curves}
        loadingLabel="Fitting the vessel’s curves…"
        isEmpty={(v) => v.sets.length === 0 || v.sets.every((s) => s.daysLogged === 0)}
        empty={
          <EmptyState
            title={curves.data?.sets.length === 0 ? 'No sets in the register' : 'No logs in this window yet'}
            next={
              curves.data?.sets.length === 0
                ? 'Enter the gensets on the vessel page first.'
                : 'Import the engine-room logs of this vessel (daily running hours, kWh and fuel of each set); the curves are fitted from them.'
            }
          />
        }
      >
        {(v) => (
          <div className="flex flex-col gap-6">
            <Panel title="All sets">
              {v.sets.some((s) => s.fit) ? (
                <LazyChart option={vesselCurvesOption(v.sets)} heightPx={380} label={`Fitted SFOC curves of the sets of ${vesselName} with 95 % bands and shop tests`} />
              ) : (
                <EmptyState title="Too few usable days for any curve" next="Choose a longer window, or review the left-out days in the log table." />
              )}
              <ul className="mt-3 flex flex-wrap gap-2 text-small">
                {v.sets.map((s) => (
                  <li key={s.gensetId} className="figures">
                    <strong>{s.designation}</strong>: {s.fit ? `${s.fit.days} days, SFOC at 75 % ${formatSfoc(s.fit.atLoads.find((l) => l.loadPct === 75)?.sfocGPerKwh)}` : 'no curve'}
                    {s.drift?.alert ? (
                      <>
                        {' '}
                        <Badge tone="bad">drift</Badge>
                      </>
                    ) : null}
                  </li>
                ))}
              </ul>
            </Panel>
            <Panel
              title="One set"
              actions={
                <div className="flex flex-wrap gap-2" role="tablist" aria-label="Set">
                  {v.sets.map((s) => (
                    <Button key={s.gensetId} size="sm" variant={s.gensetId === current ? 'primary' : 'secondary'} role="tab" aria-selected={s.gensetId === current} onClick={() => setSelected(s.gensetId)}>
                      {s.designation}
                    </Button>
                  ))}
                </div>
              }
            >
              {current ? <SetView vesselId={vesselId} gensetId={current} curveWindow={curveWindow} /> : <p className="text-small text-hull-600">Pick a set.</p>}
            </Panel>
          </div>
        )}
      </QueryView>
      <div className="mt-6">
        <MethodNotes />
      </div>
    </>
  );
}

export function Component() {
  const { vesselId = '' } = useParams();
  const vessel = useVessel(vesselId);
  if (vessel.isPending) return <LoadingState label="Loading the vessel…" />;
  if (vessel.isError) {
    return (
      <>
        <PageHeader title="Fuel curves" />
        <ErrorState error={vessel.error} onRetry={() => void vessel.refetch()} />
      </>
    );
  }
  return <CurvesPage vesselId={vesselId} vesselName={vessel.data.name} />;
}
