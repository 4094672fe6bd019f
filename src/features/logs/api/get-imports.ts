import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { logImportSchema } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

export const importsQueryOptions = (vesselId: string) =>
  queryOptions({
    queryKey: logsKeys.imports(vesselId),
    queryFn: ({ signal }) => apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/log-imports`, { schema: z.array(logImportSchema), signal }),
  });

export const useImports = (vesselId: string) => useQuery(importsQueryOptions(vesselId));
