import type {
  CertificateDetail,
  CertificateSummary,
  CreateLabCertificateRequest,
  ResultRow,
  UpdateLabCertificateRequest,
} from '@contracts/lab.js';
import type { ImportReport } from '@contracts/lab-import.js';
import type { Page } from '@contracts/paging.js';
import { api, upload, type Query, type RequestOf } from './client';

export const labApi = {
  certificates: (query: Query) => api.get<Page<CertificateSummary>>('/lab-certificates', query),
  results: (query: Query) => api.get<Page<ResultRow>>('/lab-certificates/results', query),
  certificate: (id: string) => api.get<CertificateDetail>(`/lab-certificates/${id}`),
  fileUrl: (id: string, download = false) => `/api/lab-certificates/${id}/file${download ? '?download=1' : ''}`,
  create: (body: CreateLabCertificateRequest, file: File | null, onProgress?: (fraction: number) => void) =>
    upload<CertificateDetail>('POST', '/lab-certificates', { certificate: JSON.stringify(body), file }, onProgress),
  update: (id: string, body: RequestOf<typeof UpdateLabCertificateRequest>) => api.put<CertificateDetail>(`/lab-certificates/${id}`, body),
  attachFile: (id: string, file: File, onProgress?: (fraction: number) => void) =>
    upload<CertificateDetail>('PUT', `/lab-certificates/${id}/file`, { file }, onProgress),
  templateUrl: (siteId: string, format: 'xlsx' | 'csv') => `/api/lab-certificates/import/template?siteId=${siteId}&format=${format}`,
  importFile: (siteId: string, file: File, commit: boolean, onProgress?: (fraction: number) => void, runId?: string) =>
    upload<ImportReport>('POST', '/lab-certificates/import', { siteId, commit: String(commit), runId, file }, onProgress),
};
