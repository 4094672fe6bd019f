import { useMutation, useQueryClient } from '@tanstack/react-query';
import { workWindowSchema, type WorkWindowInput } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

/** Adds a work window, or changes one when `windowId` is given. */
export const saveWorkWindow = ({ vesselId, windowId, input }: { vesselId: string; windowId?: string; input: WorkWindowInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/work-windows${windowId ? `/${encodeURIComponent(windowId)}` : ''}`, {
    method: windowId ? 'PATCH' : 'POST',
    body: input,
    schema: workWindowSchema,
  });

export function useSaveWorkWindow() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveWorkWindow, onSuccess: () => queryClient.invalidateQueries({ queryKey: overhaulKeys.all }) });
}
