import {stringify} from 'yaml';
import type {RuleFile} from './schema.js';

/** A file of a chain of rule files: its path, the name it gives, and its SHA-256. */
export type ChainEntry = {file: string; name: string; sha256: string};

/**
 * The merged rules of a chain as one rule file with no base, which loads on its own to the
 * same rules: what records embed, so an audit needs nothing but the record. The header names
 * the chain by content (name and SHA-256), not by path, so the text does not depend on
 * where the files were.
 */
export function resolvedRuleText(rules: RuleFile, chain: readonly ChainEntry[]): string {
	const header = [
		'# prelase rule file, resolved from a site rule file and the files it extends:',
		...chain.map((entry, index) => `#   ${index === 0 ? '' : 'extends '}${entry.name.replaceAll('\n', ' ')} (sha256 ${entry.sha256})`),
		'# A check with switched_off is kept for the record but not evaluated.',
		'',
	];
	return `${header.join('\n')}${stringify(rules, {lineWidth: 100, aliasDuplicateObjects: false})}`;
}
