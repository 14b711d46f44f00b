import JSZip from 'jszip';
import { invalid } from '../../errors/app-error.js';

/** An XLSX unpacks to at most this much: a 20 MB upload may not become gigabytes (a zip bomb). */
export const MAX_WORKBOOK_UNPACKED_BYTES = 200 * 1024 * 1024;

interface SizedEntry {
  dir: boolean;
  // JSZip keeps the central directory's sizes on each entry; not in its typings.
  _data?: { uncompressedSize?: number };
}

/**
 * Checks a workbook before it is read: what its central directory says it unpacks to, and that
 * no XML part carries a document type declaration (entity expansion). Refusals are 400s on `file`.
 */
export async function checkWorkbook(buffer: Buffer): Promise<void> {
  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(buffer);
  } catch {
    throw invalid({ file: 'The workbook cannot be opened' }, 'The XLSX file is damaged');
  }
  const entries = Object.values(zip.files) as unknown as Array<SizedEntry & JSZip.JSZipObject>;
  const declared = entries.reduce((total, entry) => total + (entry._data?.uncompressedSize ?? 0), 0);
  if (declared > MAX_WORKBOOK_UNPACKED_BYTES) {
    throw invalid({ file: 'The workbook unpacks to more than 200 MB' }, 'The XLSX file is too large once unpacked');
  }
  for (const entry of entries) {
    if (entry.dir || !/\.(xml|rels)$/i.test(entry.name)) continue;
    const head = await entry.async('string');
    if (/<!DOCTYPE/i.test(head)) throw invalid({ file: `${entry.name} declares a document type` }, 'The XLSX file carries a DTD');
  }
}
