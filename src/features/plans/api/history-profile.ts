import { useMutation } from '@tanstack/react-query';
import { historyProfileSchema, type HistoryProfileInput } from '../../../../shared/schemas/plans';
import { apiRequest } from '../../../lib/api-client';

export const historyProfile = ({ vesselId, input }: { vesselId: string; input: HistoryProfileInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/plans/profile-from-history`, { method: 'POST', body: input, schema: historyProfileSchema });

export const useHistoryProfile = () => useMutation({ mutationFn: historyProfile });
