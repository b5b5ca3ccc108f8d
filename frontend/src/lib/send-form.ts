import type { z } from 'zod';
import { ApiError, apiErrorFromBody, NETWORK_ERROR_MESSAGE } from './api-client';

export interface BytesSent {
  loaded: number;
  total: number;
}

interface SendFormOptions<S extends z.ZodType> {
  schema: S;
  /** Called as the request body leaves the browser; fetch cannot report this, hence XHR. */
  onProgress?: (sent: BytesSent) => void;
  signal?: AbortSignal;
}

const parseJson = (text: string): unknown => {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
};

/**
 * POSTs multipart form data with the same-origin session cookie and the same error handling
 * as apiRequest. The browser adds the Origin header the server's CSRF check asks for.
 */
export function sendForm<S extends z.ZodType>(path: string, form: FormData, { schema, onProgress, signal }: SendFormOptions<S>): Promise<z.output<S>> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.setRequestHeader('Accept', 'application/json');

    if (onProgress) {
      xhr.upload.onprogress = (e) => {
        if (e.lengthComputable) onProgress({ loaded: e.loaded, total: e.total });
      };
    }
    xhr.onerror = () => reject(new ApiError(0, 'network_error', NETWORK_ERROR_MESSAGE));
    xhr.onabort = () => reject(new DOMException('The upload was stopped.', 'AbortError'));
    xhr.onload = () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status < 200 || xhr.status >= 300) {
        reject(apiErrorFromBody(xhr.status, xhr.statusText, body));
        return;
      }
      const parsed = schema.safeParse(body);
      if (parsed.success) resolve(parsed.data);
      else reject(new ApiError(xhr.status, 'unexpected_response', `The server's answer to POST ${path} did not have the expected shape.`));
    };

    if (signal?.aborted) {
      reject(new DOMException('The upload was stopped.', 'AbortError'));
      return;
    }
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}
