import { Link } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { paths } from '../../../config/paths';
import { formatSfoc } from '../../../lib/format';
import { useFleetDriftAlerts } from '../api/get-fleet-drift-alerts';
import { useVesselDriftAlerts } from '../api/get-vessel-drift-alerts';

/** Drift alerts of one vessel's sets as a badge linking to its curves page; quiet while loading or on error. */
export function VesselDriftBadge({ vesselId }: { vesselId: string }) {
  const alerts = useVesselDriftAlerts(vesselId);
  if (!alerts.data) return null;
  const flagged = alerts.data.sets.filter((s) => s.alert);
  return (
    <Link to={paths.vesselCurves.href(vesselId)} data-drift-alerts={flagged.length} title="SFOC drift since the last overhaul, 95 % one-sided confidence">
      {flagged.length ? (
        <Badge tone="bad">
          SFOC drift: {flagged.map((s) => `${s.designation} +${formatSfoc(s.excessGPerKwh)}`).join(', ')}
        </Badge>
      ) : (
        <Badge tone="good">No SFOC drift alert</Badge>
      )}
    </Link>
  );
}

/** The fleet's drift alerts: one line per vessel with a set above its post-overhaul baseline. */
export function FleetDriftSummary() {
  const alerts = useFleetDriftAlerts();
  if (alerts.isPending) return <p className="text-small text-hull-400">Checking SFOC drift…</p>;
  if (alerts.isError) return <p className="text-small text-signal-600">SFOC drift alerts could not be loaded.</p>;
  const withAlerts = alerts.data.vessels.filter((v) => v.alertCount > 0);
  if (!withAlerts.length) {
    return (
      <p className="text-small text-hull-600" data-drift-alerts="0">
        <Badge tone="good">No SFOC drift alert</Badge> in the sets with logs since their last overhaul.
      </p>
    );
  }
  return (
    <ul className="flex flex-col gap-1 text-small" data-drift-alerts={alerts.data.alertCount}>
      {withAlerts.map((v) => (
        <li key={v.vesselId}>
          <Badge tone="bad">SFOC drift</Badge>{' '}
          <Link to={paths.vesselCurves.href(v.vesselId)} className="font-semibold underline">
            {v.vesselName}
          </Link>
          :{' '}
          {v.sets
            .filter((s) => s.alert)
            .map((s) => `${s.designation} ${formatSfoc(s.excessGPerKwh)} above its post-overhaul baseline`)
            .join('; ')}
        </li>
      ))}
    </ul>
  );
}
