import { API_ROOT } from './client.js';
import { ApiError } from './api-error.js';
import type { CorpusCreated } from './types.js';

/**
 * Sends a corpus file as multipart form data, reporting upload progress (fetch cannot, and a
 * 200 MB file deserves a moving bar). Aborting the signal stops the upload; the server keeps
 * nothing of a request that did not finish.
 * @param form fields `file`, `name`, `textField`, `idField`
 * @param onProgress called with the fraction of bytes sent
 * @param signal stops the upload
 */
export function uploadCorpus(form: FormData, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<CorpusCreated> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `${API_ROOT}/corpora`);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.addEventListener('progress', (e) => {
      if (e.lengthComputable && e.total > 0) onProgress(e.loaded / e.total);
    });
    xhr.addEventListener('load', () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        // Fall through to a status-only error.
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        resolve(body as CorpusCreated);
        return;
      }
      const e = (body as { error?: { code?: string; message?: string; details?: Record<string, unknown> } } | null)?.error;
      if (e && typeof e.code === 'string') reject(new ApiError(xhr.status, e.code, e.message ?? '', e.details ?? {}));
      else reject(new ApiError(xhr.status, xhr.status >= 500 ? 'internal' : 'bad_request', `The server answered ${xhr.status}.`));
    });
    xhr.addEventListener('error', () => reject(new ApiError(0, 'network', '')));
    xhr.addEventListener('abort', () => reject(new DOMException('Upload stopped', 'AbortError')));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}
