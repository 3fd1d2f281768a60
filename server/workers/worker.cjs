// Worker-thread entry: the server is TypeScript run by tsx (and by ts-jest in tests, which does
// not reach worker threads), so the worker registers tsx itself before loading its tasks.
require('tsx/cjs/api').register();
module.exports = require('./tasks.ts');
