import { DateTime } from 'luxon';

import { resolveStart } from '../../shared/exam-list/start-time';
import { instantOf, zonedFormatter } from '../../shared/turnover/zoned-time';
import { syntheticDay } from './engine.bench';

const ZONE = 'America/Chicago';
/** Days whose clocks change in the zone (spring forward, fall back), so skipped and repeated times are among the inputs. */
const DST_DAYS = ['2027-03-14', '2027-11-07'];
const ROUNDS = 5;

interface Contest<I, O> {
  name: string;
  inputs: readonly I[];
  fast: (input: I) => O;
  luxon: (input: I) => O;
}

/**
 * The hand-written time helpers against luxon doing the same work, on the engine bench's
 * 10,000-exam day (each exam's start and end formatted, then parsed back) and on every start
 * time of the largest import (2,000 rows, HH:MM in site time, on days the clocks change). They stay only while this shows
 * them well ahead (DEVELOPERS.md, Benchmarks); luxon stays the reference the DST specs check.
 *
 * @example
 * for (const line of await benchTime()) console.log(line);
 */
export async function benchTime(): Promise<string[]> {
  const instants = syntheticDay().exams.flatMap((exam) => {
    const start = Date.parse(exam.start);
    return [start, start + exam.durationMinutes * 60_000];
  });
  const texts = instants.map(zonedFormatter(ZONE));
  const startTimes = Array.from({ length: 2_000 }, (_, i) => {
    const minute = (i * 5) % (24 * 60);
    const hhmm = `${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}`;
    return { date: DST_DAYS[i % 2]!, hhmm };
  });
  return [
    contest({
      name: 'format an instant in the site zone',
      inputs: instants,
      fast: (ms) => zonedFormatter(ZONE)(ms),
      luxon: (ms) => DateTime.fromMillis(ms, { zone: ZONE }).toISO({ suppressMilliseconds: true }),
    }),
    contest({
      name: 'parse an ISO time with its offset',
      inputs: texts,
      fast: (iso) => instantOf(iso, ZONE),
      luxon: (iso) => DateTime.fromISO(iso, { zone: ZONE }).toMillis(),
    }),
    contest({
      name: 'resolve an import start HH:MM',
      inputs: startTimes,
      fast: ({ date, hhmm }) => {
        const resolved = resolveStart(hhmm, { date, timezone: ZONE });
        return resolved.ok ? `${resolved.start}${resolved.warning ? ' twice' : ''}` : 'none';
      },
      luxon: ({ date, hhmm }) => {
        // A skipped time has no reading at that wall time; a repeated one takes its first.
        const readings = DateTime.fromISO(`${date}T${hhmm}`, { zone: ZONE }).getPossibleOffsets();
        const first = readings.reduce((a, b) => (b.toMillis() < a.toMillis() ? b : a));
        if (first.toFormat('HH:mm') !== hhmm) return 'none';
        return `${first.toISO({ suppressMilliseconds: true })}${readings.length > 1 ? ' twice' : ''}`;
      },
    }),
  ];
}

function contest<I, O>({ name, inputs, fast, luxon }: Contest<I, O>): string {
  const differ = inputs.filter((input) => fast(input) !== luxon(input)).length;
  const fastMs = best(() => inputs.forEach(fast));
  const luxonMs = best(() => inputs.forEach(luxon));
  return (
    `time: ${name} × ${inputs.length} — hand-written ${fastMs.toFixed(1)} ms, luxon ${luxonMs.toFixed(1)} ms ` +
    `(${(luxonMs / fastMs).toFixed(0)}×)${differ ? ` — ${differ} ANSWERS DIFFER` : ', same answers'}`
  );
}

/** Best of a few warm rounds (the first, untimed run above warmed caches and the JIT). */
function best(run: () => void): number {
  let fastest = Infinity;
  for (let round = 0; round < ROUNDS; round++) {
    const t0 = performance.now();
    run();
    fastest = Math.min(fastest, performance.now() - t0);
  }
  return fastest;
}
