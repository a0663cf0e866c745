import {dimensions} from '../../quantities/dimensions.js';
import {formatQuantity} from '../../quantities/format.js';
import {fieldExample} from '../../quantities/field-example.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import type {Field} from './session.js';

/** One line saying what a field expects: dimension and range, options, or the keys to answer. */
export function fieldHint(rules: CompiledRules, field: Field, fromRecord = false): string {
	if (field.kind === 'confirmation') {
		if (fromRecord) return 'answered from the interlock test record · to answer it yourself, clear the interlock plan';
		return field.confirmation.not_applicable === 'forbidden' ? 'y yes · n no · Tab note' : 'y yes · n no · a not applicable (needs a note) · Tab note';
	}
	const {input} = field;
	switch (input.kind) {
		case 'quantity': {
			const compiled = rules.inputs.get(input.id);
			const range = compiled?.range;
			const span = range ? `, ${formatQuantity(range.min, input.dimension)} to ${formatQuantity(range.max, input.dimension)}` : '';
			const example = fieldExample({dimension: input.dimension, ...(range ? {range} : {}), ...(compiled?.defaultValue ? {default: compiled.defaultValue.si} : {})});
			return `${dimensions[input.dimension].noun}, e.g. ${example}${span}`;
		}
		case 'choice':
			return '← → choose · Enter accept';
		case 'yes_no':
			return 'y yes · n no';
		case 'text':
			return `text, up to ${input.max_length} characters`;
	}
}
