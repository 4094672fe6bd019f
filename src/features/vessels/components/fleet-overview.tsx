import { Link } from 'react-router-dom';
import type { VesselSummary } from '../../../../shared/schemas/vessels';
import { paths } from '../../../config/paths';
import { formatDate, formatKw } from '../../../lib/format';
import { useVesselDetails } from '../api/get-vessel';

/** One plate per vessel: its sets, installed power and the date of the last engine-room log. */
export function FleetOverview({ vessels }: { vessels: VesselSummary[] }) {
  const details = useVesselDetails(vessels.map((v) => v.id));
  return (
    <ul className="grid gap-gutter md:grid-cols-2" data-list="fleet">
      {vessels.map((vessel, i) => {
        const detail = details[i];
        return (
          <li key={vessel.id} data-vessel={vessel.id} className="rounded-plate border border-deck-200 bg-white shadow-plate">
            <div className="flex items-start justify-between gap-3 border-b border-deck-100 px-gutter py-3">
              <div>
                <Link to={paths.vessel.href(vessel.id)} className="text-lead font-bold text-hull-900 hover:underline">
                  {vessel.name}
                </Link>
                <p className="text-caption text-hull-500">
                  IMO {vessel.imoNumber} · {vessel.vesselType} · {vessel.fuelGrades.join(', ')}
                </p>
              </div>
              <div className="figures text-right">
                <p className="text-lead font-semibold text-hull-900">{formatKw(vessel.installedKw)}</p>
                <p className="text-caption text-hull-500">installed in {vessel.gensetCount} {vessel.gensetCount === 1 ? 'set' : 'sets'}</p>
              </div>
            </div>
            <div className="px-gutter py-3 text-small">
              {vessel.gensetCount === 0 ? (
                <p className="text-hull-600">
                  No sets yet. <Link to={paths.vessel.href(vessel.id)} className="underline">Open the vessel</Link> to enter its genset register.
                </p>
              ) : detail?.data ? (
                <ul className="flex flex-wrap gap-2">
                  {detail.data.gensets.map((g) => (
                    <li key={g.id} className="figures rounded-plate bg-hull-50 px-2 py-1 text-hull-800">
                      <span className="font-semibold">{g.designation}</span> {formatKw(g.ratedKw)}
                      {g.duty === 'emergency' ? <span className="text-brass-700"> (emergency)</span> : null}
                    </li>
                  ))}
                </ul>
              ) : detail?.isError ? (
                <p className="text-signal-600">The sets of this vessel could not be loaded.</p>
              ) : (
                <p className="text-hull-400">Loading sets…</p>
              )}
              <p className="mt-2 text-caption text-hull-500">
                Last log: {vessel.lastLogDate ? formatDate(vessel.lastLogDate) : 'none yet'}
              </p>
            </div>
          </li>
        );
      })}
    </ul>
  );
}
