import { notYetDone, wetSurfaces } from './step-readiness';
import { at, clear, linen, table, ticked } from './testing/example-checklist';

describe('wetSurfaces', () => {
  it('lists a needed surface still wet from its tick', () => {
    const steps = [ticked(clear, '10:32'), ticked(table, '10:36', at('10:40')), linen];
    expect(wetSurfaces(linen, steps, Date.parse(at('10:38')))).toEqual([{ key: 'table', label: 'Table top and rails', wetUntil: at('10:40') }]);
  });

  it('returns nothing once the surface is dry, at the very second', () => {
    const steps = [ticked(clear, '10:32'), ticked(table, '10:36', at('10:40')), linen];
    expect(wetSurfaces(linen, steps, Date.parse(at('10:40')))).toEqual([]);
  });

  it('returns nothing for a needed step not yet done: that is a hint, not a wet surface', () => {
    expect(wetSurfaces(linen, [clear, table, linen], Date.parse(at('10:38')))).toEqual([]);
    expect(notYetDone(linen, [clear, table, linen])).toEqual(['Table top and rails']);
    expect(notYetDone(linen, [clear, ticked(table, '10:36', at('10:40')), linen])).toEqual([]);
  });
});
