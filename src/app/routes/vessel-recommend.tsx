import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { QueryView } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { useOperatingRules } from '../../features/recommendations/api/get-operating-rules';
import { usePlantModel } from '../../features/recommendations/api/get-plant-model';
import { SinglePointPanel } from '../../features/recommendations/components/single-point-panel';

/** Which sets to run at one load, how to load them, why, and the saving against equal sharing. */
export function Component() {
  const { vesselId = '' } = useParams();
  const plant = usePlantModel(vesselId);
  const rules = useOperatingRules(vesselId);
  return (
    <div className="space-y-4">
      <PageHeader
        title="Recommend sets for a load"
        description="Every feasible combination ranked by fuel rate under the mode's operating rules."
        actions={
          <>
            <Link to={paths.vesselGuideline.href(vesselId)} className="text-small font-semibold underline" data-action="open-guideline">
              Guideline
            </Link>
            <Link to={paths.vesselRules.href(vesselId)} className="text-small font-semibold underline" data-action="open-rules">
              Operating rules and set status
            </Link>
          </>
        }
      />
      <QueryView query={plant} loadingLabel="Loading the plant…">
        {(p) => (
          <QueryView query={rules} loadingLabel="Loading the operating rules…">
            {(r) => <SinglePointPanel vesselId={vesselId} busSections={p.busSections} openTieModes={r.rules.filter((x) => !x.busTieClosed).map((x) => x.mode)} />}
          </QueryView>
        )}
      </QueryView>
    </div>
  );
}
