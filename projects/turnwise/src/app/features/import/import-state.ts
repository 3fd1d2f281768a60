import type { ImportRefusal, ImportResult } from '@shared/api/import';

/** Where the Import screen is, from choosing a file to the list being replaced. */
export type ImportState =
  | { step: 'choose' }
  | { step: 'uploading'; purpose: 'preview' | 'import'; percent: number | null }
  /** `redone`: the commit found the day changed since the last preview, so this one replaced it. */
  | { step: 'preview'; result: ImportResult; redone?: boolean }
  | { step: 'refused'; refusal: ImportRefusal }
  | { step: 'failed'; purpose: 'preview' | 'import'; message: string }
  | { step: 'imported'; result: ImportResult };
