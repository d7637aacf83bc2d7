import type { z } from 'zod';
import { formatDecimal, uploadFieldName } from '@lotwise/shared';
import { ApiError, checkAnswer, isApiError, notifyUnauthenticated, toApiError } from './api-client';

export interface UploadProgress {
  loaded: number;
  total: number;
}

interface UploadOptions<T> {
  method?: 'POST' | 'PUT';
  /** The answer's contract, checked in development and tests (see `checkAnswer`). */
  schema?: z.ZodType<T>;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

/**
 * Sends one file as multipart/form-data in the field the API reads (`file`). It goes through
 * XMLHttpRequest rather than fetch because only XHR reports upload progress in every browser.
 * Errors are the same {@link ApiError}s the JSON client throws.
 */
export function uploadFile<T = unknown>(
  path: string,
  file: File,
  { method = 'POST', schema, onProgress, signal }: UploadOptions<T> = {},
): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const body = new FormData();
    body.append(uploadFieldName, file, file.name);

    xhr.open(method, path);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    if (onProgress) {
      xhr.upload.onprogress = (event) =>
        onProgress({
          loaded: event.loaded,
          total: event.lengthComputable ? event.total : file.size,
        });
    }
    xhr.onerror = () =>
      reject(
        new ApiError(
          0,
          'network_error',
          'Lotwise could not reach its server. Check the connection and try again.',
        ),
      );
    xhr.onabort = () => reject(new DOMException('The upload was stopped.', 'AbortError'));
    xhr.onload = () => {
      void settle(xhr).then(resolve, reject);
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(body);
  });

  async function settle(xhr: XMLHttpRequest): Promise<T> {
    const response = new Response(xhr.status === 204 ? null : xhr.responseText, {
      status: xhr.status,
      statusText: xhr.statusText,
    });
    if (!response.ok) {
      if (response.status === 401) notifyUnauthenticated();
      throw await toApiError(response);
    }
    if (response.status === 204 || xhr.responseText === '') return undefined as T;
    let json: unknown;
    try {
      json = JSON.parse(xhr.responseText);
    } catch (_error) {
      throw new ApiError(
        response.status,
        'bad_response',
        'The server answered with something that is not JSON.',
      );
    }
    return checkAnswer(response.status, json, schema);
  }
}

/** What kinds of file an upload takes, in words for a message. */
export type UploadKind = 'pdf' | 'pdf-or-image' | 'csv';

const kindWords: Record<UploadKind, string> = {
  pdf: 'Only PDF files can be uploaded here.',
  'pdf-or-image': 'Only a PDF, or a scan as PNG or JPEG, can be uploaded here.',
  csv: 'Only CSV text files can be imported: save the sheet from the spreadsheet as CSV first.',
};

/**
 * A sentence for a failed upload. Too large (413) and wrong type (415) get words of their own
 * as well as the server's detail, which names the limit and what the file really is.
 */
export function uploadErrorMessage(error: unknown, kind: UploadKind): string {
  if (!isApiError(error)) return error instanceof Error ? error.message : 'The upload failed.';
  if (error.status === 413) {
    const detail = error.code === 'payload_too_large' ? ` ${error.message}` : '';
    return `The file is too large for the server.${detail || ' Try a smaller file.'}`;
  }
  if (error.status === 415) {
    const detail = error.code === 'unsupported_media_type' ? ` ${error.message}` : '';
    return `${kindWords[kind]}${detail}`;
  }
  return error.message;
}

/** `1.4 MB`, `820 KB`, `12 bytes`. */
export function formatFileSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} ${bytes === 1 ? 'byte' : 'bytes'}`;
  const units = ['KB', 'MB', 'GB'];
  let value = bytes / 1024;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit += 1;
  }
  return `${formatDecimal(value, value < 10 ? 1 : 0)} ${units[unit]}`;
}
