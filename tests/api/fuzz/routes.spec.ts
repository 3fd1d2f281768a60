import fc from 'fast-check';
import { ROUTE_TABLE } from '../route-table';
import { expectSound, send } from './answer';
import { knownIds, startFuzzApp, type FuzzApp } from './fuzz-app';
import { fuzzOptions, fuzzTimeout } from './fuzz-runs';
import { guessedShape, routeShapes, type RouteShape } from './route-shapes';
import { rolesAllowed, routeKey, urlArbitrary } from './route-requests';
import { fieldValue, nastyValue, strangeness, type Strangeness } from './values';

/**
 * Every route of the role matrix, called by a role allowed on it with arbitrary JSON bodies
 * (its real field names with wrong types, extremes, huge and deeply nested values, or any JSON
 * at all), odd queries and odd path parameters: never a 5xx, a 4xx is always
 * `{error:{code, message}}`, and no answer carries a stack trace.
 */
const RUNS_PER_ROUTE = 25;

function bodyArbitrary(shape: RouteShape, level: Strangeness): fc.Arbitrary<string | undefined> {
  const fields = shape.body ?? {};
  const withFields = fc.record(Object.fromEntries(Object.entries(fields).map(([name, plausible]) => [name, fieldValue(plausible, level)])), { requiredKeys: [] });
  if (level === 'plausible') return withFields.map((v) => JSON.stringify(v));
  const withExtras = fc.tuple(withFields, fc.dictionary(fc.oneof(fc.string({ maxLength: 10 }), fc.constantFrom('__proto__', 'constructor', 'prototype')), nastyValue, { maxKeys: 3 })).map(([a, b]) => ({ ...b, ...a }));
  return fc.oneof(
    { arbitrary: withFields.map((v) => JSON.stringify(v)), weight: 4 },
    { arbitrary: withExtras.map((v) => JSON.stringify(v)), weight: 1 },
    { arbitrary: fc.jsonValue().map((v) => JSON.stringify(v)), weight: 2 },
    { arbitrary: fc.constant(undefined), weight: 1 },
  );
}

describe('fuzz: JSON bodies, queries and path params on every route', () => {
  let app: FuzzApp;
  let shapes: Record<string, RouteShape>;

  beforeAll(async () => {
    app = await startFuzzApp();
    const known = routeShapes(await knownIds(app.h));
    shapes = Object.fromEntries(ROUTE_TABLE.map((route) => [routeKey(route), known[routeKey(route)] ?? guessedShape(route.path)]));
  }, 30_000);
  afterAll(() => app.close(), 30_000);

  for (const route of ROUTE_TABLE) {
    it(`${routeKey(route)}`, async () => {
      const shape = shapes[routeKey(route)]!;
      const request = strangeness.chain((level) =>
        fc.record({
          role: fc.constantFrom(...rolesAllowed(route)),
          url: urlArbitrary(route, shape, level),
          body: bodyArbitrary(shape, level),
        }),
      );
      const statuses: Record<number, number> = {};
      await fc.assert(
        fc.asyncProperty(request, async ({ role, url, body }) => {
          const c = app.clients.get(role)!;
          let test = c.agent[route.method](url).set('X-XSRF-TOKEN', c.token);
          if (body !== undefined) test = test.set('Content-Type', 'application/json').send(body);
          const answer = await send(test);
          statuses[answer.status] = (statuses[answer.status] ?? 0) + 1;
          expectSound(answer, `${role} ${route.method.toUpperCase()} ${url} ${body?.slice(0, 300) ?? ''}`, app.lastError);
        }),
        fuzzOptions(RUNS_PER_ROUTE),
      );
      // FUZZ_STATS=1 shows how far the cases got (a route that only ever answers 422 is barely fuzzed)
      if (process.env['FUZZ_STATS']) process.stderr.write(`${routeKey(route)} ${JSON.stringify(statuses)}\n`);
    }, fuzzTimeout(RUNS_PER_ROUTE));
  }
});
