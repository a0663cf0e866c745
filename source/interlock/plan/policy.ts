import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {dimensions, type Dimension} from '../../quantities/dimensions.js';
import {problem, type Problem} from '../../shared/problems.js';
import {failure, success, type Result} from '../../shared/result.js';

/** The interlock policy, read from the rule file's policy values; every quantity in SI. */
export type InterlockPolicy = {
	/** Largest time from opening any device until emission has stopped, s. */
	max_response_time: number;
	/** How far below the input's threshold the loop resistance must stay, as a fraction. */
	resistance_margin: number;
	/** Longest time between functional tests, s. */
	test_interval: number;
	/** Longest time limit a bypass may have, s; zero means no bypass is allowed. */
	longest_bypass: number;
};

/** The rule file's policy value behind each field, with the dimension it must have. */
export const interlockPolicyValues: ReadonlyArray<{field: keyof InterlockPolicy; name: string; dimension: Dimension}> = [
	{field: 'max_response_time', name: 'interlock_max_response_time', dimension: 'time'},
	{field: 'resistance_margin', name: 'interlock_resistance_margin', dimension: 'ratio'},
	{field: 'test_interval', name: 'interlock_test_interval', dimension: 'time'},
	{field: 'longest_bypass', name: 'interlock_longest_bypass', dimension: 'time'},
];

/**
 * The interlock policy of a rule file. A value that is missing or of the wrong dimension is
 * named with what it should be, so a site file can add it.
 */
export function interlockPolicy(rules: CompiledRules): Result<InterlockPolicy, Problem> {
	const problems: Problem[] = [];
	const policy: Partial<InterlockPolicy> = {};
	for (const {field, name, dimension} of interlockPolicyValues) {
		const value = rules.policy.get(name);
		const noun = dimensions[dimension].noun;
		if (value === undefined) problems.push(problem('interlock-policy-missing', {name, noun}, {file: rules.file}));
		else if (value.dimension !== dimension) problems.push(problem('interlock-policy-dimension', {name, noun, actual: dimensions[value.dimension].noun}, {file: rules.file}));
		else policy[field] = value.si;
	}
	return problems.length > 0 ? failure(problems) : success(policy as InterlockPolicy);
}
