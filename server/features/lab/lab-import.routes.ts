import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { LabCertificatesService } from './lab-certificates.service.js';

/** Spreadsheet import of lab results: template, dry run, commit. */
export function labImportRoutes(_dataSource: DataSource, _service: LabCertificatesService): Router {
  return Router();
}
