import { benchEngine } from './engine.bench';
import { benchImport } from './import.bench';
import { benchTimeline } from './timeline.bench';

/** `npm run bench`: prints the figures; nothing here is asserted. */
async function main(): Promise<void> {
  console.log(`Turnwise benchmarks — Node ${process.version}, ${new Date().toISOString()}`);
  for (const bench of [benchEngine, benchImport, benchTimeline]) {
    for (const line of await bench()) console.log(line);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
