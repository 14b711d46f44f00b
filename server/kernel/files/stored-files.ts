import { fileTypeFromBuffer } from 'file-type';
import { createHash } from 'node:crypto';
import type { Response } from 'express';
import type { EntityManager } from 'typeorm';
import type { StoredFileView } from '../../contracts/lab.js';
import { AppError, invalid } from '../../errors/app-error.js';

export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

export interface Upload {
  originalname: string;
  buffer: Buffer;
  size: number;
}

/**
 * A file name is kept only for the download's Content-Disposition; a name that tries to climb
 * folders, carries control characters or is absurdly long is refused rather than cleaned.
 */
function checkFileName(name: string): void {
  // eslint-disable-next-line no-control-regex -- refusing control characters is the point
  if (!name || name.length > 200 || /[\\/\x00-\x1f\x7f]/.test(name) || name.includes('..') || /^[.\s]/.test(name)) {
    throw invalid({ file: 'The file name is not acceptable (no folders, no control characters, at most 200 characters)' });
  }
}

/** Checks an upload by its content (magic bytes), never by its name or the browser's type. */
export async function checkUpload(upload: Upload | undefined, allowed: string[]): Promise<{ mediaType: string }> {
  if (!upload) throw invalid({ file: 'Attach a file' });
  if (upload.size === 0) throw invalid({ file: 'The file is empty' });
  checkFileName(upload.originalname);
  const detected = await fileTypeFromBuffer(upload.buffer);
  if (!detected || !allowed.includes(detected.mime)) {
    throw new AppError(415, 'unsupported_file', `The file is not ${allowed.join(' or ')}`, { file: `Expected ${allowed.join(' or ')}` });
  }
  return { mediaType: detected.mime };
}

export async function storeFile(manager: EntityManager, upload: Upload, mediaType: string, userId: string): Promise<StoredFileView> {
  const sha256 = createHash('sha256').update(upload.buffer).digest('hex');
  const [row] = await manager.query(
    `INSERT INTO stored_file (sha256, file_name, media_type, size_bytes, content, uploaded_by)
     VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
    [sha256, upload.originalname, mediaType, upload.size, upload.buffer, userId],
  );
  return { id: row.id, fileName: upload.originalname, mediaType, sizeBytes: upload.size, sha256 };
}

/** Sends a stored file back byte for byte; `inline` lets the browser show a PDF in place. */
export async function sendStoredFile(manager: EntityManager, fileId: string, res: Response, inline: boolean): Promise<boolean> {
  const [row] = await manager.query('SELECT file_name, media_type, sha256, content FROM stored_file WHERE id = $1', [fileId]);
  if (!row) return false;
  const asciiName = row.file_name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  res.setHeader('Content-Type', row.media_type);
  res.setHeader(
    'Content-Disposition',
    `${inline ? 'inline' : 'attachment'}; filename="${asciiName}"; filename*=UTF-8''${encodeURIComponent(row.file_name)}`,
  );
  res.setHeader('X-Content-SHA256', row.sha256);
  res.setHeader('Cache-Control', 'private, max-age=3600');
  res.end(row.content);
  return true;
}
