import {existsSync, readFileSync} from 'node:fs';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {formulaName} from '../../source/calculations/calculation.js';
import {calculations} from '../../source/calculations/registry.js';
import {shippedRulesPath} from '../../source/rules/load.js';

const policyText = readFileSync(shippedRulesPath(), 'utf8');
const usedByPolicy = calculations.filter((calculation) => new RegExp(`\\b${formulaName(calculation)}\\(`).test(policyText)).map(({name}) => ({name}));

describe('reference tests for the calculations the shipped policy calls', () => {
	it('finds the calculations the policy calls', () => {
		expect(usedByPolicy.map(({name}) => name).sort()).toEqual(expect.arrayContaining(['derating', 'dissipation', 'forward-voltage', 'light-current', 'photodiode', 'threshold']));
	});

	it.each(usedByPolicy)('$name has a reference test file', ({name}) => {
		expect(existsSync(join('tests', 'references', `${name}.test.ts`))).toBe(true);
	});
});
