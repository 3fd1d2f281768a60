// Runs test files in name order, so a fixture's neighbour is known (late → later).
const Sequencer = require('@jest/test-sequencer').default;
module.exports = class ByName extends Sequencer {
  sort(tests) {
    return [...tests].sort((a, b) => a.path.localeCompare(b.path));
  }
};
