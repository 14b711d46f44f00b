import type { CertificateDetail, CertificateSummary, CreateLabCertificateRequest, ResultRow } from '@contracts/lab.js';
import type { ImportReport } from '@contracts/lab-import.js';
import type { Page } from '@contracts/paging.js';
import { ApiError, api, type Query } from './client';

/** Sends multipart with progress (fetch has no upload progress); errors keep the API's shape. */
function upload<T>(method: 'POST' | 'PUT', path: string, form: FormData, onProgress?: (fraction: number) => void): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(method, `/api${path}`);
    xhr.responseType = 'json';
    xhr.upload.onprogress = (event) => event.lengthComputable && onProgress?.(event.loaded / event.total);
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) return resolve(xhr.response as T);
      const error = xhr.response?.error;
      const failure = new ApiError(xhr.status, error?.code ?? 'http_error', error?.message ?? xhr.statusText, error?.fields);
      (failure as ApiError & { body?: unknown }).body = xhr.response;
      reject(failure);
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload did not reach the server'));
    xhr.send(form);
  });
}

export const labApi = {
  certificates: (query: Query) => api.get<Page<CertificateSummary>>('/lab-certificates', query),
  results: (query: Query) => api.get<Page<ResultRow>>('/lab-certificates/results', query),
  certificate: (id: string) => api.get<CertificateDetail>(`/lab-certificates/${id}`),
  fileUrl: (id: string, download = false) => `/api/lab-certificates/${id}/file${download ? '?download=1' : ''}`,
  create: (body: CreateLabCertificateRequest, file: File | null, onProgress?: (fraction: number) => void) => {
    const form = new FormData();
    form.set('certificate', JSON.stringify(body));
    if (file) form.set('file', file);
    return upload<CertificateDetail>('POST', '/lab-certificates', form, onProgress);
  },
  templateUrl: (siteId: string, format: 'xlsx' | 'csv') => `/api/lab-certificates/import/template?siteId=${siteId}&format=${format}`,
  importFile: (siteId: string, file: File, commit: boolean, onProgress?: (fraction: number) => void) => {
    const form = new FormData();
    form.set('siteId', siteId);
    form.set('commit', String(commit));
    form.set('file', file);
    return upload<ImportReport>('POST', '/lab-certificates/import', form, onProgress);
  },
};
