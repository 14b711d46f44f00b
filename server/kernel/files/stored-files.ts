import { fileTypeFromBuffer } from 'file-type';
import { createHash } from 'node:crypto';
import type { Response } from 'express';
import { In, IsNull, type EntityManager } from 'typeorm';
import { StoredFile } from './stored-file.entity.js';
import type { StoredFileView } from '../../contracts/lab.js';
import { hasUnsafeText } from '../../domain/unsafe-text.js';
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
  // Direction overrides too: "invoice\u202Efdp.exe" would display as "invoiceexe.pdf".
  if (!name || name.length > 200 || hasUnsafeText(name) || /[\\/\t\n\r]/.test(name) || name.includes('..') || /^[.\s]/.test(name)) {
    throw invalid({ file: 'The file name is not acceptable (no folders, no control characters, at most 200 characters)' });
  }
}

/** What a person calls each kind of file we accept: never a media type on screen. */
const fileWords: Record<string, string> = {
  'application/pdf': 'a PDF',
  'image/jpeg': 'a JPEG photo',
  'image/png': 'a PNG image',
  'image/webp': 'a WebP image',
  'image/heic': 'a HEIC photo',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': 'an Excel workbook (XLSX)',
  'text/csv': 'a CSV file',
};
const inWords = (allowed: string[]) => {
  const words = [...new Set(allowed.map((type) => fileWords[type] ?? type))];
  return words.length > 1 ? `${words.slice(0, -1).join(', ')} or ${words.at(-1)}` : words[0]!;
};

/** Checks an upload by its content (magic bytes), never by its name or the browser's type. */
export async function checkUpload(upload: Upload | undefined, allowed: string[]): Promise<{ mediaType: string }> {
  if (!upload) throw invalid({ file: 'Attach a file' });
  if (upload.size === 0) throw invalid({ file: 'The file is empty' });
  checkFileName(upload.originalname);
  const detected = await fileTypeFromBuffer(upload.buffer);
  if (!detected || !allowed.includes(detected.mime)) {
    throw new AppError(415, 'unsupported_file', `This file is not ${inWords(allowed)}`, {
      file: `This file is not ${inWords(allowed)}: choose ${inWords(allowed)}`,
    });
  }
  return { mediaType: detected.mime };
}

export type FilePurpose = 'certificate' | 'signed-copy' | 'follow-up-evidence' | 'upkeep-photo';

/** The record a file belongs to; a file has one owner, for good. */
export interface FileOwner {
  entity: string;
  id: string;
}

/**
 * Stores an upload for a site and a purpose. With `owner` it belongs to that record at once;
 * without, it waits to be claimed (`claimStoredFiles`) by one record of the same site.
 */
export async function storeFile(
  manager: EntityManager,
  upload: Upload,
  mediaType: string,
  by: { userId: string; siteId: string; purpose: FilePurpose; owner?: FileOwner },
): Promise<StoredFileView> {
  const sha256 = createHash('sha256').update(upload.buffer).digest('hex');
  // Raw SQL: the content is bytea, written once and never read back through an entity.
  const [row] = await manager.query(
    `INSERT INTO stored_file (sha256, file_name, media_type, size_bytes, content, uploaded_by, site_id, purpose, owner_entity, owner_id)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10) RETURNING id`,
    [
      sha256,
      upload.originalname,
      mediaType,
      upload.size,
      upload.buffer,
      by.userId,
      by.siteId,
      by.purpose,
      by.owner?.entity ?? null,
      by.owner?.id ?? null,
    ],
  );
  return { id: row.id, fileName: upload.originalname, mediaType, sizeBytes: upload.size, sha256 };
}

/**
 * Gives waiting uploads to their record: each must be of the record's site and purpose and not
 * belong to anything yet, or nothing is claimed and `field` gets the error.
 */
export async function claimStoredFiles(
  manager: EntityManager,
  fileIds: string[],
  to: { siteId: string; purpose: FilePurpose; owner: FileOwner; field: string },
): Promise<void> {
  const wanted = [...new Set(fileIds)];
  if (wanted.length === 0) return;
  const claimed = await manager
    .createQueryBuilder()
    .update(StoredFile)
    .set({ ownerEntity: to.owner.entity, ownerId: to.owner.id })
    .where({ id: In(wanted), siteId: to.siteId, purpose: to.purpose, ownerId: IsNull() })
    .execute();
  if (claimed.affected !== wanted.length)
    throw invalid({ [to.field]: 'A file was not found among your uploads for this site; upload it again' });
}

/** Whose a stored file is: its site, its purpose, its owner (none while it waits), who uploaded it. */
export async function findStoredFileOwner(manager: EntityManager, fileId: string) {
  const [row]: Array<{
    site_id: string;
    purpose: FilePurpose;
    owner_entity: string | null;
    owner_id: string | null;
    uploaded_by: string | null;
  }> = await manager.query('SELECT site_id, purpose, owner_entity, owner_id, uploaded_by FROM stored_file WHERE id = $1', [fileId]);
  return row
    ? {
        siteId: row.site_id,
        purpose: row.purpose,
        owner: row.owner_id ? { entity: row.owner_entity!, id: row.owner_id } : null,
        uploadedBy: row.uploaded_by,
      }
    : null;
}

/** Uploads no record claimed within a day (an upkeep photo of a check never saved) are dropped. */
export async function dropUnclaimedUploads(manager: EntityManager): Promise<number> {
  const dropped = await manager
    .createQueryBuilder()
    .delete()
    .from(StoredFile)
    .where({ ownerId: IsNull() })
    .andWhere(`created_at < now() - interval '1 day'`)
    .execute();
  return dropped.affected ?? 0;
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
