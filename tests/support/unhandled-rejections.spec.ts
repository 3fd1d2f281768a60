import { execFileSync } from 'node:child_process';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../..');

interface JestReport {
  success: boolean;
  testResults: { name: string; assertionResults: { title: string; status: string; failureMessages: string[] }[] }[];
}

/** Runs the fixtures in a jest of their own (their failures are the point) and reads its JSON report. */
function runFixtures(): JestReport {
  const args = [require.resolve('jest/bin/jest'), '-c', 'jest.server.config.js', '--roots', '<rootDir>/tests/support', '--testMatch', '**/*.fixture.ts', '--json', '-i', '--testSequencer', '<rootDir>/tests/support/by-name.cjs'];
  try {
    return JSON.parse(execFileSync(process.execPath, args, { cwd: ROOT, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] })) as JestReport;
  } catch (error) {
    return JSON.parse((error as { stdout: string }).stdout) as JestReport; // exit 1: a fixture test failed, as it should
  }
}

describe('an unhandled rejection', () => {
  let report: JestReport;
  beforeAll(() => {
    report = runFixtures();
  }, 120_000);

  const file = (name: string) => report.testResults.find((r) => r.name.endsWith(name))!.assertionResults;

  it('fails the test that caused it, and only that test', () => {
    const tests = file('leaky.fixture.ts');
    expect(tests.map((t) => [t.title, t.status])).toEqual([
      ['leaks a rejection', 'failed'],
      ['runs after the leak', 'passed'],
    ]);
    expect(tests[0]!.failureMessages.join('\n')).toMatch(/lost on purpose/);
  });

  it('set off by a file\'s cleanup fails that file, not the next one, and the run goes on', () => {
    const late = report.testResults.find((r) => r.name.endsWith('late.fixture.ts')) as unknown as { message: string; assertionResults: { status: string }[] };
    expect(late.assertionResults.map((t) => t.status)).toEqual(['passed']);
    expect(late.message).toMatch(/after the cleanup/);
    const next = report.testResults.find((r) => r.name.endsWith('later.fixture.ts')) as unknown as { message: string; assertionResults: { status: string }[] };
    expect([next.message, next.assertionResults.map((t) => t.status)]).toEqual(['', ['passed']]);
  });
});
