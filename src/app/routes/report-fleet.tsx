import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { LoadingState, QueryView } from '../../components/ui/states';
import { fleetReportDownloadUrl, useFleetReport } from '../../features/reports/api/get-fleet-report';
import { latestDate, MonthPicker, useMonthParam } from '../../features/reports/components/period';
import { ReportDownloads, ReportSheet } from '../../features/reports/components/report-sheet';
import { useVessels } from '../../features/vessels/api/get-vessels';
import { RequireCapability } from '../signed-in';

function FleetReportPage({ latestLogDate }: { latestLogDate: string | null | undefined }) {
  const [month, setMonth] = useMonthParam(latestLogDate);
  const report = useFleetReport(month);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Monthly fleet report" description="Every vessel's month: fuel, CO2, cost and what the recommendations would have saved." actions={<Button variant="secondary" onClick={() => window.print()} className="print:hidden">Print (A4)</Button>} />
      <div className="flex flex-wrap items-end justify-between gap-3 print:hidden">
        <MonthPicker id="report-month" month={month} onChange={setMonth} />
        <ReportDownloads csvHref={fleetReportDownloadUrl(month, 'csv')} xlsxHref={fleetReportDownloadUrl(month, 'xlsx')} />
      </div>
      <QueryView query={report} loadingLabel="Building the fleet report…">
        {(r) => <ReportSheet report={r} />}
      </QueryView>
    </div>
  );
}

/** Opens on the month of the fleet's latest logged day. */
function FleetReportOnLatestMonth() {
  const vessels = useVessels();
  if (vessels.isPending) return <LoadingState label="Finding the latest logged month…" />;
  return <FleetReportPage latestLogDate={latestDate((vessels.data ?? []).map((v) => v.lastLogDate))} />;
}

/** The fleet's monthly report, for superintendents, energy officers and administrators. */
export function Component() {
  return (
    <RequireCapability capability="reports:read" title="Monthly fleet report">
      <FleetReportOnLatestMonth />
    </RequireCapability>
  );
}
