// Functions here run inside the browser (page.evaluate sends their source). The server tsconfig
// that type-checks tests has no DOM lib, so the little of the DOM they touch is declared locally.
// Keep them free of named inner functions: tsx's keepNames would wrap those in a `__name(...)`
// helper that does not exist in the page.
interface PageFontFace {
  family: string;
  status: string;
}
declare const document: {
  fonts: Iterable<PageFontFace> & { ready: Promise<unknown>; check(font: string): boolean };
  body: object;
};
declare function getComputedStyle(element: object): { fontFamily: string };

export interface FontReport {
  /** @font-face rules for the family the page knows (0 when the stylesheet never applied). */
  declared: number;
  /** Of those, how many finished loading. */
  loaded: number;
  /** `document.fonts.check(...)`; true on its own also when the family is not declared at all. */
  check: boolean;
  /** The body's computed font-family. */
  bodyFont: string;
}

/**
 * What the page did with a web font family, after pending font loads settle.
 * @example const report = await page.evaluate(fontReport, 'IBM Plex Sans');
 */
export async function fontReport(family: string): Promise<FontReport> {
  await document.fonts.ready;
  const faces = [...document.fonts].filter((face) => face.family.replace(/["']/g, '') === family);
  return {
    declared: faces.length,
    loaded: faces.filter((face) => face.status === 'loaded').length,
    check: document.fonts.check(`16px "${family}"`),
    bodyFont: getComputedStyle(document.body).fontFamily,
  };
}

/**
 * Resolves once the page's pending font loads have settled.
 * @example await page.evaluate(fontsSettled);
 */
export async function fontsSettled(): Promise<void> {
  await document.fonts.ready;
}
