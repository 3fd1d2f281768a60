import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '..');
/** What the client build reads; a build older than any of these would serve yesterday's code. */
const BUILD_INPUTS = ['projects/turnwise/src', 'shared', 'angular.json', 'tsconfig.json', 'package-lock.json'];

function newestChange(entry: string): number {
  if (!fs.existsSync(entry)) return 0;
  const stat = fs.statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const name of fs.readdirSync(entry)) newest = Math.max(newest, newestChange(path.join(entry, name)));
  return newest;
}

/**
 * True when the built client in `clientDir` is newer than every source it is built from.
 *
 * @example
 * if (!clientBuildIsFresh(clientDir)) buildClient();
 */
export function clientBuildIsFresh(clientDir: string, root: string = ROOT): boolean {
  const index = path.join(clientDir, 'index.html');
  if (!fs.existsSync(index)) return false;
  const built = fs.statSync(index).mtimeMs;
  return BUILD_INPUTS.every((input) => newestChange(path.join(root, input)) <= built);
}

/**
 * Builds the client (production configuration) unless the existing build is fresh, saying which;
 * returns 'existing build' or 'fresh build'. Throws when the build fails.
 */
export function ensureClientBuild(clientDir: string, log: (line: string) => void = console.log): 'existing build' | 'fresh build' {
  if (clientBuildIsFresh(clientDir)) {
    log('The built client is newer than its sources: not rebuilding.');
    return 'existing build';
  }
  log('Building the client (about a minute the first time)…');
  const result = spawnSync('npm', ['run', '--silent', 'build'], { cwd: ROOT, stdio: 'inherit' });
  if (result.status !== 0) throw new Error('The client build failed; see the output above.');
  return 'fresh build';
}
