import fc from 'fast-check';

/** An array nested `depth` deep around a value: `[[[…1…]]]`. */
export function nested(depth: number, inner: unknown = 1): unknown {
  let value = inner;
  for (let i = 0; i < depth; i++) value = i % 2 ? [value] : { a: value };
  return value;
}

const awkwardNumbers = fc.constantFrom(0, -0, -1, 1.5, -1e-9, 5e-324, 1e21, 1e308, -1e308, 2 ** 31, 2 ** 53, 2 ** 53 + 2, -(2 ** 53), Number.MAX_SAFE_INTEGER);
const awkwardStrings = fc.constantFrom(
  '', ' ', '\t', '0', '-1', '1e400', 'NaN', 'Infinity', '-Infinity', 'null', 'true', '[]', '{}', '__proto__',
  '\u0000', '\uFEFF', '\u202E', '😀', 'e\u0301', '\uD800', 'Ω'.repeat(300), '<script>', "'; drop table exams; --", '%s%n', '../../etc/passwd',
);

/** Any value a careless or hostile client might put in a field: wrong types, extremes, huge and deep. */
export const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  { arbitrary: fc.jsonValue({ maxDepth: 3 }), weight: 4 },
  { arbitrary: awkwardNumbers, weight: 2 },
  { arbitrary: awkwardStrings, weight: 2 },
  { arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }), weight: 1 },
  { arbitrary: fc.integer(), weight: 1 },
  { arbitrary: fc.string({ unit: 'binary', maxLength: 40 }), weight: 1 },
  { arbitrary: fc.nat({ max: 60_000 }).map((n) => 'x'.repeat(n)), weight: 1 },
  { arbitrary: fc.nat({ max: 4000 }).map((depth) => nested(depth)), weight: 1 },
  { arbitrary: fc.constantFrom(null, true, false, [], {}), weight: 1 },
);

/**
 * How far a request strays from a valid one: `plausible` reaches the logic behind the checks,
 * `mixed` breaks a field here and there, `nasty` sends anything.
 */
export type Strangeness = 'plausible' | 'mixed' | 'nasty';
export const strangeness = fc.constantFrom<Strangeness>('plausible', 'plausible', 'mixed', 'mixed', 'nasty');

/** A field's value at that strangeness. */
export function fieldValue(plausible: fc.Arbitrary<unknown>, level: Strangeness): fc.Arbitrary<unknown> {
  if (level === 'plausible') return plausible;
  if (level === 'nasty') return nastyValue;
  return fc.oneof({ arbitrary: plausible, weight: 4 }, { arbitrary: nastyValue, weight: 1 });
}

/** ISO 8601 instants around the demo day, real and impossible ones (Feb 30, 25:00, a skipped hour). */
export const isoInstant = fc.oneof(
  fc
    .record({ h: fc.integer({ min: 0, max: 23 }), m: fc.integer({ min: 0, max: 59 }), offset: fc.constantFrom('-06:00', '-05:00', 'Z', '+14:00', '-12:00', '+05:45') })
    .map(({ h, m, offset }) => `2027-03-10T${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}:00${offset}`),
  fc.constantFrom(
    '2027-03-10T07:00:00-06:00', '2027-03-10T09:30:00-06:00', '2027-02-30T09:00:00Z', '2027-03-10T24:00:00Z', '2027-03-14T02:30:00-06:00',
    '0001-01-01T00:00:00Z', '9999-12-31T23:59:59+14:00', '1899-12-30T00:00:00Z', '2027-03-10T09:00:00.123456789Z', '2027-03-11T09:00:00-06:00',
    '2027-03-10T09:00:00+23:59', '2027-03-10', '09:00', '1970-01-01T00:00:00Z',
  ),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
);

/** Calendar days: the demo day, real days far off, impossible ones and odd spellings. */
export const dayText = fc.oneof(
  fc.constantFrom('2027-03-10', '2027-03-11', '2027-03-14', '2027-11-07', '2028-02-29'),
  fc.constantFrom('2027-02-29', '2027-13-01', '2027-00-10', '0000-01-01', '9999-12-31', '2027-3-10', '+002027-03-10', '2027-03-10T00:00', '２０２７-03-10', '20270310'),
  fc.date({ min: new Date(-62135596800000), max: new Date(253402300799999), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10)),
);

/**
 * A path segment as a URL carries it (already encoded where needed): a plausible value, or
 * huge, negative, non-numeric, unicode, dot segments and broken percent-escapes.
 */
export function pathSegment(plausible: fc.Arbitrary<string>, level: Strangeness): fc.Arbitrary<string> {
  const odd = fc.oneof(
    fc.constantFrom(
      '..', '.', '%2e%2e', '%2F', '%2f..%2f', '0', '-1', '-0', '1.5', '1e3', '1e400', 'NaN', 'Infinity', '0x10', '0b1', '%201', '1%20',
      '9007199254740993', '99999999999999999999999', '00000000000000000001', 'null', '%00', '%', '%E0%A4%A', '%C0%AF', '%FF', '%uFFFF', '~', ';', ',',
    ),
    fc.bigInt({ min: -(2n ** 80n), max: 2n ** 80n }).map(String),
    fc.string({ unit: 'grapheme', maxLength: 12 }).map(encodeURIComponent),
    fc.string({ unit: 'binary', maxLength: 12 }).map((s) => encodeURIComponent(s.replace(/[\uD800-\uDFFF]/g, '?'))),
    fc.nat({ max: 4000 }).map((n) => '9'.repeat(n)),
  );
  if (level === 'plausible') return plausible.map(encodeURIComponent);
  if (level === 'nasty') return odd;
  return fc.oneof({ arbitrary: plausible.map(encodeURIComponent), weight: 4 }, { arbitrary: odd, weight: 1 });
}

/** `?a=b&…` from the route's query fields (each a string arbitrary), with repeats, brackets and junk keys. */
export function queryString(fields: Record<string, fc.Arbitrary<string>>, level: Strangeness): fc.Arbitrary<string> {
  const names = Object.keys(fields);
  if (level === 'plausible') {
    if (!names.length) return fc.constant('');
    return fc.record(fields, { requiredKeys: [] }).map((q) => {
      const text = new URLSearchParams(q as Record<string, string>).toString();
      return text ? `?${text}` : '';
    });
  }
  const anyText = fc.oneof(fc.string({ maxLength: 20 }), fc.constantFrom('', '-1', '0', '1e400', 'NaN', '2027-03-10', 'true', '%', '%E0%A4', 'a'.repeat(3000)));
  const known = names.length ? fc.constantFrom(...names) : fc.constant('q');
  const pair = fc.oneof(
    { arbitrary: known.chain((name) => fc.tuple(fc.constant(name), fc.oneof(fields[name] ?? anyText, anyText))), weight: 3 },
    { arbitrary: fc.tuple(known.map((name) => `${name}[]`), anyText), weight: 1 },
    { arbitrary: fc.tuple(known.map((name) => `${name}[a]`), anyText), weight: 1 },
    { arbitrary: fc.tuple(fc.string({ maxLength: 8 }), anyText), weight: 1 },
  );
  const encode = (text: string) => (/^%/.test(text) ? text : encodeURIComponent(text.replace(/[\uD800-\uDFFF]/g, '?')));
  return fc.array(pair, { maxLength: level === 'mixed' ? 2 : 5 }).map((pairs) => (pairs.length ? `?${pairs.map(([k, v]) => `${encode(k)}=${encode(v)}`).join('&')}` : ''));
}
