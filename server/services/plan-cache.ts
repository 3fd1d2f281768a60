import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { DayPlan } from '../../shared/api/plan';

/** A computed plan with its JSON text and a strong ETag, ready to serve as is. */
export interface CachedPlan {
  plan: DayPlan;
  json: string;
  etag: string;
}

const MAX_DAYS = 64;
// One cache per database: a plan is a function of what that database holds. Entries are
// replaced, never mutated, and the oldest go first once MAX_DAYS days are held.
const caches = new WeakMap<Knex, Map<string, CachedPlan>>();

/**
 * Looks a day's plan up by the key of everything it is computed from (the day, its version and
 * the setup's version), computing and keeping it on a miss.
 *
 * @example
 * const { json, etag } = await cachedPlan(db, key, () => computeDayPlan(input));
 */
export async function cachedPlan(db: Knex, key: string, compute: () => Promise<DayPlan>, stillCurrent: () => Promise<boolean>): Promise<CachedPlan> {
  let cache = caches.get(db);
  if (!cache) caches.set(db, (cache = new Map()));
  const hit = cache.get(key);
  if (hit) {
    // Map order is insertion order: re-inserting makes this day the most recently used.
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const plan = await compute();
  const json = JSON.stringify(plan);
  const entry: CachedPlan = { plan, json, etag: `"${createHash('sha1').update(key).digest('base64url')}"` };
  // A write that landed while computing may or may not be in the plan: serve it, don't keep it.
  if (!(await stillCurrent())) return { ...entry, etag: `"${createHash('sha1').update(json).digest('base64url')}"` };
  if (cache.size >= MAX_DAYS) cache.delete(cache.keys().next().value!);
  cache.set(key, entry);
  return entry;
}
