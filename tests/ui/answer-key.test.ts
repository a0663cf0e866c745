import {describe, expect, it} from 'vitest';
import {readAnswerKey} from '../../source/ui/answer-key.js';
import {eachLine, type Arrival} from '../../source/ui/text-buffer.js';

const answers = {y: 'yes', n: 'no', a: 'not_applicable'} as const;
const alone: Arrival = {alone: true};
const inChunk: Arrival = {alone: false};

// The rule (docs/decisions.md, "One key answers one question"): only the question's own key,
// pressed alone, with no typed text held, answers; everything printable else is held.
describe('readAnswerKey', () => {
	const valid = [
		{name: 'y alone', input: 'y', stray: '', arrival: alone, answer: 'yes'},
		{name: 'Y alone (shift)', input: 'Y', stray: '', arrival: alone, answer: 'yes'},
		{name: 'n alone', input: 'n', stray: '', arrival: alone, answer: 'no'},
		{name: 'a alone', input: 'a', stray: '', arrival: alone, answer: 'not_applicable'},
	];
	it.each(valid)('$name answers $answer', ({input, stray, arrival, answer}) => {
		expect(readAnswerKey(answers, stray, input, {}, arrival)).toEqual({kind: 'answer', answer});
	});

	const refused = [
		{name: 'y of a chunk', input: 'y', stray: '', arrival: inChunk, held: 'y'},
		{name: 'y after typed text', input: 'y', stray: 'b', arrival: alone, held: 'by'},
		{name: 'another letter', input: 'S', stray: '', arrival: alone, held: 'S'},
		{name: 'a space', input: ' ', stray: 'by', arrival: alone, held: 'by '},
		{name: 'a digit of a chunk', input: '3', stray: 'ST-', arrival: inChunk, held: 'ST-3'},
		{name: 'a key name no question has', input: 'constructor', stray: '', arrival: alone, held: 'constructor'},
	];
	it.each(refused)('$name is refused and held as "$held"', ({input, stray, arrival, held}) => {
		expect(readAnswerKey(answers, stray, input, {}, arrival)).toEqual({kind: 'refused', stray: held});
	});

	it('keeps at most 60 characters of held text', () => {
		const read = readAnswerKey(answers, 'x'.repeat(60), 'y', {}, alone);
		expect(read).toEqual({kind: 'refused', stray: 'x'.repeat(60)});
	});

	const other = [
		{name: 'Backspace with text held clears it', input: '', stray: 'by', key: {backspace: true}, kind: 'cleared'},
		{name: 'Delete with text held clears it', input: '', stray: 'by', key: {delete: true}, kind: 'cleared'},
		{name: 'Backspace with nothing held is left to the screen', input: '', stray: '', key: {backspace: true}, kind: 'other'},
		{name: 'Enter is left to the screen', input: '', stray: 'by', key: {}, kind: 'other'},
		{name: 'a control character is left to the screen', input: '\t', stray: '', key: {}, kind: 'other'},
	];
	it.each(other)('$name', ({input, stray, key, kind}) => {
		expect(readAnswerKey(answers, stray, input, key, alone).kind).toBe(kind);
	});
});

describe('eachLine marks how each key arrived', () => {
	const cases = [
		{name: 'one key', chunk: 'y', keys: [['y', false, true]]},
		{name: 'a word', chunk: 'by', keys: [['b', false, false], ['y', false, false]]},
		{name: 'a key and Enter', chunk: 'y\r', keys: [['y', false, false], ['', true, false]]},
		{name: 'CR LF as one Enter', chunk: 'n\r\n', keys: [['n', false, false], ['', true, false]]},
	] as const;
	it.each(cases)('$name', ({chunk, keys}) => {
		const seen: Array<[string, boolean, boolean]> = [];
		eachLine(chunk, {return: false}, (input, key, arrival) => seen.push([input, Boolean(key.return), arrival.alone]));
		expect(seen).toEqual(keys);
	});
});
