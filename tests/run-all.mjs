#!/usr/bin/env node
// `npm test`: type-checks server and client, runs every jest suite (server, shared engine, API,
// client components), builds the client and runs the browser tests, then prints one plain line
// "N passed, N failed" summed over all of them. Exits non-zero on any failure or on no tests.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const out = mkdtempSync(join(tmpdir(), 'turnwise-results-'));
const skipE2e = process.argv.includes('--no-e2e');
let passed = 0;
let failed = 0;

function run(title, command, args) {
  console.log(`\n== ${title}`);
  const result = spawnSync(command, args, { stdio: 'inherit', env: process.env });
  return result.status === 0;
}

if (!run('type-check (server, shared, client)', 'npm', ['run', '--silent', 'typecheck'])) failed += 1;

const jestFile = join(out, 'jest.json');
run('jest (server, shared, API, client)', 'npx', ['jest', '--json', `--outputFile=${jestFile}`]);
if (existsSync(jestFile)) {
  const j = JSON.parse(readFileSync(jestFile, 'utf8'));
  passed += j.numPassedTests;
  failed += j.numFailedTests + j.numRuntimeErrorTestSuites;
} else {
  console.log('jest produced no results');
  failed += 1;
}

if (!skipE2e) {
  if (!run('build the client', 'npm', ['run', '--silent', 'build'])) failed += 1;
  const tapFile = join(out, 'e2e.tap');
  run('browser tests (playwright-core + Chromium)', 'node', [
    '--import', 'tsx', '--test', '--test-concurrency=1',
    '--test-reporter=spec', '--test-reporter-destination=stdout',
    '--test-reporter=tap', `--test-reporter-destination=${tapFile}`,
    ...readdirSync('tests/e2e').filter((f) => f.endsWith('.e2e.ts')).sort().map((f) => join('tests/e2e', f)),
  ]);
  const tap = existsSync(tapFile) ? readFileSync(tapFile, 'utf8') : '';
  const pass = /^# pass (\d+)/m.exec(tap);
  const fail = /^# fail (\d+)/m.exec(tap);
  if (pass) {
    passed += Number(pass[1]);
    failed += Number(fail?.[1] ?? 0);
  } else {
    console.log('browser tests produced no results');
    failed += 1;
  }
}

if (passed === 0) failed += 1;
console.log(`\n${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
