import {expect, it} from 'vitest';
import {siteFileTemplate} from '../../../source/rules/inspect/init-template.js';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';
import {parseQuantity} from '../../../source/quantities/parse-quantity.js';

const loaded = loadRules(shippedRulesPath());
if (!loaded.ok) throw new Error('the shipped rules load');
const rules = loaded.value;
// The template's comment lines of the policy values, joined back into one sentence per value.
const template = siteFileTemplate(rules).replaceAll(/\n#\s+# /g, ' ');
const policies = [...Object.entries(rules.rules.policy)].filter(([, entry]) => entry.dimension !== undefined);

it.each(policies.map(([id, entry]) => [id, entry.dimension!]))('rules init, policy %s: "Default VALUE (…)" names only that value, which reads as its dimension (%s)', (id, dimension) => {
	const sentence = new RegExp(`#   ${id}:\\n#     # (.*?)\\n#     value:`, 's').exec(siteFileTemplate(rules))?.[1]?.replaceAll(/\n#\s+# /g, ' ');
	expect(sentence, id).toBeDefined();
	const [, value, words] = /Default (.+?) \((.+?)\)\.$/.exec(sentence!) ?? [];
	expect(parseQuantity(value!, dimension).ok).toBe(true);
	// No generic example of another size beside the field's own default ("Default 180 days (a time, for example 3 s)").
	expect(words).not.toMatch(/for example/);
	expect(template).toContain(`value: ${value}`);
});
