import { useMutation } from '@tanstack/react-query';
import { staggerResultSchema, type StaggerRequest } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';

/** A stagger proposal for a date and gap; nothing is stored. */
export const previewStagger = ({ vesselId, input }: { vesselId: string; input: StaggerRequest }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/overhaul/stagger`, { method: 'POST', body: input, schema: staggerResultSchema });

export const usePreviewStagger = () => useMutation({ mutationFn: previewStagger });
