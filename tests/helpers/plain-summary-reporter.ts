import type {Reporter, TestModule} from 'vitest/node';

/**
 * Prints the plain closing line `N passed, N failed` that CI reads; unhandled errors count
 * as failures so the line agrees with the exit code.
 */
export default class PlainSummaryReporter implements Reporter {
	onTestRunEnd(testModules: ReadonlyArray<TestModule>, unhandledErrors: ReadonlyArray<unknown>): void {
		let passed = 0;
		let failed = unhandledErrors.length;
		let skipped = 0;
		for (const module of testModules) {
			if (module.state() === 'failed' && [...module.children.allTests()].length === 0) failed += 1;
			for (const test of module.children.allTests()) {
				const state = test.result().state;
				if (state === 'passed') passed += 1;
				else if (state === 'failed') failed += 1;
				else skipped += 1;
			}
		}
		process.stdout.write(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}\n`);
	}
}
