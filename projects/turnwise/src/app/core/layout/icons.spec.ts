import { ICONS } from './icons';
import { SCREENS } from '../auth/roles';

describe('ICONS', () => {
  it('holds real SVG markup for every icon, loaded from the bundled files', () => {
    for (const [name, markup] of Object.entries(ICONS)) {
      expect({ name, start: markup.trimStart().slice(0, 4) }).toEqual({ name, start: '<svg' });
    }
  });

  it('has an icon for every screen in the navigation', () => {
    for (const screen of SCREENS) expect(Object.keys(ICONS)).toContain(screen.icon);
  });
});
