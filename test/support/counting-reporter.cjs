// Mocha's spec output, plus the counts written to a file for the summary line of `npm test`.
const { writeFileSync } = require('node:fs');
const Mocha = require('mocha');

class CountingReporter extends Mocha.reporters.Spec {
  constructor(runner, options) {
    super(runner, options);
    runner.once('end', () => {
      const file = process.env.RIFFLE_TEST_COUNTS_FILE;
      if (file)
        writeFileSync(
          file,
          JSON.stringify({ passed: runner.stats.passes, failed: runner.stats.failures, pending: runner.stats.pending }),
        );
    });
  }
}

module.exports = CountingReporter;
