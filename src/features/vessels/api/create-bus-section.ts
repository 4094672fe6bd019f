import { useMutation, useQueryClient } from '@tanstack/react-query';
import { busSectionSchema } from '../../../../shared/schemas/vessels';
import { apiRequest } from '../../../lib/api-client';
import { vesselQueryOptions } from './get-vessel';

export const createBusSection = ({ vesselId, name }: { vesselId: string; name: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/bus-sections`, { method: 'POST', body: { name }, schema: busSectionSchema });

export function useCreateBusSection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBusSection,
    onSuccess: (_section, { vesselId }) => queryClient.invalidateQueries({ queryKey: vesselQueryOptions(vesselId).queryKey }),
  });
}
