import { benchBundle } from './bundle.bench';
import { benchDayFit } from './day-fit.bench';
import { benchEngine } from './engine.bench';
import { benchFixes } from './fixes.bench';
import { benchHl7 } from './hl7.bench';
import { benchImport } from './import.bench';
import { benchPgProcesses } from './pg-processes.bench';
import { benchPlan } from './plan.bench';
import { benchPlanDatabases } from './plan-databases.bench';
import { benchRoster } from './roster.bench';
import { benchTime } from './time.bench';
import { benchTimeline } from './timeline.bench';

/**
 * `npm run bench`: prints the figures; nothing here is asserted. Words after it pick benches by
 * name (`npx tsx tests/bench/run.ts PlanDatabases PgProcesses`: those whose function name holds
 * one of them, any case); none runs them all.
 */
async function main(): Promise<void> {
  console.log(`Turnwise benchmarks — Node ${process.version}, ${new Date().toISOString()}`);
  const only = process.argv.slice(2).map((word) => word.toLowerCase());
  // The bundle bench goes first: it rebuilds a stale client, which the timeline bench then drives.
  const benches = [benchBundle, benchEngine, benchTime, benchFixes, benchDayFit, benchRoster, benchImport, benchPlan, benchPlanDatabases, benchPgProcesses, benchHl7, benchTimeline];
  for (const bench of benches.filter((b) => only.length === 0 || only.some((word) => b.name.toLowerCase().includes(word)))) {
    for (const line of await bench()) console.log(line);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
