import { useMutation, useQueryClient } from '@tanstack/react-query';
import { errorBodySchema } from '../../../../shared/errors';
import { fuelLotSchema } from '../../../../shared/schemas/logs';
import { ApiError } from '../../../lib/api-client';
import { fuelLotsQueryOptions } from './get-fuel-lots';

/** PUT .../fuel-lots/:lotId/attachment (multipart). */
export async function uploadAttachment({ vesselId, lotId, file }: { vesselId: string; lotId: string; file: File }) {
  const form = new FormData();
  form.append('file', file, file.name);
  const res = await fetch(`/api/vessels/${encodeURIComponent(vesselId)}/fuel-lots/${encodeURIComponent(lotId)}/attachment`, { method: 'PUT', body: form, credentials: 'same-origin' });
  const json: unknown = await res.json().catch(() => undefined);
  if (!res.ok) {
    const e = errorBodySchema.safeParse(json);
    throw e.success ? new ApiError(res.status, e.data.error.code, e.data.error.message, e.data.error.details) : new ApiError(res.status, 'internal', `The server answered ${res.status}.`);
  }
  return fuelLotSchema.parse(json);
}

export function useUploadAttachment(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadAttachment, onSuccess: () => queryClient.invalidateQueries({ queryKey: fuelLotsQueryOptions(vesselId).queryKey }) });
}
