/**
 * Minutes a room stays closed after an airborne-precaution patient leaves, so that the given
 * fraction of airborne particles is removed: t = 60 × ln(1 / (1 − removal)) / ACH, the
 * well-mixed-air formula behind CDC's 2003 environmental guideline, Appendix B, Table B.1.
 * Rounded up (the table rounds to nearest), since a minute early is the unsafe side.
 *
 * Assumes the aerosol source has left and the air is well mixed; real rooms can take longer.
 *
 * @param airChangesPerHour the room's measured air changes per hour; must be > 0
 * @param removal fraction removed, 0 < removal < 1 (default 0.999, i.e. 99.9 %)
 * @throws RangeError when either argument is out of range or not a number
 * @example
 * airHoldMinutes(6);        // 70 (CDC's table: 69)
 * airHoldMinutes(12, 0.99); // 24
 */
export function airHoldMinutes(airChangesPerHour: number, removal = 0.999): number {
  if (!Number.isFinite(airChangesPerHour) || airChangesPerHour <= 0) {
    throw new RangeError(`airChangesPerHour must be a number above 0, got ${airChangesPerHour}`);
  }
  if (!Number.isFinite(removal) || removal <= 0 || removal >= 1) {
    throw new RangeError(`removal must be between 0 and 1 (exclusive), got ${removal}`);
  }
  const exact = (60 * Math.log(1 / (1 - removal))) / airChangesPerHour;
  // Guard against 41.0000000001 becoming 42 through floating-point noise.
  return Math.ceil(exact - 1e-9);
}
