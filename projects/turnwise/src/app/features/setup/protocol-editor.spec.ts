import { protocolBodySchema } from '@shared/api/protocols';
import { QUAT_WIPE as WIPE, button, errorUnder, refusal, renderSetup, settle, submit, type } from '../../../testing/setup-dialogs';
import { ProtocolEditor, type ProtocolEditorData } from './protocol-editor';

const CT = protocolBodySchema.parse({
  steps: [
    { key: 'strip', label: 'Strip the table', handsOnMinutes: 1 },
    { key: 'wipe-table', label: 'Wipe the table', handsOnMinutes: 2, disinfects: true, productId: 4, needs: [{ key: 'strip' }] },
    { key: 'linen', label: 'Fresh linen', handsOnMinutes: 1, needs: [{ key: 'wipe-table', dry: true }] },
  ],
  defaultProductId: 4,
});

const TODAY = '2027-03-15';

function render(data: Partial<ProtocolEditorData> = {}) {
  const full: ProtocolEditorData = { modality: 'CT', base: CT, today: TODAY, products: [WIPE], protocols: [], ...data };
  return renderSetup(ProtocolEditor, full);
}

/** The fieldset of turnover step `n` (1-based). */
function step(page: HTMLElement, n: number): HTMLElement {
  const found = page.querySelectorAll<HTMLElement>('tw-protocol-steps')[0]!.querySelector<HTMLElement>(`[data-step="${n - 1}"]`);
  if (!found) throw new Error(`No step ${n}`);
  return found;
}

function chips(element: HTMLElement): string[] {
  return Array.from(element.querySelectorAll('mat-chip')).map((chip) => chip.textContent!.trim());
}

/** Opens the Material select labelled `label` inside `within` and picks the option reading `option`. */
async function choose(fixture: Parameters<typeof settle>[0], within: HTMLElement, label: string, option: string): Promise<void> {
  const field = Array.from(within.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label);
  if (!field) throw new Error(`No field "${label}"`);
  field.querySelector<HTMLElement>('.mat-mdc-select-trigger')!.click();
  await settle(fixture);
  const choice = Array.from(document.querySelectorAll<HTMLElement>('mat-option')).find((o) => o.textContent?.trim() === option);
  if (!choice) throw new Error(`No option "${option}"`);
  choice.click();
  await settle(fixture);
}

// The editor's first render (two step lists, four precautions, many Material selects) takes
// seconds on a loaded machine: the whole-run limit (30 s), also when this project runs alone.
jest.setTimeout(30_000);

