import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';
import type { Type } from '@angular/core';

import type { ProductView } from '@shared/api/protocols';
import { provideApiHttp } from '../app/core/http/api-http';
import { provideIcons } from '../app/core/layout/icons';
import { fakeAuth } from './fake-auth';

/** An admin's component (a Setup dialog with `data`, a Setup tab, an admin screen) as an admin sees it, with the API faked. */
export function renderSetup<T>(component: Type<T>, data: unknown = null) {
  const close = jest.fn();
  TestBed.configureTestingModule({
    imports: [component],
    providers: [
      provideRouter([]),
      provideApiHttp(),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'admin', role: 'admin' }).provider,
      { provide: MatDialogRef, useValue: { close } },
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const fixture = TestBed.createComponent(component);
  return { fixture, close, backend: TestBed.inject(HttpTestingController), page: fixture.nativeElement as HTMLElement };
}

export async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

export function type(page: HTMLElement, selector: string, value: string): void {
  const input = page.querySelector<HTMLInputElement>(selector)!;
  input.value = value;
  input.dispatchEvent(new Event('input'));
}

/** The text of the mat-error under the field holding `selector`. */
export function errorUnder(page: HTMLElement, selector: string): string {
  return page.querySelector(selector)!.closest('mat-form-field')!.querySelector('mat-error')?.textContent?.trim() ?? '';
}

export function submit(page: HTMLElement): void {
  page.querySelector('form')!.dispatchEvent(new Event('submit'));
}

/** The button whose text includes `text` (throws when there is none, so a test cannot pass by missing it). */
export function button(page: HTMLElement, text: string): HTMLButtonElement {
  const found = Array.from(page.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes(text));
  if (!found) throw new Error(`No button "${text}"`);
  return found;
}

/** A 422 as the API answers it. */
export function refusal(problems: { field: string; message: string }[], message = 'Invalid request') {
  return [{ error: { code: 'validation_failed', message, details: { problems } } }, { status: 422, statusText: 'Unprocessable' }] as const;
}

/** An invented disinfectant, 2 min label contact time, used by the CT protocol. */
export const QUAT_WIPE: ProductView = {
  id: 4,
  key: '4',
  name: 'Quat wipe (invented)',
  kind: 'standard',
  contactMinutes: 2,
  staysWetMinutes: null,
  registration: 'DEMO-0000-1',
  notes: '',
  retired: false,
  applications: 1,
  usedBy: ['CT', 'MR'],
};
