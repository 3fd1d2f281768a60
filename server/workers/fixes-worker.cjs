// Worker-thread entry for suggested fixes: the server is TypeScript run by tsx (and by ts-jest
// in tests, which does not reach worker threads), so the worker registers tsx itself first.
require('tsx/cjs/api').register();
module.exports = require('./fixes-task.ts');
