import { DEFAULT_HL7_MAPPING, type Hl7Mapping } from '@shared/api/hl7-mapping';
import { button, errorUnder, refusal, renderSetup, settle, type } from '../../../testing/setup-dialogs';
import { Hl7MappingForm } from './hl7-mapping-form';

const URL = '/api/hl7/mapping';
/** Invented codes, as a booking system might send them. */
const STORED: Hl7Mapping = {
  ...DEFAULT_HL7_MAPPING,
  precaution: { source: 'obx', code: 'TW-PREC', values: [{ sent: 'ISO-AIR', value: 'airborne' }] },
  procedures: [{ code: 'MRBRAINC', coil: 'head', contrast: true }],
};

async function render(mapping: Hl7Mapping) {
  const view = renderSetup(Hl7MappingForm);
  await settle(view.fixture);
  view.backend.expectOne({ method: 'GET', url: URL }).flush({ mapping });
  await settle(view.fixture);
  return view;
}

const input = (page: HTMLElement, name: string) => page.querySelector<HTMLInputElement>(`input[name="${name}"]`);
const save = (page: HTMLElement) => page.querySelector('form')!.dispatchEvent(new Event('submit'));

describe('Hl7MappingForm (Setup → Site → Booking system feed)', () => {
  it('with nothing set up shows every field as not read, with what a booking gets instead', async () => {
    const { page } = await render(DEFAULT_HL7_MAPPING);
    expect(page.querySelector('h2')?.textContent).toContain('Booking system feed (HL7)');
    expect(input(page, 'precaution.code')).toBeNull();
    const hints = Array.from(page.querySelectorAll('mat-hint')).map((h) => h.textContent?.trim());
    expect(hints).toEqual(['A new booking gets none', 'A new booking gets ambulatory', 'A new booking gets no coil', 'A new booking gets no contrast']);
    expect(page.textContent).toContain('No procedure codes');
  });

  it('shows the stored mapping and saves an added procedure code with the rest', async () => {
    const { fixture, backend, page } = await render(STORED);
    expect(input(page, 'precaution.code')!.value).toBe('TW-PREC');
    expect(input(page, 'precaution.values.0.sent')!.value).toBe('ISO-AIR');
    expect(input(page, 'procedures.0.coil')!.value).toBe('head');
    button(page, 'Add a procedure code').click();
    await settle(fixture);
    type(page, 'input[name="procedures.1.code"]', 'MRKNEE');
    type(page, 'input[name="procedures.1.coil"]', 'knee');
    save(page);
    await settle(fixture);
    const sent = backend.expectOne({ method: 'PUT', url: URL });
    const expected: Hl7Mapping = { ...STORED, procedures: [...STORED.procedures, { code: 'MRKNEE', coil: 'knee', contrast: null }] };
    expect(sent.request.body).toEqual(expected);
    sent.flush({ mapping: expected });
    await settle(fixture);
    expect(page.querySelector('[role="status"]')?.textContent).toContain('Saved');
  });

  it('puts each of the API’s 422 problems under its own field, rows included', async () => {
    const { fixture, backend, page } = await render(STORED);
    save(page);
    await settle(fixture);
    backend.expectOne({ method: 'PUT', url: URL }).flush(
      ...refusal([
        { field: 'precaution.code', message: 'name the OBX-3 observation code' },
        { field: 'procedures.0.coil', message: 'give a coil or contrast, or remove the row' },
      ]),
    );
    await settle(fixture);
    expect(errorUnder(page, 'input[name="precaution.code"]')).toBe('name the OBX-3 observation code');
    expect(errorUnder(page, 'input[name="procedures.0.coil"]')).toBe('give a coil or contrast, or remove the row');
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Check the marked fields.');
    // a problem across fields may be fixed in another one: saving again asks the server again
    save(page);
    await settle(fixture);
    backend.expectOne({ method: 'PUT', url: URL }).flush({ mapping: STORED });
    await settle(fixture);
    expect(errorUnder(page, 'input[name="procedures.0.coil"]')).toBe('');
  });

  it('refuses an empty procedure code before sending', async () => {
    const { fixture, backend, page } = await render(DEFAULT_HL7_MAPPING);
    button(page, 'Add a procedure code').click();
    await settle(fixture);
    save(page);
    await settle(fixture);
    backend.expectNone({ method: 'PUT', url: URL });
    expect(errorUnder(page, 'input[name="procedures.0.code"]')).toBe('required');
  });
});
