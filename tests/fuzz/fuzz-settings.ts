/**
 * The fuzz run's seed and number of cases: fixed by default, so `npm test` is repeatable; set
 * PRELASE_FUZZ_SEED (an integer) and PRELASE_FUZZ_RUNS (the number of in-process cases) to vary them.
 */
const seedText = process.env['PRELASE_FUZZ_SEED'];
const runsText = process.env['PRELASE_FUZZ_RUNS'];

export const fuzzSeed = seedText && /^\d+$/.test(seedText) ? Number(seedText) >>> 0 : 20_261_205;
export const fuzzRuns = runsText && /^\d+$/.test(runsText) ? Number(runsText) : 10_000;
/** Cases run through the bundle to check exit statuses (most share one process: rules validate and audit take many files). */
export const bundleRuns = Math.max(30, Math.round(fuzzRuns / 40));
