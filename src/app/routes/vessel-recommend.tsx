import { useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { QueryView } from '../../components/ui/states';
import { usePlantModel } from '../../features/recommendations/api/get-plant-model';
import { SinglePointPanel } from '../../features/recommendations/components/single-point-panel';

/** Which sets to run at one load, how to load them, why, and the saving against equal sharing. */
export function Component() {
  const { vesselId = '' } = useParams();
  const plant = usePlantModel(vesselId);
  return (
    <div className="space-y-4">
      <PageHeader title="Recommend sets for a load" description="Every feasible combination ranked by fuel rate under the mode's operating rules." />
      <QueryView query={plant} loadingLabel="Loading the plant…">
        {(p) => <SinglePointPanel vesselId={vesselId} busSections={p.busSections} />}
      </QueryView>
    </div>
  );
}
