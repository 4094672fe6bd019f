import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { monthlyReportSchema, type ReportFormat } from './report-shape';

const base = (vesselId: string) => `/api/vessels/${encodeURIComponent(vesselId)}/reports/monthly`;

/** Address of the vessel's monthly report as a download (CSV or XLSX, the same content as the page). */
export const vesselReportDownloadUrl = (vesselId: string, month: string, format: ReportFormat) => `${base(vesselId)}.${format}?${new URLSearchParams({ month })}`;

export const fetchVesselReport = (vesselId: string, month: string, signal?: AbortSignal) =>
  apiRequest(`${base(vesselId)}?${new URLSearchParams({ month })}`, { schema: monthlyReportSchema, signal });

export const vesselReportQueryOptions = (vesselId: string, month: string) =>
  queryOptions({
    queryKey: ['reports', 'vessel', vesselId, month] as const,
    queryFn: ({ signal }) => fetchVesselReport(vesselId, month, signal),
  });

export const useVesselReport = (vesselId: string, month: string) => useQuery(vesselReportQueryOptions(vesselId, month));
