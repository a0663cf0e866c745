import type {InterlockTestBody} from '../../records/record-schema.js';
import {localDay} from './load-results.js';

/**
 * How far ahead of this machine's clock a record may be dated and still count: the clock of the
 * machine that recorded it may run a little fast. Beyond this, a record answers nothing.
 */
export const futureAllowanceMs = 5 * 60_000;

/** A location as compared: case and runs of whitespace do not matter ("Room B.112,  bench 3" = "room b.112, bench 3"). */
export function normaliseLocation(text: string): string {
	return text.normalize('NFC').trim().replaceAll(/\s+/g, ' ').toLowerCase();
}

/** An ISO 8601 date-time with its UTC offset (or Z), as records carry `createdAt`. */
const withOffset = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(?:\.\d+)?(?:Z|[+-]\d{2}:\d{2})$/;

/** The absolute instant of a record's `createdAt`, ms since the epoch; NaN when it is not a date-time with an offset. */
export function instantOf(createdAt: string): number {
	return withOffset.test(createdAt) ? Date.parse(createdAt) : Number.NaN;
}

/**
 * Why a test record is dated after `now` (beyond the allowance), or cannot be placed in time;
 * undefined when its dates are not in the future.
 */
export function futureDated(body: Pick<InterlockTestBody, 'createdAt' | 'testedOn'>, now: Date): string | undefined {
	const latest = now.getTime() + futureAllowanceMs;
	const instant = instantOf(body.createdAt);
	if (Number.isNaN(instant)) return `recorded at "${body.createdAt}", which is not a date and time with its UTC offset`;
	if (instant > latest) return `recorded ${body.createdAt}`;
	if (body.testedOn > localDay(new Date(latest))) return `tested ${body.testedOn}`;
	return undefined;
}

/**
 * Orders tests from earliest to latest: by test day, then by the absolute instant each was
 * recorded (never by its local-time text); a failed test counts as the later of two recorded
 * at the same instant, erring to the safe side.
 */
export function compareTests(a: Pick<InterlockTestBody, 'createdAt' | 'testedOn' | 'outcome'>, b: Pick<InterlockTestBody, 'createdAt' | 'testedOn' | 'outcome'>): number {
	if (a.testedOn !== b.testedOn) return a.testedOn < b.testedOn ? -1 : 1;
	const difference = instantOf(a.createdAt) - instantOf(b.createdAt);
	if (difference !== 0 && !Number.isNaN(difference)) return difference;
	return (a.outcome === 'failed' ? 1 : 0) - (b.outcome === 'failed' ? 1 : 0);
}

/** The latest of some tests, as compareTests orders them. */
export function latestTest<T extends {body: InterlockTestBody}>(tests: readonly T[]): T | undefined {
	return [...tests].sort((a, b) => compareTests(a.body, b.body)).at(-1);
}
