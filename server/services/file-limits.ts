import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';
import { columnLetter } from '../../shared/exam-list/header';
import { HttpError } from '../errors';

type Limit = keyof typeof EXAM_FILE_LIMITS;
const MB = 1024 * 1024;

/**
 * A file refused for its size or shape before its rows are checked: 413 when it is too big in
 * bytes (packed or unpacked), 422 when it has too many rows or cells. `details` names the limit
 * and its value, so the client can say it without parsing the message.
 */
export class FileLimitError extends HttpError {
  constructor(status: 413 | 422, limit: Limit, message: string, row?: number) {
    super(status, 'file_limit_exceeded', message, { limit, max: EXAM_FILE_LIMITS[limit], ...(row ? { row } : {}) });
  }

  static rows(): FileLimitError {
    const max = EXAM_FILE_LIMITS.maxRows.toLocaleString('en-US');
    return new FileLimitError(422, 'maxRows', `The file has more than ${max} rows. A day list holds at most ${max} rows, header included; split the file or remove blank lines.`);
  }

  static cells(row: number): FileLimitError {
    return new FileLimitError(422, 'maxCellsPerRow', `Row ${row} has more than ${EXAM_FILE_LIMITS.maxCellsPerRow} cells; a day list has 10 columns. Check the row for stray separators.`, row);
  }

  static cellChars(row: number, column: number): FileLimitError {
    const max = EXAM_FILE_LIMITS.maxCellChars.toLocaleString('en-US');
    return new FileLimitError(422, 'maxCellChars', `Cell ${columnLetter(column)}${row} holds more than ${max} characters, the most a cell may hold.`, row);
  }

  static unpacked(limit: 'maxZipEntries' | 'maxUnpackedEntryBytes' | 'maxUnpackedTotalBytes' | 'maxCompressionRatio'): FileLimitError {
    const text = {
      maxZipEntries: `more than ${EXAM_FILE_LIMITS.maxZipEntries} files inside`,
      maxUnpackedEntryBytes: `a part larger than ${EXAM_FILE_LIMITS.maxUnpackedEntryBytes / MB} MB once unpacked`,
      maxUnpackedTotalBytes: `more than ${EXAM_FILE_LIMITS.maxUnpackedTotalBytes / MB} MB once unpacked`,
      maxCompressionRatio: `a part packed more than ${EXAM_FILE_LIMITS.maxCompressionRatio}:1`,
    }[limit];
    return new FileLimitError(413, limit, `The workbook was refused: it has ${text}, far beyond any day list. Save the day list alone as a new .xlsx or CSV.`);
  }

  static slow(): FileLimitError {
    return new FileLimitError(422, 'maxReadSeconds', `The file could not be read within ${EXAM_FILE_LIMITS.maxReadSeconds} seconds. Save the day list alone as a new .xlsx or CSV and try again.`);
  }

  static memory(): FileLimitError {
    return new FileLimitError(413, 'maxUnpackedTotalBytes', 'The file needs more memory to read than any day list does, so it was refused. Save the day list alone as a new .xlsx or CSV.');
  }
}
