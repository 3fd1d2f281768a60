import yauzl, { type Entry, type ZipFile } from 'yauzl';
import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';
import { damagedWorkbook } from './file-refusal';
import { FileLimitError } from './file-limits';

const RATIO_CHECKED_ABOVE = 1024 * 1024;

/**
 * Checks an .xlsx (a zip) before any spreadsheet code opens it: how many files it holds, and
 * each file's unpacked size and packing ratio, first as its directory declares them and then
 * by unpacking every file and counting, since a crafted zip can declare anything. A zip bomb
 * is refused after at most the allowed bytes have been unpacked.
 *
 * @throws FileLimitError (413) naming the limit that was exceeded.
 * @throws Refusal `file_refused` (422) when the zip cannot be read at all.
 * @example
 * await checkWorkbookZip(buffer); // resolves for an ordinary workbook
 */
export async function checkWorkbookZip(buffer: Buffer): Promise<void> {
  const zip = await open(buffer);
  try {
    const entries = await listEntries(zip);
    let declaredTotal = 0;
    for (const entry of entries) {
      declaredTotal += entry.uncompressedSize;
      checkDeclared(entry, declaredTotal);
    }
    let unpackedTotal = 0;
    for (const entry of entries) unpackedTotal += await unpackedSize(zip, entry, unpackedTotal);
  } finally {
    zip.close();
  }
}

function checkDeclared(entry: Entry, declaredTotal: number): void {
  const { maxUnpackedEntryBytes, maxUnpackedTotalBytes, maxCompressionRatio } = EXAM_FILE_LIMITS;
  if (entry.uncompressedSize > maxUnpackedEntryBytes) throw FileLimitError.unpacked('maxUnpackedEntryBytes');
  if (declaredTotal > maxUnpackedTotalBytes) throw FileLimitError.unpacked('maxUnpackedTotalBytes');
  if (entry.uncompressedSize > RATIO_CHECKED_ABOVE && entry.uncompressedSize > maxCompressionRatio * Math.max(1, entry.compressedSize)) {
    throw FileLimitError.unpacked('maxCompressionRatio');
  }
}

function open(buffer: Buffer): Promise<ZipFile> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(buffer, { lazyEntries: true, validateEntrySizes: true, strictFileNames: false }, (err, zip) => {
      if (err || !zip) reject(damagedWorkbook());
      else resolve(zip);
    });
  });
}

function listEntries(zip: ZipFile): Promise<Entry[]> {
  return new Promise((resolve, reject) => {
    const entries: Entry[] = [];
    zip.on('entry', (entry: Entry) => {
      entries.push(entry);
      if (entries.length > EXAM_FILE_LIMITS.maxZipEntries) reject(FileLimitError.unpacked('maxZipEntries'));
      else zip.readEntry();
    });
    zip.on('end', () => resolve(entries));
    zip.on('error', () => reject(damagedWorkbook()));
    zip.readEntry();
  });
}

/** Unpacks one file, counting bytes, and stops as soon as a limit is passed. */
function unpackedSize(zip: ZipFile, entry: Entry, before: number): Promise<number> {
  if (entry.fileName.endsWith('/')) return Promise.resolve(0);
  return new Promise((resolve, reject) => {
    zip.openReadStream(entry, (err, stream) => {
      if (err || !stream) return reject(damagedWorkbook());
      let bytes = 0;
      stream.on('data', (chunk: Buffer) => {
        bytes += chunk.length;
        const over = bytes > EXAM_FILE_LIMITS.maxUnpackedEntryBytes ? 'maxUnpackedEntryBytes' : before + bytes > EXAM_FILE_LIMITS.maxUnpackedTotalBytes ? 'maxUnpackedTotalBytes' : null;
        if (over) {
          stream.destroy();
          reject(FileLimitError.unpacked(over));
        }
      });
      stream.on('end', () => resolve(bytes));
      // yauzl reports a file that unpacks to more or less than its directory says as an error.
      stream.on('error', () => reject(damagedWorkbook()));
    });
  });
}
