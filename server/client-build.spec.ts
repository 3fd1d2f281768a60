import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { clientBuildIsFresh } from './client-build';

describe('clientBuildIsFresh', () => {
  let root: string;
  let clientDir: string;
  const write = (file: string, at: number) => {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, 'x');
    fs.utimesSync(file, at, at);
  };
  beforeEach(() => {
    root = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-build-'));
    clientDir = path.join(root, 'dist', 'turnwise', 'browser');
    write(path.join(root, 'projects/turnwise/src/app/app.ts'), 1000);
    write(path.join(root, 'shared/turnover/model.ts'), 1000);
    write(path.join(root, 'angular.json'), 1000);
    for (const dir of ['projects/turnwise/src/app', 'projects/turnwise/src', 'projects/turnwise', 'projects', 'shared/turnover', 'shared']) {
      fs.utimesSync(path.join(root, dir), 1000, 1000);
    }
  });
  afterEach(() => fs.rmSync(root, { recursive: true, force: true }));

  it('returns false when there is no build', () => {
    expect(clientBuildIsFresh(clientDir, root)).toBe(false);
  });

  it('returns true when the build is newer than every source', () => {
    write(path.join(clientDir, 'index.html'), 2000);
    expect(clientBuildIsFresh(clientDir, root)).toBe(true);
  });

  it('returns false when one source, however deep, changed after the build', () => {
    write(path.join(clientDir, 'index.html'), 2000);
    write(path.join(root, 'shared/turnover/model.ts'), 3000);
    expect(clientBuildIsFresh(clientDir, root)).toBe(false);
  });
});
