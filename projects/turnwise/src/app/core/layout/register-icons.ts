import { inject } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { DomSanitizer } from '@angular/platform-browser';

/** Icon name (as used in `<mat-icon svgIcon="…">`) → SVG markup. */
export type IconSet = Readonly<Record<string, string>>;

/**
 * Adds icons to Material's (root) icon registry; call in an injection context. Each lazy entry
 * (the shell, the sign-in page, the not-found page) registers what it draws, so the SVG text
 * travels with the code that uses it instead of in the first load. Registering a name again
 * replaces it with the same markup, so repeated calls are harmless.
 * @example constructor() { registerIcons({ login }); }
 */
export function registerIcons(icons: IconSet): void {
  const registry = inject(MatIconRegistry);
  const sanitizer = inject(DomSanitizer);
  for (const [name, markup] of Object.entries(icons)) {
    // Trusted: the markup is our own bundled file, never user input.
    registry.addSvgIconLiteral(name, sanitizer.bypassSecurityTrustHtml(markup));
  }
}
