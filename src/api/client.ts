import type { input, ZodType } from 'zod';
import type { ErrorBody } from '@contracts/errors.js';

/** An error answered by the API, in its one shape. `fields` maps input names to messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
    /** The whole answer, for routes that send more than the error (an import's row report). */
    readonly body: unknown = null,
  ) {
    super(message);
  }
}

type UnauthenticatedHandler = () => void;
let onUnauthenticated: UnauthenticatedHandler = () => {};

/** The router registers where a 401 sends the user; every call shares it. */
export function setUnauthenticatedHandler(handler: UnauthenticatedHandler): void {
  onUnauthenticated = handler;
}

export type Query = Record<string, string | number | boolean | undefined | null>;

function withQuery(path: string, query?: Query): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `${path}?${text}` : path;
}

export async function request<T>(method: string, path: string, options: { query?: Query; body?: unknown } = {}): Promise<T> {
  const response = await fetch(withQuery(`/api${path}`, options.query), {
    method,
    credentials: 'same-origin',
    headers:
      options.body === undefined ? { accept: 'application/json' } : { 'content-type': 'application/json', accept: 'application/json' },
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
  });
  if (response.status === 204) return undefined as T;
  const payload = await response.json().catch(() => null);
  if (!response.ok) {
    const error = (payload as ErrorBody | null)?.error;
    // A 401 that asks for a fresh authentication (before a signature) is the page's to handle.
    if (response.status === 401 && error?.code === 'unauthenticated') onUnauthenticated();
    throw new ApiError(response.status, error?.code ?? 'http_error', error?.message ?? response.statusText, error?.fields, payload);
  }
  return payload as T;
}

export type Parts = Record<string, string | Blob | null | undefined>;

/**
 * Sends a multipart form (files and fields) through XHR, which reports upload progress where
 * fetch cannot; answers and errors take the same shape as every other call.
 */
export function upload<T>(method: 'POST' | 'PUT', path: string, parts: Parts, onProgress?: (fraction: number) => void): Promise<T> {
  const form = new FormData();
  for (const [name, value] of Object.entries(parts)) if (value !== null && value !== undefined) form.set(name, value);
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(method, `/api${path}`);
    xhr.responseType = 'json';
    xhr.upload.onprogress = (event) => event.lengthComputable && onProgress?.(event.loaded / event.total);
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) return resolve(xhr.response as T);
      if (xhr.status === 401) onUnauthenticated();
      const error = (xhr.response as ErrorBody | null)?.error;
      reject(new ApiError(xhr.status, error?.code ?? 'http_error', error?.message ?? xhr.statusText, error?.fields, xhr.response));
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload did not reach the server'));
    xhr.send(form);
  });
}

export const api = {
  get: <T>(path: string, query?: Query) => request<T>('GET', path, { query }),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, { body }),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, { body }),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, { body }),
  delete: <T>(path: string) => request<T>('DELETE', path),
};

/** What a request body may carry: the contract schema's input (fields with defaults may be left out). */
export type RequestOf<S extends ZodType> = input<S>;
