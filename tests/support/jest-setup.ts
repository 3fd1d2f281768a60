/**
 * Jest 30 fails the test or hook during which a promise rejection goes unhandled. These root
 * hooks make sure a rejection a test or its cleanup sets off lands while that file still runs:
 * they wait for the event loop to drain what was started (Node reports a rejection only after
 * the microtasks of its turn). Otherwise a rejection from, say, a Knex query on a pool an
 * `afterAll` destroyed surfaces after the file ended: it fails some other file or ends a worker.
 *
 * Root hooks run after the hooks of a file's `describe` blocks, so the cleanup is covered too.
 */
const settle = async () => {
  for (let turn = 0; turn < 3; turn++) await new Promise((resolve) => setImmediate(resolve));
};

// Explicit timeouts: three turns of the event loop are quick, but a busy machine may stall them.
afterEach(settle, 10_000);
afterAll(settle, 10_000);
