import {analyseWhatIf} from '../rules/evaluate/what-if.js';
import type {Answers} from '../rules/evaluate/answers.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import type {Evaluation} from '../rules/evaluate/evaluation.js';
import {finding, type Finding} from '../records/findings.js';
import type {RecordBody} from '../records/record-schema.js';
import {sensitivityBody} from '../records/sensitivity-body.js';
import {sameNumber} from './audit-consistency.js';
import {evaluationKey} from '../rules/evaluate/evaluation-key.js';

/**
 * Flip points already worked out in this process, by evaluation key: records of one setup with the
 * same numbers under the same rules are analysed once (the analysis is pure). Bounded: the oldest
 * is dropped first.
 */
const known = new Map<string, ReturnType<typeof sensitivityBody>>();

function computedSensitivity(rules: CompiledRules, answers: Answers, evaluation: Evaluation): ReturnType<typeof sensitivityBody> {
	const key = evaluationKey(rules, answers);
	let found = known.get(key);
	if (!found) {
		found = sensitivityBody(analyseWhatIf(rules, answers, evaluation));
		if (known.size >= 64) known.delete(known.keys().next().value!);
		known.set(key, found);
	}
	return found;
}

function describe(values: readonly number[] | undefined): string {
	return values === undefined || values.length === 0 ? 'no flip point' : values.map((value) => String(value)).join(', ');
}

/**
 * A record signed with the what-if analysis keeps its flip points (the sensitivity section); the
 * audit works the analysis out again from the record's own numbers and rules, and each flip point
 * that differs, is missing or is extra is a finding. Records without the section cost nothing here.
 */
export function sensitivityFindings(body: RecordBody, rules: CompiledRules, answers: Answers, evaluation: Evaluation): Finding[] {
	if (body.sensitivity === undefined) return [];
	const computed = computedSensitivity(rules, answers, evaluation);
	const found: Finding[] = [];
	for (const check of new Set([...Object.keys(computed), ...Object.keys(body.sensitivity)])) {
		const held = body.sensitivity[check] ?? {};
		const worked = computed[check] ?? {};
		for (const input of new Set([...Object.keys(worked), ...Object.keys(held)])) {
			const a = held[input] ?? [];
			const b = worked[input] ?? [];
			if (a.length === b.length && a.every((value, index) => sameNumber(value, b[index]!))) continue;
			found.push(finding('consistency', 'audit-sensitivity-mismatch', {id: check, input, recorded: describe(held[input]), computed: describe(worked[input])}));
		}
	}
	return found;
}
