import type { SetupChecklist as Checklist } from '@shared/api/protocols';
import { button, renderSetup, settle } from '../../../testing/setup-dialogs';
import { SetupChecklist } from './setup-checklist';

const NEW_DEPARTMENT: Checklist = {
  complete: false,
  items: [
    { key: 'rooms', done: true, missing: [] },
    { key: 'products', done: false, missing: ['no disinfectant product yet'] },
    { key: 'protocols', done: false, missing: ['no protocol for CT'] },
    { key: 'users', done: false, missing: ['no technologist account'] },
  ],
};

describe('SetupChecklist', () => {
  afterEach(() => sessionStorage.clear());

  it('lists what is still missing, each item linking to its Setup tab', async () => {
    const { fixture, page, backend } = renderSetup(SetupChecklist);
    await settle(fixture);
    backend.expectOne('/api/setup/checklist').flush(NEW_DEPARTMENT);
    await settle(fixture);
    const items = Array.from(page.querySelectorAll('li'));
    expect(items.map((li) => li.textContent!.replace(/\s+/g, ' ').trim())).toEqual([
      'Rooms: done',
      'Disinfectant products: no disinfectant product yet',
      'A protocol for each modality in use: no protocol for CT',
      'An account for each role: no technologist account',
    ]);
    expect(items.map((li) => li.querySelector('a')!.getAttribute('href'))).toEqual([
      '/setup?tab=rooms',
      '/setup?tab=products',
      '/setup?tab=protocols',
      '/setup?tab=users',
    ]);
    // inside Setup it cannot be put away
    expect(page.textContent).not.toContain('Hide for now');
  });

  it('shows nothing once setup is complete', async () => {
    const { fixture, page, backend } = renderSetup(SetupChecklist);
    await settle(fixture);
    backend.expectOne('/api/setup/checklist').flush({ complete: true, items: NEW_DEPARTMENT.items.map((i) => ({ ...i, done: true, missing: [] })) });
    await settle(fixture);
    expect(page.querySelector('section')).toBeNull();
  });

  it('where dismissible, hides for the session and fetches again when told something changed', async () => {
    const { fixture, page, backend } = renderSetup(SetupChecklist);
    fixture.componentRef.setInput('dismissible', true);
    await settle(fixture);
    backend.expectOne('/api/setup/checklist').flush(NEW_DEPARTMENT);
    await settle(fixture);
    button(page, 'Hide for now').click();
    await settle(fixture);
    expect(page.querySelector('section')).toBeNull();
    expect(sessionStorage.getItem('tw-setup-checklist-dismissed')).toBe('1');

    fixture.componentRef.setInput('refresh', 'products');
    await settle(fixture);
    backend.expectOne('/api/setup/checklist').flush(NEW_DEPARTMENT);
    backend.verify();
  });
});
