import { benchBundle } from './bundle.bench';
import { benchDayFit } from './day-fit.bench';
import { benchEngine } from './engine.bench';
import { benchFixes } from './fixes.bench';
import { benchHl7 } from './hl7.bench';
import { benchImport } from './import.bench';
import { benchPgProcesses } from './pg-processes.bench';
import { benchPlan } from './plan.bench';
import { benchTime } from './time.bench';
import { benchTimeline } from './timeline.bench';

/** `npm run bench`: prints the figures; nothing here is asserted. */
async function main(): Promise<void> {
  console.log(`Turnwise benchmarks — Node ${process.version}, ${new Date().toISOString()}`);
  // The bundle bench goes first: it rebuilds a stale client, which the timeline bench then drives.
  for (const bench of [benchBundle, benchEngine, benchTime, benchFixes, benchDayFit, benchImport, benchPlan, benchPgProcesses, benchHl7, benchTimeline]) {
    for (const line of await bench()) console.log(line);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
