import { errorBodySchema } from '../../../../shared/errors';
import { ApiError } from '../../../lib/api-client';

/**
 * A multipart upload with progress (XMLHttpRequest reports upload progress; fetch does not). Resolves with the JSON
 * answer; rejects with an ApiError carrying the server's error shape.
 */
export function uploadWithProgress(url: string, form: FormData, onProgress?: (fraction: number) => void): Promise<unknown> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The Kilowatch server cannot be reached. Check the connection and try again.'));
    xhr.onload = () => {
      let json: unknown;
      try {
        json = JSON.parse(xhr.responseText);
      } catch {
        json = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(json);
      const parsed = errorBodySchema.safeParse(json);
      if (parsed.success) reject(new ApiError(xhr.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.details));
      else reject(new ApiError(xhr.status, xhr.status >= 500 ? 'internal' : 'bad_request', `The server answered ${xhr.status}.`));
    };
    xhr.send(form);
  });
}
