import type { Response } from 'express';

/** A file made on request (a template, a report), sent as an attachment. */
export interface Download {
  bytes: Buffer | Uint8Array;
  mediaType: string;
  fileName: string;
}

export function sendDownload(res: Response, download: Download): void {
  res.setHeader('Content-Type', download.mediaType);
  res.setHeader('Content-Disposition', `attachment; filename="${download.fileName}"`);
  res.end(download.bytes);
}
