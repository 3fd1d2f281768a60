import type { Response, Test } from 'supertest';

/** What a fuzz request got back: status, content type and the raw text (an event stream's first bytes). */
export interface Answer {
  status: number;
  type: string;
  text: string;
  json: unknown;
}

// A stack trace names the server's files; fuzzed input echoed in a message never holds these.
const STACK_MARKS = [process.cwd(), 'node_modules/', 'node:internal', '"stack"'];

/**
 * Sends a request and reads its answer as text whatever its type, so every answer can be checked
 * for a stack trace. An event stream never ends: its first bytes are read, then it is hung up.
 */
export async function send(test: Test): Promise<Answer> {
  const res: Response = await test.buffer(true).parse((raw, done) => {
    const stream = raw as unknown as NodeJS.ReadableStream & { headers: Record<string, string>; destroy(): void };
    const chunks: Buffer[] = [];
    const eventStream = String(stream.headers['content-type'] ?? '').startsWith('text/event-stream');
    stream.on('data', (chunk: Buffer) => {
      chunks.push(Buffer.from(chunk));
      if (eventStream) {
        stream.destroy();
        done(null, Buffer.concat(chunks).toString('utf8'));
      }
    });
    stream.on('end', () => done(null, Buffer.concat(chunks).toString('utf8')));
    stream.on('error', (err: Error) => done(err, null));
  });
  const text = typeof res.body === 'string' ? res.body : '';
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    json = undefined;
  }
  return { status: res.status, type: String(res.headers['content-type'] ?? ''), text, json };
}

/**
 * The fuzz suite's property of every answer: never a 5xx; a 4xx is JSON `{error:{code, message}}`;
 * no answer carries a stack trace. Returns the problem, or null when the answer is sound.
 */
export function problemOf(answer: Answer): string | null {
  if (answer.status >= 500) return `answered ${answer.status}`;
  if (STACK_MARKS.some((mark) => answer.text.includes(mark))) return 'the body carries a stack trace';
  if (answer.status >= 400) {
    const error = (answer.json as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
    if (!answer.type.startsWith('application/json')) return `a ${answer.status} that is not JSON (${answer.type || 'no type'})`;
    if (typeof error?.code !== 'string' || typeof error.message !== 'string' || error.message === '') {
      return `a ${answer.status} without {error:{code, message}}`;
    }
  }
  return null;
}

/**
 * Throws (failing the property) with the request and what came back when the answer is unsound;
 * `logged` gives the server's own record of a 500 (its stack stays in the test output only).
 */
export function expectSound(answer: Answer, request: string, logged?: () => string): void {
  const problem = problemOf(answer);
  if (!problem) return;
  const cause = answer.status >= 500 && logged ? `\nlogged by the server: ${logged().slice(0, 1500)}` : '';
  throw new Error(`${request}: ${problem}\n${answer.text.slice(0, 600)}${cause}`);
}
