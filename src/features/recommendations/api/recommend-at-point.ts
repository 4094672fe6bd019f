import { useMutation } from '@tanstack/react-query';
import { singlePointResultSchema, type SinglePointInput } from '../../../../shared/schemas/recommendations';
import { apiRequest } from '../../../lib/api-client';

export const recommendAtPoint = ({ vesselId, input }: { vesselId: string; input: SinglePointInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/recommendations`, { method: 'POST', body: input, schema: singlePointResultSchema });

export const useRecommendAtPoint = () => useMutation({ mutationFn: recommendAtPoint });
