#!/usr/bin/env bash
# The API test suite a second time, on PostgreSQL (`npm run test:pg`, and CI after `npm test`):
# installs Debian's server when missing, starts a throwaway cluster in a temporary folder on a
# free loopback port, runs tests/api with TEST_DATABASE_URL pointing at it, prints a plain
# "N passed, N failed" line, and stops the cluster and removes its folder however the run ends.
set -euo pipefail
cd "$(dirname "$0")/.."

if ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then
  if [ "$(id -u)" -ne 0 ]; then echo "PostgreSQL is not installed (apt-get install -y postgresql, as root)" >&2; exit 1; fi
  echo "== installing PostgreSQL from Debian"
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
fi
bin="$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1)"

dir="$(mktemp -d "${TMPDIR:-/tmp}/turnwise-pg-XXXXXX")"
# initdb refuses to run as root: the cluster then belongs to the postgres user
as_owner() { if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi; }
[ "$(id -u)" -eq 0 ] && chown postgres "$dir"
port="$(node -e "const s = require('net').createServer().listen(0, '127.0.0.1', () => { console.log(s.address().port); s.close(); })")"

stop() {
  as_owner "$bin/pg_ctl" -D "$dir/data" -m immediate stop >/dev/null 2>&1 || true
  rm -rf "$dir"
}
trap stop EXIT

echo "== PostgreSQL $("$bin/postgres" --version | awk '{print $3}') on 127.0.0.1:$port ($dir)"
as_owner "$bin/initdb" -D "$dir/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >"$dir/initdb.log"
# A test cluster: durability off (it is thrown away), connections for jest's workers and the apps' pools.
as_owner "$bin/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -o \
  "-p $port -k $dir -c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200" start >/dev/null

results="$dir/jest.json"
status=0
TEST_DATABASE_URL="postgres://postgres@127.0.0.1:$port/postgres" \
  npx jest -c jest.server.config.js tests/api --json --outputFile="$results" || status=$?
node -e "
  const fs = require('fs');
  if (!fs.existsSync('$results')) { console.log('0 passed, 1 failed (jest produced no results)'); process.exit(1); }
  const j = JSON.parse(fs.readFileSync('$results', 'utf8'));
  const failed = j.numFailedTests + j.numRuntimeErrorTestSuites + (j.numPassedTests === 0 ? 1 : 0);
  console.log('PostgreSQL: ' + j.numPassedTests + ' passed, ' + failed + ' failed');
  process.exit(failed > 0 ? 1 : 0);
" || status=1
# jest can fail the run with every test passed (e.g. a log after a suite ended, from work a test
# left running): say so, since the count above reads green.
if [ "$status" -ne 0 ] && grep -q '"numFailedTests":0' "$results" 2>/dev/null; then
  echo "PostgreSQL: jest exited non-zero with no failed test; see the jest output above (a log after the tests were done?)"
fi
exit $status
