import type {Problem} from '../../shared/problems.js';
import type {Result} from '../../shared/result.js';
import {planProblemWords} from '../../ui/planner/plan-problem-words.js';

/**
 * A place in a results file in words: `steps.1.stopped_in` is "step 2 of the results: stopped in"
 * (the second entry of the steps list), `tested_by.name` is "tested by: name". Places in the plan
 * (`devices.3.…`) are worded as the planner words them.
 */
export function resultsPlaceWords(text: string): string {
	return planProblemWords(text)
		.replaceAll(/\bsteps\.(\d+)((?:\.[a-z_]+)*)/g, (_, index: string, rest: string) => `step ${Number(index) + 1} of the results${rest ? `: ${rest.slice(1).replaceAll(/[._]/g, ' ')}` : ''}`)
		.replaceAll(/\b([a-z]+(?:_[a-z]+)*)\.([a-z_]+)\b/g, (_, head: string, tail: string) => `${head.replaceAll('_', ' ')}: ${tail.replaceAll('_', ' ')}`);
}

/** A results file's problems with their places in words, so no message shows a dotted path. */
export function withResultsWords<T>(result: Result<T, Problem>): Result<T, Problem> {
	if (result.ok) return result;
	return {ok: false, errors: result.errors.map((found) => (found.field === undefined ? found : {...found, field: resultsPlaceWords(found.field)}))};
}
