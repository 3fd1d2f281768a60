/**
 * How big an uploaded day list may be. A day list holds hundreds of exams, never millions; these
 * bounds keep one upload from freezing or exhausting the server, and each refusal names its limit.
 * The Import screen and the README show the same numbers.
 *
 * @example
 * EXAM_FILE_LIMITS.maxRows; // 2000
 */
export const EXAM_FILE_LIMITS = {
  /** Bytes of the uploaded file itself. */
  maxUploadBytes: 5 * 1024 * 1024,
  /** Lines of a CSV (blank ones too) or rows of the first sheet, header included. */
  maxRows: 2000,
  /** Cells in one row, counting empty ones before the last filled cell. */
  maxCellsPerRow: 50,
  /** Characters in one cell; the longest column (notes) allows 500. */
  maxCellChars: 2000,
  /** Errors listed in a refusal; the count of all of them is given too. */
  maxErrorsListed: 200,
  /** Files inside an .xlsx (a workbook saved by a spreadsheet has a few dozen). */
  maxZipEntries: 500,
  /** Unpacked bytes of any one file inside an .xlsx. */
  maxUnpackedEntryBytes: 25 * 1024 * 1024,
  /** Unpacked bytes of all files inside an .xlsx together. */
  maxUnpackedTotalBytes: 50 * 1024 * 1024,
  /** Unpacked ÷ packed size of one file inside an .xlsx, checked for files over 1 MB unpacked. */
  maxCompressionRatio: 200,
  /** Seconds one file may take to read before it is refused. */
  maxReadSeconds: 15,
} as const;
