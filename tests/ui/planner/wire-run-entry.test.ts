import {describe, expect, it} from 'vitest';
import {entryProblem, parseRun, parseWireSize, runSummary} from '../../../source/ui/planner/wire-run-entry.js';

// How a technician writes a copper size: a gauge number with "AWG" before or after it, or a
// cross-section in square millimetres (common practice; the plan file's keys are awg and cross_section).
describe('the wire run form', () => {
	it.each([
		{entry: 'AWG 26', size: {awg: 26}},
		{entry: '26 AWG', size: {awg: 26}},
		{entry: 'awg22', size: {awg: 22}},
		{entry: '#24 awg', size: {awg: 24}},
		{entry: '18', size: {awg: 18}},
		{entry: '0.5 mm²', size: {cross_section: '0.5 mm^2'}},
		{entry: '1.5 mm^2', size: {cross_section: '1.5 mm^2'}},
		{entry: '.75mm2', size: {cross_section: '.75 mm^2'}},
	])('reads the size $entry', ({entry, size}) => {
		expect(parseWireSize(entry)).toEqual(size);
	});

	it.each(['262 m', '0.5', '0.5 mm', 'AWG', 'twenty'])('refuses %s as a size, in words', (entry) => {
		expect(parseWireSize(entry)).toBeUndefined();
		expect(entryProblem('size', entry)).toBe(`wire size: give the gauge as AWG 26, or the cross-section as 0.5 mm² ("${entry}" is neither)`);
	});

	it.each([
		{name: 'size and length', entries: {size: 'AWG 26', length: '262 m', conductors: ''}, result: {ok: true, run: {awg: 26, length: '262 m'}}},
		{name: 'with conductors', entries: {size: '0.5 mm²', length: '12 m', conductors: '4'}, result: {ok: true, run: {cross_section: '0.5 mm^2', length: '12 m', conductors: 4}}},
		{name: 'all empty: no run', entries: {size: '', length: '', conductors: ''}, result: {ok: true, run: undefined}},
		{name: 'a size alone', entries: {size: 'AWG 26', length: '', conductors: ''}, result: {ok: false, at: 1, message: 'length to the next device: give the cable length with its unit, e.g. 1.5 m'}},
		{name: 'a length alone', entries: {size: '', length: '262 m', conductors: ''}, result: {ok: false, at: 0, message: 'wire size: give the gauge as AWG 26, or the cross-section as 0.5 mm²'}},
		{name: 'conductors not a number', entries: {size: 'AWG 26', length: '2 m', conductors: 'two'}, result: {ok: false, at: 2, message: 'conductors carrying the loop: a whole number such as 2 ("two" is not)'}},
	])('takes the run as a whole: $name', ({entries, result}) => {
		expect(parseRun(entries)).toEqual(result);
	});

	it.each([
		{run: {awg: 22, length: '1.5 m'}, shown: 'AWG 22 · 1.5 m'},
		{run: {cross_section: '0.5 mm^2', length: '12 m', conductors: 2}, shown: '0.5 mm^2 · 12 m'},
		{run: {awg: 22, length: '3 m', conductors: 4}, shown: 'AWG 22 · 3 m · 4 conductors'},
		{run: undefined, shown: '(none)'},
	])('shows $shown', ({run, shown}) => {
		expect(runSummary(run)).toBe(shown);
	});
});
