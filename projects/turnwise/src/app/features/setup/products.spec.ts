import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { of } from 'rxjs';

import { SHORT_CONTACT_CAUTION, type EffectPreview } from '@shared/api/protocols';
import { QUAT_WIPE as WIPE, button, errorUnder, refusal, renderSetup, settle, submit, type } from '../../../testing/setup-dialogs';
import { ProductDialog } from './product-dialog';
import { ProductsTab } from './products-tab';

const CONTACT = 'input[formcontrolname="contactMinutes"]';
const STAYS_WET = 'input[formcontrolname="staysWetMinutes"]';

describe('ProductDialog', () => {
  it('says why a step is re-wetted when the product dries before its contact time: ⌈contact ÷ stays-wet⌉ applications', async () => {
    // Common practice, no source: the surface must stay wet for the whole label contact time.
    // Worked example (derived): 3 min contact, dries after 1.25 min → ⌈3 ÷ 1.25⌉ = ⌈2.4⌉ = 3 applications.
    const { fixture, page } = renderSetup(ProductDialog, null);
    await settle(fixture);
    type(page, CONTACT, '3');
    type(page, STAYS_WET, '1.25');
    await settle(fixture);
    const text = page.querySelector('.rewet')?.textContent ?? '';
    expect(text).toContain('wetted 3 times');
    expect(text).toContain('⌈3 ÷ 1.25⌉');
    expect(text).toContain('3 × the step\'s minutes');

    // staying wet as long as the contact time needs one application: nothing to explain
    type(page, STAYS_WET, '3');
    await settle(fixture);
    expect(page.querySelector('.rewet')).toBeNull();
  });

  it('shows the CDC caution for a contact time under 1 minute, and saves it anyway', async () => {
    const { fixture, page, backend, close } = renderSetup(ProductDialog, null);
    await settle(fixture);
    expect(page.textContent).not.toContain(SHORT_CONTACT_CAUTION);
    type(page, 'input[formcontrolname="name"]', 'Fast wipe (invented)');
    type(page, CONTACT, '0.5');
    await settle(fixture);
    // CDC/HICPAC 2008, Table 1: low-level disinfection of noncritical surfaces ≥ 1 minute
    expect(page.textContent).toContain(SHORT_CONTACT_CAUTION);

    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/products' });
    expect(request.request.body).toEqual({ name: 'Fast wipe (invented)', kind: 'standard', contactMinutes: 0.5, staysWetMinutes: null, registration: '', notes: '' });
    const answer = { product: { ...WIPE, id: 9, contactMinutes: 0.5, usedBy: [] }, warnings: [{ field: 'contactMinutes', message: SHORT_CONTACT_CAUTION }] };
    request.flush(answer, { status: 201, statusText: 'Created' });
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(answer);
  });

  it('refuses a contact time of 0 in the schema’s words before sending', async () => {
    const { fixture, page, backend } = renderSetup(ProductDialog, null);
    await settle(fixture);
    type(page, 'input[formcontrolname="name"]', 'Nothing wipe');
    type(page, CONTACT, '0');
    submit(page);
    await settle(fixture);
    backend.expectNone('/api/products');
    expect(errorUnder(page, CONTACT)).toBe('the contact time must be more than 0 minutes');
  });

  it('puts the API’s 422 problems under their fields and stays open', async () => {
    const { fixture, page, backend, close } = renderSetup(ProductDialog, WIPE);
    await settle(fixture);
    type(page, 'input[formcontrolname="registration"]', 'DEMO-0000-2');
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/products/4' });
    expect(request.request.body).toMatchObject({ name: WIPE.name, contactMinutes: 2, registration: 'DEMO-0000-2' });
    request.flush(...refusal([{ field: 'name', message: 'a product with this name exists' }, { field: 'staysWetMinutes', message: 'the stays-wet time must be more than 0 minutes' }]));
    await settle(fixture);
    expect(errorUnder(page, 'input[formcontrolname="name"]')).toBe('a product with this name exists');
    expect(errorUnder(page, STAYS_WET)).toBe('the stays-wet time must be more than 0 minutes');
    expect(close).not.toHaveBeenCalled();
  });

  it('previews an edit’s effect: required minutes before → after and the gaps whose verdict changes', async () => {
    const { fixture, page, backend } = renderSetup(ProductDialog, WIPE);
    await settle(fixture);
    type(page, CONTACT, '4');
    button(page, 'Preview effect').click();
    const request = backend.expectOne({ method: 'POST', url: '/api/products/4/preview' });
    expect(request.request.body.contactMinutes).toBe(4);
    const preview: EffectPreview = {
      days: ['2027-03-15', '2027-03-22'],
      required: [
        { modality: 'CT', gapType: 'plain', before: 9, after: 11 },
        { modality: 'CT', gapType: 'opening', before: 5, after: 5 },
      ],
      changes: [
        {
          date: '2027-03-15',
          roomId: 3,
          roomName: 'CT 1',
          time: '2027-03-15T09:40:00-04:00',
          accessions: ['A100', 'A101'],
          before: { verdict: 'snug', requiredMinutes: 9 },
          after: { verdict: 'short', requiredMinutes: 11 },
        },
      ],
      problems: [],
      warnings: [],
    };
    request.flush(preview);
    await settle(fixture);
    const table = page.querySelector('table[aria-label="Required minutes, before and after"]')!;
    const cells = Array.from(table.querySelectorAll('tbody tr')).map((row) => Array.from(row.querySelectorAll('td')).map((cell) => cell.textContent?.trim()));
    expect(cells).toEqual([['CT', 'Routine gap', '9 min', '11 min']]);
    expect(page.textContent).toContain('1 gap changes verdict');
    expect(page.querySelector('.changes')?.textContent).toMatch(/09:40, CT 1 \(A101\)/);
  });
});

describe('ProductsTab', () => {
  it('a product still used by a protocol is not retired: the 409 names the modalities', async () => {
    const { fixture, page, backend } = renderSetup(ProductsTab);
    jest.spyOn(TestBed.inject(MatDialog), 'open').mockReturnValue({ afterClosed: () => of(true) } as never);
    await settle(fixture);
    backend.expectOne('/api/products').flush({ products: [WIPE] });
    await settle(fixture);
    expect(page.querySelector('table[aria-label="Products"] tbody')?.textContent).toContain('CT, MR');

    button(page, 'Retire').click();
    await settle(fixture);
    backend
      .expectOne({ method: 'POST', url: '/api/products/4/retire' })
      .flush({ error: { code: 'product_in_use', message: 'in use', details: { modalities: ['CT', 'MR'] } } }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('still used by the CT, MR protocol');
  });
});
