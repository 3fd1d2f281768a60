// Worker-thread entry for "make the day fit": the server is TypeScript run by tsx (and by
// ts-jest in tests, which does not reach worker threads), so the worker registers tsx itself first.
require('tsx/cjs/api').register();
module.exports = require('./day-fit-task.ts');
