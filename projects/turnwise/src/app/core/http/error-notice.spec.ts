import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import { ErrorNotice } from './error-notice';

/** Lets the dynamic import and the promise callbacks after it run. */
const settle = () => new Promise((resolve) => setTimeout(resolve));

function setUp() {
  const snackBar = { open: jest.fn() };
  TestBed.configureTestingModule({ providers: [{ provide: MatSnackBar, useValue: snackBar }] });
  return { snackBar, notice: TestBed.inject(ErrorNotice) };
}

describe('ErrorNotice', () => {
  it('shows the message in a snack bar the user can dismiss, once its code has loaded', async () => {
    const { snackBar, notice } = setUp();
    notice.show('The database is busy.');
    expect(snackBar.open).not.toHaveBeenCalled();
    await settle();
    expect(snackBar.open).toHaveBeenCalledWith('The database is busy.', 'Dismiss', { duration: 8000 });
  });

  it('shows each error in turn, in the order they came', async () => {
    const { snackBar, notice } = setUp();
    notice.preload();
    notice.show('first');
    notice.show('second');
    await settle();
    expect(snackBar.open.mock.calls.map(([message]) => message)).toEqual(['first', 'second']);
  });
});
