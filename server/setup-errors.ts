import { HttpError } from './errors';

/**
 * Setup's refusals, each with its own code (listed with the others in shared/api/errors.ts).
 * Their details are typed here so services cannot send a shape the client does not expect.
 */

/** 409 `last_admin`: the change would leave no active admin. */
export class LastAdminError extends HttpError {
  constructor(message: string) {
    super(409, 'last_admin', message);
  }
}

/** 403 `password_change_required`: a reset password must be changed before anything else. */
export class PasswordChangeRequiredError extends HttpError {
  constructor() {
    super(403, 'password_change_required', 'Choose your own password first (your profile), then try again.');
  }
}

/** 409 `room_has_exams`: exams are booked in the room from today on. */
export class RoomHasExamsError extends HttpError {
  constructor(message: string, details: { count: number; firstDay: string }) {
    super(409, 'room_has_exams', message, details);
  }
}

/** 422 `kit_not_mr_safe`: ASTM F2503 / ACR Zone IV; `items` names what may not go in. */
export class KitNotMrSafeError extends HttpError {
  constructor(message: string, details: { items: { id: number; name: string; marking: string }[]; problems: { field: string; message: string }[] }) {
    super(422, 'kit_not_mr_safe', message, details);
  }
}
