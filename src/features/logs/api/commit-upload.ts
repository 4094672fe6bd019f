import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { CommitOptions } from '../../../../shared/schemas/logs';
import { logsKeys } from './keys';
import { uploadWithProgress } from './upload';

const commitResultSchema = z.object({
  importId: z.uuid(),
  rowsNew: z.number(),
  rowsChanged: z.number(),
  rowsUnchanged: z.number(),
  rowsRejected: z.number(),
  rowsChangedSkipped: z.number(),
  modeDaysWritten: z.number(),
});
export type CommitResult = z.infer<typeof commitResultSchema>;

/** POST .../logs/commit: the same file again with the confirmed mapping, the overwrite choice and the preview's hash. */
export async function commitUpload({ vesselId, file, options, onProgress }: { vesselId: string; file: File; options: CommitOptions; onProgress?: (f: number) => void }) {
  const form = new FormData();
  form.append('options', JSON.stringify(options));
  form.append('file', file, file.name);
  return commitResultSchema.parse(await uploadWithProgress(`/api/vessels/${encodeURIComponent(vesselId)}/logs/commit`, form, onProgress));
}

export function useCommitUpload(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: commitUpload,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: logsKeys.all(vesselId) }), queryClient.invalidateQueries({ queryKey: logsKeys.imports(vesselId) })]),
  });
}
