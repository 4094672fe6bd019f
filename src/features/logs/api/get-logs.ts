import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { logListSchema, type LogListQuery } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

const search = (q: LogListQuery) =>
  new URLSearchParams(Object.entries(q).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)])).toString();

export const fetchLogs = (vesselId: string, q: LogListQuery, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/logs?${search(q)}`, { schema: logListSchema, signal });

export const logsQueryOptions = (vesselId: string, q: LogListQuery) =>
  queryOptions({ queryKey: [...logsKeys.all(vesselId), 'list', q] as const, queryFn: ({ signal }) => fetchLogs(vesselId, q, signal), placeholderData: keepPreviousData });

export const useLogs = (vesselId: string, q: LogListQuery) => useQuery(logsQueryOptions(vesselId, q));

/** Where the CSV export of the same filters downloads from. */
export const exportLogsUrl = (vesselId: string, q: Pick<LogListQuery, 'gensetId' | 'from' | 'to'>) =>
  `/api/vessels/${encodeURIComponent(vesselId)}/logs/export.csv?${search(q)}`;

export const templateUrl = (vesselId: string) => `/api/vessels/${encodeURIComponent(vesselId)}/logs/template.csv`;
