import {sha256Hex} from '../../shared/sha256.js';
import {existsSync} from 'node:fs';
import {dirname, join, resolve} from 'node:path';
import {fileURLToPath} from 'node:url';
import type {Problem} from '../../shared/problems.js';
import {success, type Result} from '../../shared/result.js';
import {parseYamlSource, preparsedYamlSource, readTextFile, type YamlSource} from '../../shared/yaml-source.js';
import {shippedRulesData} from './shipped-rules.js';

/** What the loader expects a rule file to be, for its messages. */
export const ruleFileExpected = 'a prelase rule file (YAML)';

/** The shipped bench policy, found beside the program (dist/) or the sources. */
export function shippedRulesPath(): string {
	let folder = dirname(fileURLToPath(import.meta.url));
	for (let depth = 0; depth < 5; depth += 1) {
		const candidate = join(folder, 'rules', 'default.yaml');
		if (existsSync(candidate) && existsSync(join(folder, 'package.json'))) return candidate;
		folder = dirname(folder);
	}
	return resolve('rules', 'default.yaml');
}

/**
 * A rule file named on the command line: the word `shipped` is the shipped policy (a file of
 * that name is `./shipped`); anything else is a path.
 */
export function ruleFileNamed(name: string): string {
	return name === 'shipped' ? shippedRulesPath() : name;
}

/** Rule text parsed as YAML with positions, and its SHA-256. The shipped policy is not parsed again. */
export function parseRuleText(text: string, file: string): Result<{source: YamlSource; sha256: string}, Problem> {
	const sha256 = sha256Hex(text);
	const shipped = shippedRulesData(sha256);
	if (shipped !== undefined) return success({source: preparsedYamlSource(text, file, shipped), sha256});
	// Keys written twice are reported with everything else the later checks find (the later value is read meanwhile).
	const parsed = parseYamlSource(text, file, ruleFileExpected, {readDuplicates: true});
	if (!parsed.ok) return parsed;
	return success({source: parsed.value, sha256}, parsed.warnings);
}

/** Reads and parses a rule file. */
export function readRuleSource(file: string): Result<{source: YamlSource; sha256: string}, Problem> {
	const text = readTextFile(file, ruleFileExpected);
	if (!text.ok) return text;
	return parseRuleText(text.value, file);
}
