/** The time source; tests pass a controllable one. */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** A clock tests can set and advance. */
export function fixedClock(start: Date | string): Clock & { set(t: Date | string): void; advance(minutes: number): void } {
  let current = new Date(start);
  return {
    now: () => new Date(current),
    set: (t) => {
      current = new Date(t);
    },
    advance: (minutes) => {
      current = new Date(current.getTime() + minutes * 60_000);
    },
  };
}
