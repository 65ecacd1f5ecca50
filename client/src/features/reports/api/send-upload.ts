/**
 * Sends a report's files with XMLHttpRequest so that the page can show upload
 * progress (fetch has no upload progress events). Same contract as the API
 * client: the CSRF token in x-csrf-token, one retry with a fresh token on
 * 403 csrf_failed, every failure an ApiError with the server's message.
 */
import { ApiError, csrfTokenQueryOptions, CSRF_HEADER } from '@client/lib/api';
import { queryClient } from '@client/lib/query-client';

export interface UploadProgress {
  loaded: number;
  total: number;
}

export interface SendOptions {
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

function parseError(xhr: XMLHttpRequest): ApiError {
  try {
    const body = JSON.parse(xhr.responseText) as { error?: { code?: string; message?: string; details?: unknown } };
    if (body.error?.code) return new ApiError(xhr.status, body.error.code, body.error.message || `Request failed (${xhr.status}).`, body.error.details);
  } catch {
    /* not our shape */
  }
  return new ApiError(xhr.status, xhr.status === 401 ? 'unauthenticated' : 'unexpected_response', `The server answered ${xhr.status}.`);
}

function sendOnce<T>(path: string, form: FormData, token: string, options: SendOptions): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.setRequestHeader(CSRF_HEADER, token);
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) options.onProgress?.({ loaded: e.loaded, total: e.total });
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve(JSON.parse(xhr.responseText) as T);
        } catch {
          reject(new ApiError(xhr.status, 'unexpected_response', 'The server answered something that is not JSON.'));
        }
      } else reject(parseError(xhr));
    };
    xhr.onerror = () => reject(new ApiError(0, 'network_error', 'Bondmark could not be reached. Check the connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    options.signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/** POSTs multipart form data with upload progress; resolves with the parsed JSON answer. */
export async function sendWithProgress<T>(path: string, form: FormData, options: SendOptions = {}): Promise<T> {
  const token = (await queryClient.fetchQuery(csrfTokenQueryOptions())).token;
  try {
    return await sendOnce<T>(path, form, token, options);
  } catch (error) {
    if (error instanceof ApiError && error.status === 403 && error.code === 'csrf_failed') {
      queryClient.removeQueries({ queryKey: csrfTokenQueryOptions().queryKey, exact: true });
      const fresh = (await queryClient.fetchQuery(csrfTokenQueryOptions())).token;
      return sendOnce<T>(path, form, fresh, options);
    }
    throw error;
  }
}
