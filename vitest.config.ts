import {defineConfig} from 'vitest/config';

export default defineConfig({
	test: {
		include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
		globalSetup: ['./tests/helpers/build-bundle.ts'],
		env: {CI: 'false', CONTINUOUS_INTEGRATION: 'false'},
		reporters: ['default', './tests/helpers/plain-summary-reporter.ts'],
		testTimeout: 20_000,
	},
});