describe('ProtocolEditor', () => {
  beforeAll(() => {
    // jsdom lays nothing out; the editor scrolls to the first problem
    Element.prototype.scrollIntoView = jest.fn();
  });

  it('shows each step’s needs as chips, "after X" and "after X is dry", and adds one', async () => {
    const { fixture, page, backend } = render();
    await settle(fixture);
    expect(chips(step(page, 2))).toEqual(['after Strip the table']);
    expect(chips(step(page, 3))).toEqual(['after Wipe the table is dry']);

    await choose(fixture, step(page, 3), 'Add a need', 'after Strip the table');
    expect(chips(step(page, 3))).toEqual(['after Wipe the table is dry', 'after Strip the table']);
    step(page, 2).querySelector<HTMLButtonElement>('button[aria-label="Remove need: after Strip the table"]')!.click();
    await settle(fixture);
    expect(chips(step(page, 2))).toEqual([]);

    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/protocols' });
    const sent = request.request.body.body.steps;
    expect(sent[1].needs).toEqual([]);
    expect(sent[2].needs).toEqual([
      { key: 'wipe-table', dry: true },
      { key: 'strip', dry: false },
    ]);
  });

  it('adds a step at the end, checks it with the schema, and sends it', async () => {
    const { fixture, page, backend } = render();
    await settle(fixture);
    button(page, 'Add step').click();
    await settle(fixture);
    expect(step(page, 4).querySelector('legend')?.textContent).toContain('Step 4');
    type(step(page, 4), 'input[formcontrolname="label"]', 'Check the injector');
    type(step(page, 4), 'input[formcontrolname="handsOnMinutes"]', '121');
    submit(page);
    await settle(fixture);
    backend.expectNone('/api/protocols');
    // the words of protocolStepSchema's hands-on limit (0–120)
    expect(errorUnder(step(page, 4), 'input[formcontrolname="handsOnMinutes"]')).toBe('hands-on time must be 0–120 minutes');

    type(step(page, 4), 'input[formcontrolname="handsOnMinutes"]', '1.5');
    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/protocols' });
    expect(request.request.body).toMatchObject({ modality: 'CT', effectiveFrom: TODAY, note: '' });
    expect(request.request.body.body.steps[3]).toEqual({
      key: 'step-4',
      label: 'Check the injector',
      handsOnMinutes: 1.5,
      dryMinutes: 0,
      disinfects: false,
      productId: null,
      needs: [],
      onlyWhen: {},
      afterAllOthers: false,
    });
  });

  it('shows the API’s cycle refusal on the step list and an unknown step on its step, and stays open', async () => {
    const { fixture, page, backend, close } = render();
    await settle(fixture);
    submit(page);
    backend.expectOne({ method: 'POST', url: '/api/protocols' }).flush(
      ...refusal([
        { field: 'body.steps', message: 'the needs form a cycle: Wipe the table → Fresh linen → Wipe the table' },
        { field: 'body.steps.2.needs.0.key', message: 'no step "wipe" in this protocol' },
      ]),
    );
    await settle(fixture);
    const list = page.querySelectorAll('tw-protocol-steps')[0]!;
    expect(list.querySelector(':scope > [role="alert"]')?.textContent).toContain('cycle: Wipe the table → Fresh linen → Wipe the table');
    expect(step(page, 3).querySelector('.needs [role="alert"]')?.textContent).toContain('no step "wipe" in this protocol');
    expect(close).not.toHaveBeenCalled();
  });

  it('takes an effective date of today or later only: a past day keeps the version it used', async () => {
    const { fixture, page, backend, close } = render();
    await settle(fixture);
    type(page, 'input[formcontrolname="effectiveFrom"]', '2027-03-14');
    submit(page);
    await settle(fixture);
    backend.expectNone('/api/protocols');
    expect(errorUnder(page, 'input[formcontrolname="effectiveFrom"]')).toBe('choose 2027-03-15 or later: a past day keeps the version it used');

    type(page, 'input[formcontrolname="effectiveFrom"]', '2027-03-16');
    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/protocols' });
    expect(request.request.body.effectiveFrom).toBe('2027-03-16');
    const answer = { protocol: { id: 8, modality: 'CT', version: 2, effectiveFrom: '2027-03-16', body: CT, note: '', createdAt: '', createdBy: null }, warnings: [] };
    request.flush(answer, { status: 201, statusText: 'Created' });
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(answer);
  });

  it('a new modality’s protocol can start from a copy of another modality’s current version', async () => {
    const current = { id: 3, modality: 'CT', version: 1, effectiveFrom: '2027-01-01', body: CT, note: '', createdAt: '', createdBy: null };
    const { fixture, page, backend } = render({
      modality: null,
      base: null,
      protocols: [{ modality: 'CT', current, future: [], history: [], roomIds: [3] }],
    });
    await settle(fixture);
    expect(page.querySelectorAll('tw-protocol-steps')[0]!.querySelectorAll('[data-step]')).toHaveLength(1);
    await choose(fixture, page, 'Modality', 'PT');
    await choose(fixture, page, 'Start from a copy of', 'CT, version 1');
    expect(chips(step(page, 3))).toEqual(['after Wipe the table is dry']);
    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/protocols' });
    expect(request.request.body.modality).toBe('PT');
    expect(request.request.body.body.steps.map((s: { key: string }) => s.key)).toEqual(['strip', 'wipe-table', 'linen']);
  });
});
