import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { CLIENT_DIR } from '../e2e/support/server';
import { ensureClientBuild } from '../../server/client-build';

/**
 * Initial JS of a blank Angular 21 + Material app whose signed-in part is a lazy route, built with
 * this project's production options (issue 8's measurement; the project's own baseline, no source).
 */
const BLANK_APP_BYTES = 283_000;
const TARGET_FACTOR = 1.15;

type Reader = (file: string) => string;

/** Chunks a module imports statically (`import{a}from"./chunk-X.js"`, `import"./chunk-X.js"`), not `import("…")`. */
function staticImports(read: Reader, file: string): string[] {
  return [...read(file).matchAll(/\bimport\s*(?:[\w$*{},\s]+?\s*from\s*)?["']\.\/([\w.-]+\.js)["']/g)].map((m) => m[1]!);
}

/** The files and everything they import statically: what the browser must fetch before running them. */
function closure(read: Reader, entries: string[]): Set<string> {
  const seen = new Set<string>();
  const queue = [...entries];
  while (queue.length > 0) {
    const file = queue.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    queue.push(...staticImports(read, file));
  }
  return seen;
}

/** The scripts index.html loads: the module entry and the chunks it preloads. */
function initialEntries(read: Reader): string[] {
  const html = read('index.html');
  const scripts = [...html.matchAll(/<script[^>]*\bsrc="([^"]+\.js)"/g)].map((m) => m[1]!);
  const preloads = [...html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="([^"]+\.js)"/g)].map((m) => m[1]!);
  return [...scripts, ...preloads];
}

/** The lazy chunk the `sign-in` route loads, read from the route table compiled into the initial code. */
function signInChunk(read: Reader, initial: Set<string>): string | null {
  for (const file of initial) {
    const match = /path:"sign-in"[^}]*?import\("\.\/([\w.-]+\.js)"\)/.exec(read(file));
    if (match) return match[1]!;
  }
  return null;
}

function size(dir: string, files: Set<string>): { raw: number; gzip: number } {
  let raw = 0;
  let gzip = 0;
  for (const file of files) {
    const bytes = fs.readFileSync(path.join(dir, file));
    raw += bytes.length;
    gzip += zlib.gzipSync(bytes).length;
  }
  return { raw, gzip };
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;

export interface SignInBytes {
  initial: { raw: number; gzip: number; files: number };
  /** null when the route table holds no recognisable sign-in route. */
  withRoute: { raw: number; gzip: number; files: number } | null;
}

/** Sizes of what /sign-in needs, read from a production build's browser folder. */
export function measureSignIn(dir: string = CLIENT_DIR): SignInBytes {
  const read: Reader = (file) => fs.readFileSync(path.join(dir, file), 'utf8');
  const initial = closure(read, initialEntries(read));
  const route = signInChunk(read, initial);
  const whole = route ? closure(read, [...initial, route]) : null;
  return {
    initial: { ...size(dir, initial), files: initial.size },
    withRoute: whole ? { ...size(dir, whole), files: whole.size } : null,
  };
}

/**
 * The JS a visitor to /sign-in downloads, from the production build: the initial chunks (what
 * index.html loads, and the figure the target is about) and, with them, the sign-in page's own lazy chunks.
 */
export async function benchBundle(): Promise<string[]> {
  const build = ensureClientBuild(CLIENT_DIR, () => {});
  const { initial, withRoute } = measureSignIn();
  const target = BLANK_APP_BYTES * TARGET_FACTOR;
  return [
    `bundle: sign-in initial JS ${initial.raw} B raw (${kB(initial.raw)}), ${initial.gzip} B gzip, ${initial.files} files (${build}) — ` +
      `${(initial.raw / BLANK_APP_BYTES).toFixed(2)}× a blank Material app with a lazy shell; target ≤ ${kB(target)} raw${initial.raw <= target ? '' : ', OVER TARGET'}`,
    withRoute
      ? `bundle: sign-in route JS with its lazy chunks ${withRoute.raw} B raw (${kB(withRoute.raw)}), ${withRoute.gzip} B gzip, ${withRoute.files} files`
      : 'bundle: sign-in route chunk not found in the route table',
  ];
}
