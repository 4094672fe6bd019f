import { useParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { LoadingState, QueryView } from '../../components/ui/states';
import { useVesselReport, vesselReportDownloadUrl } from '../../features/reports/api/get-vessel-report';
import { MonthPicker, useMonthParam } from '../../features/reports/components/period';
import { ReportDownloads, ReportSheet } from '../../features/reports/components/report-sheet';
import { useVessel } from '../../features/vessels/api/get-vessel';

function VesselReportPage({ vesselId, latestLogDate }: { vesselId: string; latestLogDate: string | null | undefined }) {
  const [month, setMonth] = useMonthParam(latestLogDate);
  const report = useVesselReport(vesselId, month);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Monthly report" description="Fuel, CO2 and cost of the month against what the recommendations would have burned." actions={<Button variant="secondary" onClick={() => window.print()} className="print:hidden">Print (A4)</Button>} />
      <div className="flex flex-wrap items-end justify-between gap-3 print:hidden">
        <MonthPicker id="report-month" month={month} onChange={setMonth} />
        <ReportDownloads csvHref={vesselReportDownloadUrl(vesselId, month, 'csv')} xlsxHref={vesselReportDownloadUrl(vesselId, month, 'xlsx')} />
      </div>
      <QueryView query={report} loadingLabel="Building the report…">
        {(r) => <ReportSheet report={r} />}
      </QueryView>
    </div>
  );
}

/** A vessel's monthly report: printable on A4, with CSV and XLSX downloads of the same content; opens on the month of the latest log. */
export function Component() {
  const { vesselId = '' } = useParams();
  const vessel = useVessel(vesselId);
  if (vessel.isPending) return <LoadingState label="Finding the latest logged month…" />;
  return <VesselReportPage vesselId={vesselId} latestLogDate={vessel.data?.lastLogDate} />;
}
