import { useMutation } from '@tanstack/react-query';
import { previewSchema, type ColumnMapping } from '../../../../shared/schemas/logs';
import { uploadWithProgress } from './upload';

/** POST .../logs/preview: the file and (optionally) the mapping; stores nothing. */
export async function previewUpload({ vesselId, file, mapping, onProgress }: { vesselId: string; file: File; mapping?: ColumnMapping; onProgress?: (f: number) => void }) {
  const form = new FormData();
  form.append('options', JSON.stringify(mapping ? { mapping } : {}));
  form.append('file', file, file.name);
  return previewSchema.parse(await uploadWithProgress(`/api/vessels/${encodeURIComponent(vesselId)}/logs/preview`, form, onProgress));
}

export const usePreviewUpload = () => useMutation({ mutationFn: previewUpload });
