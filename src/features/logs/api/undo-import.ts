import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

export const undoImport = ({ vesselId, importId }: { vesselId: string; importId: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/log-imports/${encodeURIComponent(importId)}/undo`, {
    method: 'POST',
    schema: z.object({ rowsRemoved: z.number(), rowsRestored: z.number() }),
  });

export function useUndoImport(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: undoImport,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: logsKeys.all(vesselId) }), queryClient.invalidateQueries({ queryKey: logsKeys.imports(vesselId) })]),
  });
}
