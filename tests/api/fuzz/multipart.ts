import fc from 'fast-check';
import { exampleCsv } from '../../fixtures/exam-lists';
import { DAY } from './fuzz-app';

/** A hand-built request body and the Content-Type header sent with it. */
export interface RawUpload {
  contentType: string | undefined;
  body: Buffer;
}

const goodCsv = Buffer.from(exampleCsv(DAY));
const boundaries = fc.oneof(
  fc.constantFrom('fuzzBoundary', '----WebKitFormBoundary7MA4YWxkTrZu0gW', 'a', 'x'.repeat(70), 'x'.repeat(200), 'with space', 'quo"te', '--', 'é', ''),
  fc.stringMatching(/^[0-9A-Za-z'()+_,./:=?-]{1,70}$/),
);
const dispositions = fc.oneof(
  fc.constantFrom(
    'form-data; name="file"; filename="day.csv"',
    'form-data; name="file"; filename="day.xlsx"',
    'form-data; name="file"; filename=""',
    'form-data; name="file"',
    'form-data; name="files"; filename="day.csv"',
    'form-data; name="file[]"; filename="day.csv"',
    'form-data; name=file; filename=day.csv',
    'form-data; name="file"; filename*=UTF-8\'\'%E6%97%A5.csv',
    'form-data; name="file"; filename="a\\"b.csv"',
    'form-data; name="file"; filename="C:\\\\fakepath\\\\day.csv"',
    'form-data; name="note"',
    'form-data; name="dryRun"',
    'form-data',
    'attachment; filename="day.csv"',
    'form-data; name="file"; filename="day.csv"; name="other"',
  ),
  fc.string({ maxLength: 40 }).map((s) => `form-data; name="${s}"; filename="day.csv"`),
);
const content = fc.oneof(
  { arbitrary: fc.constant(goodCsv), weight: 4 },
  { arbitrary: fc.uint8Array({ maxLength: 600 }).map((b) => Buffer.from(b)), weight: 1 },
  { arbitrary: fc.constantFrom(Buffer.alloc(0), Buffer.from('true'), Buffer.from(`--fuzzBoundary\r\n`)), weight: 1 },
);
const part = fc.record({
  disposition: fc.option(dispositions, { freq: 8 }),
  type: fc.option(fc.constantFrom('text/csv', 'application/octet-stream', 'text/plain; charset=latin1', 'multipart/mixed; boundary=inner', 'garbage'), { freq: 2 }),
  extraHeaders: fc.array(fc.constantFrom('Content-Transfer-Encoding: base64', 'X-Odd: 1', 'Content-Length: 5', ' folded: header', 'No colon here', `Long: ${'h'.repeat(9000)}`), { maxLength: 2 }),
  content,
});

const wild = fc.record({
    boundary: boundaries,
    headerBoundary: fc.oneof({ arbitrary: fc.constant<string | null>(null), weight: 6 }, { arbitrary: boundaries, weight: 1 }),
    contentType: fc.constantFrom('multipart/form-data; boundary=%B', 'multipart/form-data; boundary="%B"', 'multipart/form-data', 'multipart/form-data; boundary=', 'MULTIPART/FORM-DATA; BOUNDARY=%B', 'multipart/mixed; boundary=%B', 'multipart/form-data; charset=utf-8; boundary=%B', 'text/csv', ''),
    parts: fc.array(part, { maxLength: 8 }),
    newline: fc.constantFrom('\r\n', '\r\n', '\r\n', '\n'),
    preamble: fc.constantFrom('', '', 'preamble text\r\n', '\r\n'),
    ending: fc.constantFrom('close', 'close', 'close', 'none', 'no-dashes', 'garbage'),
    cut: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { freq: 4 }),
  });

/** A well-formed upload of the good file, with other fields (before or after it) at most. */
const fieldPart = fc.record({
  disposition: fc.constantFrom('form-data; name="note"', 'form-data; name="dryRun"', 'form-data; name="x"; filename=""'),
  type: fc.constant(null),
  extraHeaders: fc.constant<string[]>([]),
  content: fc.constantFrom(Buffer.from('true'), Buffer.from('')),
});
const filePart = fc.record({
  disposition: fc.constantFrom('form-data; name="file"; filename="day.csv"', 'form-data; name="file"; filename="日.csv"', 'form-data; name=file; filename=day.csv'),
  type: fc.constantFrom('text/csv', 'application/octet-stream', null),
  extraHeaders: fc.constant<string[]>([]),
  content: fc.constant(goodCsv),
});
const tidy = fc.record({
  boundary: fc.constantFrom('fuzzBoundary', '----WebKitFormBoundary7MA4YWxkTrZu0gW', 'x'.repeat(70)),
  headerBoundary: fc.constant(null),
  contentType: fc.constantFrom('multipart/form-data; boundary=%B', 'multipart/form-data; boundary="%B"'),
  parts: fc.tuple(fc.array(fieldPart, { maxLength: 2 }), filePart, fc.array(fieldPart, { maxLength: 2 })).map(([a, f, b]) => [...a, f, ...b]),
  newline: fc.constant('\r\n'),
  preamble: fc.constantFrom('', 'preamble text\r\n'),
  ending: fc.constant('close'),
  cut: fc.constant(null),
});

/**
 * A multipart upload as a client might botch it: any boundary (or none, or another than the
 * body uses), parts without headers or with odd ones, other fields, several files, LF-only line
 * breaks, a missing end, a cut or garbage around the parts; a third are well formed.
 */
export const rawUpload: fc.Arbitrary<RawUpload> = fc
  .oneof({ arbitrary: wild, weight: 2 }, { arbitrary: tidy, weight: 1 })
  .map(({ boundary, headerBoundary, contentType, parts, newline: nl, preamble, ending, cut }) => {
    const chunks: Buffer[] = [Buffer.from(preamble)];
    for (const p of parts) {
      const headers = [p.disposition && `Content-Disposition: ${p.disposition}`, p.type && `Content-Type: ${p.type}`, ...p.extraHeaders].filter(Boolean);
      chunks.push(Buffer.from(`--${boundary}${nl}${headers.map((h) => `${h}${nl}`).join('')}${nl}`), p.content, Buffer.from(nl));
    }
    chunks.push(Buffer.from({ close: `--${boundary}--${nl}`, none: '', 'no-dashes': `--${boundary}${nl}`, garbage: `--${boundary}--${nl}trailing garbage\x00\xff` }[ending], 'latin1'));
    let body = Buffer.concat(chunks);
    if (cut !== null) body = body.subarray(0, Math.floor(cut * body.length));
    const type = contentType.replace('%B', headerBoundary ?? boundary);
    return { contentType: type === '' ? undefined : type, body };
  });
