import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { fakeAuth } from '../../../testing/fake-auth';
import { provideIcons } from './icons';
import { Shell } from './shell';
import { ShellChrome } from './shell-chrome';

async function render(role: 'charge' | 'admin' = 'charge') {
  const { fake, provider } = fakeAuth({ username: 'casey', role });
  TestBed.configureTestingModule({
    imports: [Shell],
    providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), provideIcons(), provider],
  });
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
  const fixture = TestBed.createComponent(Shell);
  await fixture.whenStable();
  return { fixture, fake, navigate, page: fixture.nativeElement as HTMLElement };
}

describe('Shell', () => {
  it('has header, navigation and main landmarks', async () => {
    const { page } = await render();
    expect(page.querySelector('header')).not.toBeNull();
    expect(page.querySelector('nav[aria-label="Screens"]')).not.toBeNull();
    expect(page.querySelector('main#main')).not.toBeNull();
  });

  it('shows the product name and who is signed in, with their role', async () => {
    const { page } = await render();
    const toolbar = page.querySelector('mat-toolbar')!.textContent!;
    expect(toolbar).toContain('Turnwise');
    expect(toolbar).toContain('casey');
    expect(toolbar).toContain('Charge technologist');
  });

  it('signs out and goes to the sign-in page', async () => {
    const { page, fake, navigate, fixture } = await render();
    page.querySelector<HTMLButtonElement>('button.sign-out')!.click();
    await fixture.whenStable();
    expect(fake.logout).toHaveBeenCalled();
    expect(navigate).toHaveBeenCalledWith('/sign-in');
  });

  it('leaves out the toolbar and navigation while a wall display hides them', async () => {
    const { page, fixture } = await render();
    TestBed.inject(ShellChrome).hidden.set(true);
    await fixture.whenStable();
    expect(page.querySelector('header')).toBeNull();
    expect(page.querySelector('mat-sidenav')!.classList).not.toContain('mat-drawer-opened');
    expect(page.querySelector('main#main')).not.toBeNull();
  });

  it('shows an admin what setup still lacks; other roles fetch nothing', async () => {
    const charge = await render('charge');
    await new Promise((resolve) => setTimeout(resolve));
    await charge.fixture.whenStable();
    TestBed.inject(HttpTestingController).expectNone('/api/setup/checklist');
    TestBed.resetTestingModule();

    const admin = await render('admin');
    await new Promise((resolve) => setTimeout(resolve));
    await admin.fixture.whenStable();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/setup/checklist')
      .flush({ complete: false, items: [{ key: 'products', done: false, missing: ['no disinfectant product yet'] }] });
    await admin.fixture.whenStable();
    expect(admin.page.querySelector('main')!.textContent).toContain('no disinfectant product yet');
  });
});
