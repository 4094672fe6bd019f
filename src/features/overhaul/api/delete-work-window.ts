import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

export const deleteWorkWindow = ({ vesselId, windowId }: { vesselId: string; windowId: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/work-windows/${encodeURIComponent(windowId)}`, { method: 'DELETE' });

export function useDeleteWorkWindow() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteWorkWindow, onSuccess: () => queryClient.invalidateQueries({ queryKey: overhaulKeys.all }) });
}
