import { useParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { QueryView } from '../../components/ui/states';
import { useGuideline } from '../../features/recommendations/api/get-guideline';
import { GuidelineSheet } from '../../features/recommendations/components/guideline-sheet';

const PRINT_CSS = `@media print { @page { size: A4; margin: 12mm; } body * { visibility: hidden; } .guideline-sheet, .guideline-sheet * { visibility: visible; } .guideline-sheet { position: absolute; left: 0; top: 0; width: 100%; font-size: 9pt; } }`;

/** The vessel's current operating guideline, printable on one A4 page for the engine control room. */
export function Component() {
  const { vesselId = '' } = useParams();
  const guideline = useGuideline(vesselId, null);
  return (
    <div className="space-y-4">
      <style>{PRINT_CSS}</style>
      <PageHeader title="Operating guideline" description="Load bands per mode in which each combination of sets is cheapest." actions={<Button onClick={() => window.print()}>Print (A4)</Button>} />
      <QueryView query={guideline} loadingLabel="Sweeping the load per mode…">
        {(g) => <GuidelineSheet guideline={g} />}
      </QueryView>
    </div>
  );
}
