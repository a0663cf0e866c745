import type {FlipPoint, WhatIf} from '../rules/evaluate/what-if.js';
import {fixWords, flipWords} from './what-if-text.js';

/** A flip point as JSON: its figures (SI and text) and its words. */
function flipJson(flip: FlipPoint, words: (flip: FlipPoint) => string) {
	return {...flip, words: words(flip)};
}

/** The what-if analysis as plain JSON data, each flip point with its words beside its figures. */
export function whatIfToJson(result: WhatIf) {
	return {
		closest: result.closest.map((call) => ({check: call.check, flip: flipJson(call.flip, flipWords)})),
		nearest: result.nearest.map((call) => ({check: call.check, flip: flipJson(call.flip, flipWords)})),
		fixes: result.fixes.map((fix) => ({check: fix.check, verdict: fix.verdict, options: fix.options.map((option) => flipJson(option, fixWords))})),
		checks: result.checks.map((entry) => ({check: entry.check, verdict: entry.verdict, flips: entry.flips.map((flip) => flipJson(flip, flipWords))})),
	};
}
