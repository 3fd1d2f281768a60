import type { ImportRefusal, ImportResult } from '@shared/api/import';

/** Where the Import screen is, from choosing a file to the list being replaced. */
export type ImportState =
  | { step: 'choose' }
  | { step: 'uploading'; purpose: 'preview' | 'import'; percent: number | null }
  | { step: 'preview'; result: ImportResult }
  | { step: 'refused'; refusal: ImportRefusal }
  | { step: 'failed'; purpose: 'preview' | 'import'; message: string }
  | { step: 'imported'; result: ImportResult };
