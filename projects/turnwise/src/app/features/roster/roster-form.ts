import { FormArray, FormControl, FormGroup, NonNullableFormBuilder, Validators } from '@angular/forms';

import { ROSTER_LIMITS, type RosterRole, type RosterRow } from '@shared/api/roster';

export type BreakGroup = FormGroup<{ start: FormControl<string>; end: FormControl<string> }>;
export type RowGroup = FormGroup<{
  name: FormControl<string>;
  role: FormControl<RosterRole>;
  count: FormControl<number>;
  start: FormControl<string>;
  end: FormControl<string>;
  breaks: FormArray<BreakGroup>;
  roomIds: FormControl<number[]>;
}>;
export type RosterForm = FormGroup<{ rows: FormArray<RowGroup> }>;

/**
 * The roster as a form: `rows.N.field` and `rows.N.breaks.M.start` are the paths the API's 422
 * problems name, so `showProblems` puts each under its field. The server checks everything; the
 * form only requires what it cannot send without.
 */
export function rosterForm(fb: NonNullableFormBuilder, rows: readonly RosterRow[]): RosterForm {
  return fb.group({ rows: fb.array(rows.map((row) => rowGroup(fb, row))) });
}

/** One row's controls; a new row is one aide on the usual day shift. */
export function rowGroup(fb: NonNullableFormBuilder, row?: Partial<RosterRow>): RowGroup {
  return fb.group({
    name: [row?.name ?? '', Validators.maxLength(ROSTER_LIMITS.nameChars)],
    role: fb.control<RosterRole>(row?.role ?? 'aide'),
    count: [row?.count ?? 1, [Validators.required, Validators.min(1), Validators.max(ROSTER_LIMITS.count)]],
    start: [row?.start ?? '07:00', Validators.required],
    end: [row?.end ?? '15:30', Validators.required],
    breaks: fb.array((row?.breaks ?? []).map((b) => breakGroup(fb, b.start, b.end))),
    roomIds: fb.control<number[]>(row?.roomIds ? [...row.roomIds] : [], Validators.required),
  });
}

export function breakGroup(fb: NonNullableFormBuilder, start = '11:00', end = '11:30'): BreakGroup {
  return fb.group({ start: [start, Validators.required], end: [end, Validators.required] });
}

/** The rows to send: a name makes a row one person; an empty name a count. */
export function rowsOf(form: RosterForm): RosterRow[] {
  return form.controls.rows.getRawValue().map((row) => {
    const name = row.name.trim();
    return {
      name: name === '' ? null : name,
      role: row.role,
      count: name === '' ? Number(row.count) : 1,
      start: row.start,
      end: row.end,
      breaks: row.breaks.map((b) => ({ start: b.start, end: b.end })),
      roomIds: row.roomIds,
    };
  });
}
