import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { monthlyReportSchema, type ReportFormat } from './report-shape';

const BASE = '/api/fleet/reports/monthly';

/** Address of the fleet's monthly report as a download (CSV or XLSX, the same content as the page). */
export const fleetReportDownloadUrl = (month: string, format: ReportFormat) => `${BASE}.${format}?${new URLSearchParams({ month })}`;

export const fetchFleetReport = (month: string, signal?: AbortSignal) => apiRequest(`${BASE}?${new URLSearchParams({ month })}`, { schema: monthlyReportSchema, signal });

export const fleetReportQueryOptions = (month: string) =>
  queryOptions({
    queryKey: ['reports', 'fleet', month] as const,
    queryFn: ({ signal }) => fetchFleetReport(month, signal),
  });

export const useFleetReport = (month: string) => useQuery(fleetReportQueryOptions(month));
