import {parseArgs} from 'node:util';
import {toJSONSchema} from 'zod';
import {formatProblem} from '../problems.js';
import {loadRules} from '../rules/load.js';
import {ruleFileSchema} from '../rules/schema.js';
import {UsageError} from '../usage-error.js';
import type {Io} from './check.js';
import {helpTexts} from './help.js';

/** The JSON Schema of rule files, with `kind` optional on quantity inputs as the loader allows. */
export function ruleFileJsonSchema(): Record<string, unknown> {
	const schema = toJSONSchema(ruleFileSchema, {io: 'input', unrepresentable: 'any'}) as Record<string, unknown>;
	const relax = (node: unknown): void => {
		if (!node || typeof node !== 'object') return;
		const record = node as Record<string, unknown>;
		const properties = record['properties'] as Record<string, {const?: unknown}> | undefined;
		if (properties?.['kind']?.const === 'quantity' && Array.isArray(record['required'])) {
			record['required'] = (record['required'] as string[]).filter((key) => key !== 'kind');
		}
		for (const value of Object.values(record)) relax(value);
	};
	relax(schema);
	return {title: 'prelase rule file', ...schema};
}

/** `prelase rules schema|validate`: returns the exit status. */
export function runRules(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: {help: {type: 'boolean', short: 'h'}}, allowPositionals: true, strict: true});
	const [action, ...files] = positionals;
	if (values.help || action === undefined) {
		io.stdout.write(`${helpTexts.rules}\n`);
		return values.help ? 0 : 2;
	}
	if (action === 'schema') {
		io.stdout.write(`${JSON.stringify(ruleFileJsonSchema(), null, 2)}\n`);
		return 0;
	}
	if (action === 'validate') {
		if (files.length === 0) throw new UsageError('name at least one rule file: prelase rules validate FILE...');
		let problems = 0;
		for (const file of files) {
			const loaded = loadRules(file);
			const found = loaded.ok ? loaded.warnings : loaded.errors;
			for (const entry of found) io.stdout.write(`${formatProblem(entry)}\n`);
			if (!loaded.ok) problems += loaded.errors.length;
			else io.stdout.write(`${file}: ok (${loaded.value.checks.length} checks, ${loaded.value.inputs.size} inputs, ${loaded.value.confirmations.size} confirmations)\n`);
		}
		return problems > 0 ? 1 : 0;
	}
	throw new UsageError(`unknown rules action "${action}"; use schema or validate`);
}
