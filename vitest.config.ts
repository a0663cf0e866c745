import {defineConfig} from 'vitest/config';

export default defineConfig({
	test: {
		include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
		globalSetup: ['./tests/helpers/build-bundle.ts'],
		env: {CI: 'false', CONTINUOUS_INTEGRATION: 'false'},
		reporters: ['default', './tests/helpers/plain-summary-reporter.ts'],
		testTimeout: 20_000,
		// Vitest's default is one worker fewer than the cores: one worker on a 2-core machine.
		maxWorkers: 2,
	},
});
