/**
 * Growth, not speed: the time for an input of about 100 kB against one of about 1 kB (or the
 * smallest valid file, when the file has a fixed part larger than that), as a ratio of the
 * fastest of several runs (the fastest is the least disturbed by a busy machine), divided by
 * the ratio of their sizes. Linear work gives about 1 (less when a fixed cost dominates the
 * small input); quadratic work gives about the size ratio (100 for 1 kB against 100 kB).
 */
export function growthOverLinear(make: (bytes: number) => string, run: (input: string) => unknown): {factor: number; timeRatio: number; sizeRatio: number} {
	const small = make(1_000);
	const large = make(100_000);
	const fastest = (input: string, rounds: number) => {
		let best = Number.POSITIVE_INFINITY;
		for (let round = 0; round < rounds; round += 1) {
			const start = performance.now();
			run(input);
			best = Math.min(best, performance.now() - start);
		}
		return best;
	};
	fastest(small, 5);
	const timeRatio = fastest(large, 3) / Math.max(fastest(small, 30), 0.05);
	const sizeRatio = large.length / small.length;
	return {factor: timeRatio / sizeRatio, timeRatio, sizeRatio};
}

/** The bound on growthOverLinear's factor: ten times linear, generous for a busy 2-core machine, well below quadratic for a size ratio of 50 or more. */
export const growthBound = 10;
