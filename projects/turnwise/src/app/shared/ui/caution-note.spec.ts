import { TestBed } from '@angular/core/testing';

import { provideIcons } from '../../core/layout/icons';
import { CautionKind, CautionNote } from './caution-note';

async function textOf(kind?: CautionKind | CautionKind[]) {
  TestBed.configureTestingModule({ imports: [CautionNote], providers: [provideIcons()] });
  const fixture = TestBed.createComponent(CautionNote);
  if (kind) fixture.componentRef.setInput('kind', kind);
  await fixture.whenStable();
  const host = fixture.nativeElement as HTMLElement;
  return { text: host.textContent!.replace(/\s+/g, ' '), host };
}

describe('CautionNote', () => {
  it('says times are planning aids and the label contact time and local policy rule', async () => {
    const { text, host } = await textOf();
    expect(host.getAttribute('role')).toBe('note');
    expect(text).toContain('Turnover times are planning aids.');
    expect(text).toContain("disinfectant's label contact time");
    expect(text).not.toContain('Zone IV');
  });

  it('in MR rooms, adds the magnet-room equipment rule', async () => {
    const { text } = await textOf('mr');
    expect(text).toContain('Turnover times are planning aids.');
    // ASTM F2503 defines the MR Safe / MR Conditional / MR Unsafe marking; Zone IV is the magnet
    // room in the ACR's four MR safety zones (ACR Guidance Document on MR Safe Practices, 2013).
    expect(text).toContain('MR Safe or suitably MR Conditional');
    expect(text).toContain('ASTM F2503');
    expect(text).toContain('Zone IV');
  });

  it('for airborne precautions, says the air hold assumes well-mixed air at the measured ACH', async () => {
    // The hold formula assumes perfectly mixed air (CDC 2003 environmental guideline, Appendix B, Table B.1).
    const { text } = await textOf('airborne');
    expect(text).toContain('well-mixed air');
    expect(text).not.toContain('Zone IV');
  });

  it('shows every kind asked for, with the general caution once', async () => {
    const { text } = await textOf(['mr', 'airborne']);
    expect(text.split('Turnover times are planning aids.')).toHaveLength(2);
    expect(text).toContain('Zone IV');
    expect(text).toContain('well-mixed air');
  });
});
