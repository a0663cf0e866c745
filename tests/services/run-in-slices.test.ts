import {describe, expect, it} from 'vitest';
import {runInSlices} from '../../source/services/run-in-slices.js';
import {finish, type Steps} from '../../source/shared/steps.js';

/** Work of `count` steps, each busy for `ms` milliseconds, that returns the sum 1 + 2 + … + count and records how many steps ran. */
function* busySteps(count: number, ms: number, ran: {steps: number}): Steps<number> {
	let sum = 0;
	for (let step = 1; step <= count; step += 1) {
		const until = performance.now() + ms;
		while (performance.now() < until);
		sum += step;
		ran.steps += 1;
		if (step < count) yield;
	}
	return sum;
}

describe('runInSlices', () => {
	it('gives the result finish gives', async () => {
		// 1 + 2 + … + 20 = 20 × 21 / 2 = 210 (hand arithmetic).
		expect(await runInSlices(busySteps(20, 1, {steps: 0}))).toBe(210);
		expect(finish(busySteps(20, 1, {steps: 0}))).toBe(210);
	});

	it('lets the event loop turn while long work runs: a timer fires before the work ends', async () => {
		const ran = {steps: 0};
		let stepsWhenTimerFired = -1;
		setTimeout(() => (stepsWhenTimerFired = ran.steps), 0);
		// 30 steps of 20 ms: 600 ms of work; the timer is due at once and must not wait for all of it.
		await runInSlices(busySteps(30, 20, ran));
		expect(ran.steps).toBe(30);
		expect(stepsWhenTimerFired).toBeGreaterThanOrEqual(0);
		expect(stepsWhenTimerFired).toBeLessThan(5);
	});

	it('stops between slices once aborted, and gives undefined', async () => {
		const ran = {steps: 0};
		const stop = new AbortController();
		setTimeout(() => stop.abort(), 50);
		expect(await runInSlices(busySteps(100, 20, ran), stop.signal)).toBeUndefined();
		// Aborted after about 50 ms of 2,000 ms of work: far from every step ran.
		expect(ran.steps).toBeLessThan(20);
	});
});
