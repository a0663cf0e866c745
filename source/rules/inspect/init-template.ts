import {dimensions} from '../../quantities/dimensions.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import {policyValueText} from '../file/schema.js';

const comment = (text: string, width = 92) => {
	const words = text.replaceAll(/\s+/g, ' ').trim().split(' ');
	const lines: string[] = [];
	let line = '';
	for (const word of words) {
		if (line && line.length + word.length + 1 > width) {
			lines.push(line);
			line = word;
		} else line = line ? `${line} ${word}` : word;
	}
	if (line) lines.push(line);
	return lines;
};

/**
 * A site rule file that extends the shipped policy and changes nothing yet: every policy value
 * of the shipped policy is there, commented out, with its default, its kind of quantity and
 * what it means, followed by commented examples of the other changes a site file can make.
 */
export function siteFileTemplate(shipped: CompiledRules): string {
	const lines = [
		'# Site rule file for prelase: the shipped bench policy plus this site\'s changes.',
		'#',
		'# The laser safety officer decides what goes in this file, within the site\'s laser safety',
		'# programme and the codes in force (IEC 60825 series, ANSI Z136 series, local law). prelase',
		'# checks arithmetic against it; it does not make a setup safe.',
		'#',
		'# Everything not written here comes from the base named by `extends`. Uncomment a section',
		'# header and the entries you change. Then:',
		'#   prelase rules validate THIS_FILE      every problem, with file:line:column',
		'#   prelase rules diff shipped THIS_FILE  what differs from the shipped policy',
		'#   prelase rules show THIS_FILE          the effective rules, and where each part came from',
		'# See docs/rule-file.md, "Site rule files".',
		'',
		'format: 1',
		'extends: shipped',
		'# name: Site bench policy            # shown on every screen and record (default: the base\'s)',
		'# caution: >-                        # shown at the start of every check (default: the base\'s)',
		'#   ...',
		'',
		'# Policy values: change the value only; it must stay the same kind of quantity. Add',
		'# `basis: ...` under a value to say why the site uses it and who decided.',
		'# policy_changed:',
	];
	for (const [id, entry] of Object.entries(shipped.rules.policy)) {
		const dimension = entry.dimension === undefined ? undefined : dimensions[entry.dimension];
		const kind = dimension ? dimension.noun : `a list of options of ${entry.options_of}`;
		const value = policyValueText(entry.value);
		lines.push(`#   ${id}:`, ...comment(`${entry.meaning}. Default ${value} (${kind}).`).map((text) => `#     # ${text}`), `#     value: ${value}`);
	}
	lines.push(
		'',
		'# Add inputs or confirmations to a step the base has, by step id:',
		'# add_to_steps:',
		'#   identification:',
		'#     confirmations:',
		'#       - id: second_person_present',
		'#         statement: A second trained person is present in the room for Class 4 work.',
		'#         when: laser_class == "class_4"',
		'#         not_applicable: forbidden',
		'#         basis: site policy',
		'',
		'# Switch a check off, with the reason (required; it goes into every record):',
		'# switched_off:',
		'#   pin_configuration_supported: "Why it does not apply here, and who decided"',
		'',
		'# Change a check\'s severity (stop blocks energizing, advise warns), with the reason:',
		'# checks_changed:',
		'#   beam1_hazard_distance:',
		'#     severity: stop',
		'#     reason: Site policy: no hazard distance may reach an uncontrolled position.',
		'',
		'# Add new parts, written as in a full rule file: add_policy, add_tables, add_steps,',
		'# add_derived, add_checks (a check may name a base step or a new one).',
		'',
	);
	return lines.join('\n');
}
