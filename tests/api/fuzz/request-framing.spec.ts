import zlib from 'node:zlib';
import fc from 'fast-check';
import { ROUTE_TABLE } from '../route-table';
import { expectSound, send } from './answer';
import { knownIds, startFuzzApp, type FuzzApp } from './fuzz-app';
import { fuzzOptions, fuzzTimeout } from './fuzz-runs';
import { guessedShape, routeShapes, type RouteShape } from './route-shapes';
import { rolesAllowed, routeKey, urlArbitrary } from './route-requests';

/**
 * Bodies that are not what the JSON parser expects, on every route: other content types, bad
 * charsets, invalid UTF-8, broken JSON, bodies over the 100 kB limit (plain or compressed),
 * encodings that are not what they say. Never a 5xx; a 4xx is `{error:{code, message}}`.
 */
const RUNS = 200;
const KB = 1024;
// small on the wire, 2 MB (far over the limit) once inflated
const GZIP_BOMB = zlib.gzipSync(Buffer.alloc(2 * 1024 * KB, '['));

const contentTypes = fc.constantFrom(
  'application/json', 'application/json; charset=utf-8', 'application/json; charset=latin1', 'application/json; charset=utf-16', 'application/json; charset=',
  'text/plain', 'text/csv', 'application/x-www-form-urlencoded', 'multipart/form-data', 'multipart/form-data; boundary=x', 'application/xml',
  'application/merge-patch+json', 'application/octet-stream', 'json', ';;;', 'application/json; boundary=x; charset="utf-8"', '',
);

const invalidUtf8 = fc.constantFrom([0xff], [0xfe, 0xff], [0xc0, 0xaf], [0xed, 0xa0, 0x80], [0xe2, 0x82], [0xf8, 0x88, 0x80, 0x80, 0x80], [0x80]);

const bodies = fc.oneof(
  invalidUtf8.map((bad) => Buffer.concat([Buffer.from('{"note":"'), Buffer.from(bad), Buffer.from('","staff":1}')])),
  invalidUtf8.map((bad) => Buffer.concat([Buffer.from(bad), Buffer.from('{}')])),
  fc.string({ maxLength: 60 }).map((text) => Buffer.from(text)),
  fc.constantFrom('{', '{"a":', '[1,]', '{"a":1}}', "{'a':1}", 'NaN', '{"a":NaN}', '{"a":Infinity}', '{"a":1e999999}', '\uFEFF{}', '{}\u0000', 'null', '"x"', '1').map((t) => Buffer.from(t)),
  fc.integer({ min: 100 * KB - 64, max: 200 * KB }).map((n) => Buffer.from(`{"note":"${'x'.repeat(n)}"}`)),
  // nested deeper than JSON.stringify can write, within the size limit or past it
  fc.tuple(fc.integer({ min: 20_000, max: 60_000 }), fc.boolean()).map(([depth, arrays]) => Buffer.from(arrays ? `${'['.repeat(depth)}1${']'.repeat(depth)}` : `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`)),
  fc.uint8Array({ maxLength: 2000 }).map((b) => Buffer.from(b)),
  fc.constant(Buffer.from('{}')),
);

const encodings = fc.option(fc.constantFrom('gzip', 'deflate', 'br', 'identity', 'compress', 'gzip, gzip', 'GZIP', 'x-bomb'), { freq: 3 });

describe('fuzz: request framing on every route', () => {
  let app: FuzzApp;
  let shapes: Record<string, RouteShape>;

  beforeAll(async () => {
    app = await startFuzzApp();
    const known = routeShapes(await knownIds(app.h));
    shapes = Object.fromEntries(ROUTE_TABLE.map((route) => [routeKey(route), known[routeKey(route)] ?? guessedShape(route.path)]));
  }, 30_000);
  afterAll(() => app.close(), 30_000);

  it('other content types, invalid UTF-8, broken or oversized JSON, odd encodings: never a 5xx', async () => {
    const request = fc.constantFrom(...ROUTE_TABLE).chain((route) =>
      fc.record({
        route: fc.constant(route),
        role: fc.constantFrom(...rolesAllowed(route)),
        url: urlArbitrary(route, shapes[routeKey(route)]!, 'plausible'),
        contentType: contentTypes,
        body: bodies,
        encoding: encodings,
        // a body that really is compressed
        bomb: fc.boolean(),
      }),
    );
    await fc.assert(
      fc.asyncProperty(request, async ({ route, role, url, contentType, body, encoding, bomb }) => {
        const c = app.clients.get(role)!;
        let sent: Buffer = body;
        if (encoding === 'gzip' && bomb) sent = GZIP_BOMB;
        else if (encoding === 'deflate' && bomb) sent = zlib.deflateSync(body);
        let test = c.agent[route.method](url).set('X-XSRF-TOKEN', c.token);
        if (contentType) test = test.set('Content-Type', contentType);
        if (encoding) test = test.set('Content-Encoding', encoding);
        const what = `${role} ${route.method.toUpperCase()} ${url} [${contentType}${encoding ? `, ${encoding}${bomb ? ' bomb' : ''}` : ''}] ${sent.length} bytes ${JSON.stringify(sent.subarray(0, 120).toString('latin1'))}`;
        expectSound(await send(test.send(sent)), what, app.lastError);
      }),
      fuzzOptions(RUNS),
    );
  }, fuzzTimeout(RUNS));
});
