/** Paper sizes the day sheet prints on. */
export const PAPERS = ['A4', 'Letter'] as const;
export type Paper = (typeof PAPERS)[number];

export const ORIENTATIONS = ['portrait', 'landscape'] as const;
export type Orientation = (typeof ORIENTATIONS)[number];

/**
 * The `@page` rule for a paper and orientation. The margins leave room for a printer's
 * unprintable edge on both A4 and Letter.
 *
 * @example
 * pageRule('A4', 'landscape'); // '@page { size: A4 landscape; margin: 12mm; }'
 */
export function pageRule(paper: Paper, orientation: Orientation): string {
  return `@page { size: ${paper} ${orientation}; margin: 12mm; }`;
}

/**
 * The paper a browser most likely has in its tray: Letter where it is the usual size (the US,
 * Canada, Mexico and a few more), A4 elsewhere. A guess from the language tag; the sheet lets
 * people choose.
 */
export function usualPaper(language: string | undefined): Paper {
  const region = (language ?? '').split('-')[1]?.toUpperCase() ?? '';
  return ['US', 'CA', 'MX', 'PH', 'CL', 'CO', 'VE', 'GT', 'CR', 'PA', 'PR'].includes(region) ? 'Letter' : 'A4';
}
