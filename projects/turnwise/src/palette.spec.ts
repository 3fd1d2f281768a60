import { differenceCiede2000, filterDeficiencyDeuter, filterDeficiencyProt, filterDeficiencyTrit, parse, wcagContrast, type Color } from 'culori';

import { ROOM_STATES, type RoomState } from '@shared/api/board';
import { VERDICTS, type Verdict } from '@shared/turnover/model';

import { ROOM_STATE_DISPLAY } from './app/shared/ui/room-state-chip';
import { VERDICT_DISPLAY } from './app/shared/ui/verdict-chip';

// The client's specs have no Node types; jest still runs them in Node, so read the stylesheet here.
declare const __dirname: string;
const fs = jest.requireActual<{ readFileSync(path: string, encoding: 'utf8'): string }>('node:fs');
const path = jest.requireActual<{ join(...parts: string[]): string }>('node:path');

/** The palette as the build reads it: every `--tw-…: #rrggbb` in _palette.scss. */
function readPalette(): Map<string, string> {
  const text = fs.readFileSync(path.join(__dirname, '_palette.scss'), 'utf8');
  return new Map([...text.matchAll(/--(tw-[a-z-]+):\s*(#[0-9a-f]{6})\s*;/gi)].map((m) => [m[1], m[2].toLowerCase()]));
}

/**
 * WCAG 2.2 contrast ratio (SC 1.4.3 / 1.4.11, definitions "relative luminance" and "contrast
 * ratio"): (L1 + 0.05) / (L2 + 0.05) with L = 0.2126 R + 0.7152 G + 0.0722 B of the linearised
 * sRGB channels (c ≤ 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ^ 2.4).
 */
function contrast(a: string, b: string): number {
  const luminance = (hex: string) => {
    const [r, g, bl] = [1, 3, 5].map((i) => {
      const c = parseInt(hex.slice(i, i + 2), 16) / 255;
      return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
    });
    return 0.2126 * r + 0.7152 * g + 0.0722 * bl;
  };
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

const palette = readPalette();
const kebab = (meaning: string) => meaning.replace(/ /g, '-');
const verdictInk = (v: Verdict) => colour(`tw-verdict-${v}-ink`);
const verdictTint = (v: Verdict) => colour(`tw-verdict-${v}-tint`);
const stateInk = (s: RoomState) => colour(`tw-state-${kebab(s)}-ink`);
const stateTint = (s: RoomState) => colour(`tw-state-${kebab(s)}-tint`);

function colour(name: string): string {
  const value = palette.get(name);
  if (!value) throw new Error(`_palette.scss has no --${name}`);
  return value;
}

/** Every meaning with its ink and tint: the four verdicts, then the six room states. */
const MEANINGS = [
  ...VERDICTS.map((v) => ({ name: v, group: 'verdict', ink: verdictInk(v), tint: verdictTint(v) })),
  ...ROOM_STATES.map((s) => ({ name: s, group: 'state', ink: stateInk(s), tint: stateTint(s) })),
];

const WHITE = '#ffffff';
// The darkest light surface the inks are drawn on: Material's surface-container-highest, the
// theme's neutral 90 (_theme-colors.scss).
const DARKEST_SURFACE = '#e1e3e4';

const deltaE = differenceCiede2000();
const pairs = <T>(items: readonly T[]) => items.flatMap((a, i) => items.slice(i + 1).map((b) => [a, b] as const));

describe('the meanings palette (_palette.scss)', () => {
  describe('contrast (WCAG 2.2 AA)', () => {
    it('computes the WCAG contrast ratio', () => {
      // Black on white is the formula's maximum, (1 + 0.05) / (0 + 0.05) (WCAG 2.2, "contrast ratio").
      expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 5);
      expect(contrast('#777777', '#777777')).toBe(1);
      // #767676 on white is the lightest grey that passes 4.5:1 (from memory: the commonly quoted 4.54:1).
      expect(contrast('#767676', WHITE)).toBeCloseTo(4.54, 2);
      expect(contrast('#777777', WHITE)).toBeLessThan(4.5);
      // and agrees with culori's implementation of the same definition
      for (const m of MEANINGS) expect(contrast(m.ink, m.tint)).toBeCloseTo(wcagContrast(m.ink, m.tint), 6);
    });

    it.each(MEANINGS)('$name: its ink reads as text on its tint, on white and on the darkest surface (4.5:1, SC 1.4.3)', ({ ink, tint }) => {
      expect(contrast(ink, tint)).toBeGreaterThanOrEqual(4.5);
      expect(contrast(ink, WHITE)).toBeGreaterThanOrEqual(4.5);
      expect(contrast(ink, DARKEST_SURFACE)).toBeGreaterThanOrEqual(4.5);
    });

    it.each(VERDICTS)('%s: a problem badge (white on the verdict ink) reads as text (4.5:1)', (v) => {
      expect(contrast(WHITE, verdictInk(v))).toBeGreaterThanOrEqual(4.5);
    });

    it.each(ROOM_STATES)('%s: the wall display state band (ink on tint) stands out from the wall background (3:1, SC 1.4.11) and its ink reads on it', (s) => {
      const wall = colour('tw-wall-background');
      expect(contrast(stateTint(s), wall)).toBeGreaterThanOrEqual(3);
      expect(contrast(stateInk(s), stateTint(s))).toBeGreaterThanOrEqual(4.5);
      expect(contrast(colour('tw-wall-ink'), wall)).toBeGreaterThanOrEqual(4.5);
    });

    it('turnover band parts stand out from the lane (3:1, SC 1.4.11)', () => {
      for (const part of [colour('tw-band-hands-on'), stateInk('drying'), stateInk('air hold')]) {
        expect(contrast(part, WHITE)).toBeGreaterThanOrEqual(3);
      }
    });
  });

  describe('every meaning has a colour of its own', () => {
    // CIEDE2000 (CIE 142-2001), via culori. About 1 is a just-noticeable difference; 2–10 is
    // "perceptible at a glance", above about 10 two colours read as different colours rather than
    // two shades of one (from memory: the usual reading of the ΔE scale). The inks carry the
    // meaning (word, icon, border, edge, badge), so they must be at least 12 apart; the tints sit
    // behind them and must at least be told apart at a glance (5).
    it.each(pairs(MEANINGS).map(([a, b]) => ({ a: a.name, b: b.name, inks: [a.ink, b.ink], tints: [a.tint, b.tint] })))(
      '$a and $b differ (inks ΔE00 ≥ 12, tints ≥ 5)',
      ({ inks, tints }) => {
        expect(deltaE(inks[0], inks[1])).toBeGreaterThanOrEqual(12);
        expect(deltaE(tints[0], tints[1])).toBeGreaterThanOrEqual(5);
      },
    );

    // For colour-blind viewers every meaning also has its own icon, word and pattern (below and in
    // the components); the inks of one screen's meanings still differ under simulated protanopia,
    // deuteranopia and tritanopia (Machado, Oliveira and Fernandes 2009, via culori) by at least 5.
    it.each([
      ['protanopia', filterDeficiencyProt(1)],
      ['deuteranopia', filterDeficiencyDeuter(1)],
      ['tritanopia', filterDeficiencyTrit(1)],
    ] as const)('the verdicts, and the room states, stay apart under %s', (_, simulate) => {
      const seen = (hex: string): Color => simulate(parse(hex)!);
      for (const group of ['verdict', 'state']) {
        for (const [a, b] of pairs(MEANINGS.filter((m) => m.group === group))) {
          expect({ pair: `${a.name}/${b.name}`, far: deltaE(seen(a.ink), seen(b.ink)) >= 5 }).toEqual({ pair: `${a.name}/${b.name}`, far: true });
        }
      }
    });

    it('gives every meaning its own icon, so no two read alike without colour', () => {
      const icons = [...VERDICTS.map((v) => VERDICT_DISPLAY[v].icon), ...ROOM_STATES.map((s) => ROOM_STATE_DISPLAY[s].icon)];
      expect(new Set(icons).size).toBe(icons.length);
    });
  });
});
