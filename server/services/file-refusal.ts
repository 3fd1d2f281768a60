import { Refusal } from '../errors';

// One `file_refused` code for "this file as a whole cannot be read", told apart by status:
// 415 the wrong kind of file, 422 the right kind with unreadable content.

/** 415: not a kind of file the import reads. */
export function unsupportedFile(message: string): Refusal<'file_refused'> {
  return new Refusal('file_refused', message, undefined, { status: 415 });
}

/** 422: the kind is right but the content cannot be read as a list. */
export function unreadableFile(message: string, extra?: Record<string, unknown>): Refusal<'file_refused'> {
  return new Refusal('file_refused', message, undefined, { status: 422, extra });
}

export function damagedWorkbook(): Refusal<'file_refused'> {
  return unreadableFile('The .xlsx file could not be opened: it may be damaged or not really an Excel workbook. Save it again from Excel and retry.');
}
