import { pageRule, usualPaper } from './page-setup';

describe('pageRule', () => {
  it('returns the @page rule for each paper and orientation', () => {
    expect(pageRule('A4', 'portrait')).toBe('@page { size: A4 portrait; margin: 12mm; }');
    expect(pageRule('Letter', 'landscape')).toBe('@page { size: Letter landscape; margin: 12mm; }');
  });
});

describe('usualPaper', () => {
  it('returns Letter where Letter is the usual paper, A4 elsewhere', () => {
    expect(usualPaper('en-US')).toBe('Letter');
    expect(usualPaper('fr-CA')).toBe('Letter');
    expect(usualPaper('en-GB')).toBe('A4');
    expect(usualPaper('de')).toBe('A4');
  });

  it('returns A4 when the language is unknown', () => {
    expect(usualPaper(undefined)).toBe('A4');
    expect(usualPaper('')).toBe('A4');
  });
});
