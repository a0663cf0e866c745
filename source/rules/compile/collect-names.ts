import {isUnitName} from '../../quantities/engine.js';
import {problem, type Problem} from '../../shared/problems.js';
import type {YamlSource} from '../../shared/yaml-source.js';
import type {NameKind} from './names.js';
import type {RuleFile} from '../file/schema.js';

type Place = {path: Array<string | number>; what: string};

/**
 * Gathers every name a formula may use (inputs, policy values, derived values, tables),
 * reporting duplicate ids and ids that are also unit names.
 */
export function collectNames(rules: RuleFile, source: YamlSource): {names: Map<string, NameKind>; problems: Problem[]} {
	const names = new Map<string, NameKind>();
	const places = new Map<string, Place>();
	const problems: Problem[] = [];
	const claim = (id: string, kind: NameKind | undefined, place: Place) => {
		// Located only when there is a problem: finding a line may mean parsing the YAML again.
		const where = () => ({file: source.file, ...source.locate(place.path), field: place.path.join('.')});
		const first = places.get(id);
		if (first) {
			problems.push(problem('duplicate-id', {id, first: `${first.what} at line ${source.locate(first.path).line}`}, where()));
			return;
		}
		if (isUnitName(id)) problems.push(problem('id-is-unit', {id}, where()));
		places.set(id, place);
		if (kind) names.set(id, kind);
	};
	for (const [id, entry] of Object.entries(rules.policy)) {
		const kind: NameKind = entry.options_of === undefined ? {kind: 'policy', source: 'policy'} : {kind: 'option_list', source: 'policy', choice: entry.options_of};
		claim(id, kind, {path: ['policy', id], what: 'a policy value'});
	}
	for (const id of Object.keys(rules.tables)) claim(id, {kind: 'table', source: 'table'}, {path: ['tables', id], what: 'a table'});
	rules.steps.forEach((step, stepIndex) => {
		step.inputs.forEach((input, index) => {
			const kind: NameKind = input.kind === 'choice' ? {kind: 'choice', source: 'input', options: Object.keys(input.options)} : {kind: input.kind, source: 'input'};
			claim(input.id, kind, {path: ['steps', stepIndex, 'inputs', index, 'id'], what: 'an input'});
		});
		step.confirmations.forEach((confirmation, index) => {
			claim(confirmation.id, undefined, {path: ['steps', stepIndex, 'confirmations', index, 'id'], what: 'a confirmation'});
		});
	});
	rules.derived.forEach((derived, index) => claim(derived.id, {kind: 'derived', source: 'derived'}, {path: ['derived', index, 'id'], what: 'a derived value'}));
	const checkIds = new Map<string, number>();
	rules.checks.forEach((check, index) => {
		const first = checkIds.get(check.id);
		if (first !== undefined) {
			problems.push(problem('duplicate-id', {id: check.id, first: `check at line ${source.locate(['checks', first]).line}`}, {file: source.file, ...source.locate(['checks', index, 'id']), field: `checks.${index}.id`}));
		} else checkIds.set(check.id, index);
	});
	const stepIds = new Map<string, number>();
	rules.steps.forEach((step, index) => {
		const first = stepIds.get(step.id);
		if (first !== undefined) {
			problems.push(problem('duplicate-id', {id: step.id, first: `step at line ${source.locate(['steps', first]).line}`}, {file: source.file, ...source.locate(['steps', index, 'id']), field: `steps.${index}.id`}));
		} else stepIds.set(step.id, index);
	});
	return {names, problems};
}
