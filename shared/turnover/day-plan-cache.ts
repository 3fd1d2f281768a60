import type { DayPlanExam, DayPlanInput, DayPlanRoom } from './day-plan-input';
import type { Protocol, TurnoverPlan } from './model';
import { planTurnover } from './plan-turnover';
import { coilChanges } from './step-set';

/** Solved turnovers of one setup (protocol, products, rules), by the kind of gap. */
export type TurnoverCache = Map<number | string, TurnoverPlan>;

/*
 * Solved turnovers are kept across calls, keyed by the content of the protocol, products and
 * rules they came from (not object identity: a server reads fresh objects for every request),
 * so a warm day plan only looks answers up. Bounded; dropping entries only costs time.
 */
const cachesBySetup = new Map<string, TurnoverCache>();
const MAX_SETUPS = 32;
const MAX_TURNOVERS_PER_SETUP = 20_000;

/**
 * For one day-plan call: the cache of each protocol it uses (looked up once per protocol object).
 *
 * @example
 * const cacheOf = turnoverCaches(input);
 * turnoverFor(cacheOf(MR_PROTOCOL), { input, room, protocol: MR_PROTOCOL, leaving, arriving, staff: 1 });
 */
export function turnoverCaches(input: DayPlanInput): (protocol: Protocol) => TurnoverCache {
  const byProtocol = new Map<Protocol, TurnoverCache>();
  return (protocol) => {
    let cache = byProtocol.get(protocol);
    if (!cache) {
      const setup = JSON.stringify([protocol, input.products ?? null, input.rules ?? null]);
      cache = cachesBySetup.get(setup);
      if (!cache) {
        if (cachesBySetup.size >= MAX_SETUPS) cachesBySetup.clear();
        cachesBySetup.set(setup, (cache = new Map()));
      }
      if (cache.size >= MAX_TURNOVERS_PER_SETUP) cache.clear();
      byProtocol.set(protocol, cache);
    }
    return cache;
  };
}

export interface TurnoverForOptions {
  input: DayPlanInput;
  room: DayPlanRoom;
  protocol: Protocol;
  leaving: DayPlanExam | null;
  arriving: DayPlanExam;
  staff: number;
}

/**
 * The turnover of a gap, solved once per kind of gap: only what changes the turnover goes in
 * the key (a number for the common kinds — cheaper to hash than a string on 10,000 gaps).
 *
 * @example
 * turnoverFor(cache, { input, room, protocol, leaving: null, arriving: first, staff: 1 }).requiredMinutes; // 7
 */
export function turnoverFor(cache: TurnoverCache, options: TurnoverForOptions): TurnoverPlan {
  const key = gapKey(options);
  let turnover = cache.get(key);
  if (!turnover) {
    const { input, room, protocol, leaving, arriving, staff } = options;
    turnover = planTurnover({ leaving, arriving, room, protocol, products: input.products, rules: input.rules, staff });
    cache.set(key, turnover);
  }
  return turnover;
}

const PRECAUTION_CODE: Readonly<Record<string, number>> = { none: 0, contact: 1, enteric: 2, droplet: 3 };
const MOBILITY_CODE: Readonly<Record<string, number>> = { ambulatory: 0, wheelchair: 1, stretcher: 2 };

function gapKey({ room, leaving, arriving, staff }: TurnoverForOptions): number | string {
  const contrast = arriving.contrast ? 1 : 0;
  if (!leaving) return -1 - (staff * 2 + contrast);
  const coil = coilChanges(leaving, arriving) ? 1 : 0;
  const p = PRECAUTION_CODE[leaving.precaution];
  const m = MOBILITY_CODE[leaving.mobility];
  if (p === undefined || m === undefined || !Number.isInteger(staff)) {
    // Airborne (the room's air-change rate matters) and anything unusual: a string says it all.
    return `${staff}|${leaving.precaution}|${leaving.mobility}|${coil}|${contrast}|${room.airChangesPerHour}`;
  }
  return ((staff * 4 + p) * 3 + m) * 4 + coil * 2 + contrast;
}
