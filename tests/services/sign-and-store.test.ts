import {existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {valueOrUsageError, UsageError} from '../../source/cli/usage-error.js';
import {buildRecordBody} from '../../source/records/build-body.js';
import {fingerprint, rawPublicKey} from '../../source/records/key-material.js';
import {readRecord} from '../../source/records/read-record.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {signAndWrite} from '../../source/services/sign-check.js';
import {signAndStore} from '../../source/services/sign-and-store.js';
import {problem} from '../../source/shared/problems.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import {writeNamedKey} from '../helpers/named-key.js';
import {runIn} from '../helpers/run-cli.js';
import {sampleAnswers, sampleRules} from '../helpers/sample-record.js';

const top = mkdtempSync(join(tmpdir(), 'prelase-sign-and-store-'));
afterAll(() => rmSync(top, {recursive: true, force: true}));
let cases = 0;
const caseHome = () => {
	cases += 1;
	const home = join(top, `case-${cases}`);
	mkdirSync(home);
	return home;
};

const rules = sampleRules();
const answers = sampleAnswers(rules);
const body = buildRecordBody({rules, answers, evaluation: evaluate(rules, answers), operator: {name: 'Dana Whitlow', role: 'bench operator'}});
const ownKey = problem('sign-cosign-own-key');

function keyFile(folder: string, mode: number, name: string | null = 'Tomas Reyes'): string {
	return writeNamedKey(join(folder, `second-${mode.toString(8)}.key`), name ?? undefined, mode);
}

describe('signAndStore (one signing path for bench checks and interlock tests)', () => {
	it('creates the operator key, signs as operator then the second signer as witness, and writes a record that verifies', () => {
		const home = caseHome();
		const records = join(home, 'records');
		const stored = signAndStore(body, {name: 'Dana Whitlow', role: 'bench operator'}, {name: 'Tomas Reyes', role: 'deputy laser safety officer', purpose: 'witness', keyFile: keyFile(home, 0o600), ownKey}, home, records);
		if (!stored.ok) throw new Error(stored.errors[0]!.code);
		expect(stored.value.keyCreated).toBe(true); // hand check: the home was empty, so the key is new
		const read = readRecord(stored.value.path);
		if (!read.ok) throw new Error(read.reason);
		expect(read.record.version).toBe(2); // hand check: records written now are version 2
		expect(read.record.signatures.map((signature) => [signature.signer.name, signature.purpose, signature.endorses?.length, signature.count])).toEqual([
			['Dana Whitlow', 'operator', 0, 2], // hand check: the operator signs first, endorsing none, of 2
			['Tomas Reyes', 'witness', 1, 2], // hand check: the second signer as given, endorsing the first
		]);
		expect(read.record.signatures[0]!.fingerprint).toBe(fingerprint(rawPublicKey(operatorPrivateKey(home)))); // hand check: the key made in this home
	});

	it.each([
		{name: 'a key file that is not there', key: (home: string) => join(home, 'nowhere.key'), code: 'key-file-missing'}, // hand check: no file written
		{name: 'the operator\'s own key as the second key', key: (home: string) => join(home, 'keys', 'operator.key'), code: 'sign-cosign-own-key'}, // common practice: a second signature must be another person's key
		{name: 'a key file others can read', key: (home: string) => keyFile(home, 0o644), code: 'key-file-open'}, // common practice: private keys readable by group or others are refused
		{name: 'a second key that carries no name', key: (home: string) => keyFile(home, 0o600, null), code: 'sign-cosign-key-unnamed'}, // the name on a signature is the key's name
		{name: 'a second key of another person', key: (home: string) => keyFile(home, 0o600, 'Sam Colleague'), code: 'sign-cosign-name-not-key'}, // the name on a signature is the key's name
	])('refuses $name as a failure (not a throw) and writes nothing', ({key, code}) => {
		const home = caseHome();
		const records = join(home, 'records');
		const stored = signAndStore(body, {name: 'Dana Whitlow', role: ''}, {name: 'Tomas Reyes', role: '', purpose: 'witness', keyFile: key(home), ownKey}, home, records);
		expect(stored.ok).toBe(false);
		expect(stored.ok ? [] : stored.errors.map((found) => found.code)).toEqual([code]);
		expect(existsSync(records)).toBe(false);
	});
});

describe('the name on a signature is the key\'s name', () => {
	it('a key made by signing carries the signer\'s name, and signing under another name with it is refused with the key\'s name', () => {
		const home = caseHome();
		const records = join(home, 'records');
		expect(signAndStore(body, {name: 'Dana Whitlow', role: ''}, undefined, home, records).ok).toBe(true);
		const other = signAndStore(body, {name: 'Sam Colleague', role: 'laser safety officer'}, undefined, home, records);
		expect(other.ok ? [] : other.errors.map((found) => [found.code, found.data])).toEqual([['sign-name-not-key', {given: 'Sam Colleague', key: 'Dana Whitlow'}]]);
		expect(readdirSync(records).filter((name) => name.endsWith('.json'))).toHaveLength(1); // hand check: only the first record was written
	});

	it('a key made by an earlier version (no name) is refused, saying how to name it', () => {
		const home = caseHome();
		mkdirSync(join(home, 'keys'), {mode: 0o700});
		writeNamedKey(join(home, 'keys', 'operator.key'), undefined);
		const stored = signAndStore(body, {name: 'Dana Whitlow', role: ''}, undefined, home, join(home, 'records'));
		expect(stored.ok ? [] : stored.errors.map((found) => found.code)).toEqual(['key-unnamed']);
	});
});

describe('signAndWrite returns a user\'s mistake as a failure', () => {
	it.each([
		{name: 'no name', options: {name: '  '}, code: 'sign-no-name', words: '--sign needs the name of the person signing'},
		{name: 'a reason without --amends', options: {name: 'Dana Whitlow', reason: 'typo'}, code: 'sign-reason-without-amends', words: '--reason goes with --amends RECORD'},
		{name: 'an unknown co-sign meaning', options: {name: 'Dana Whitlow', cosign: {name: 'Tomas Reyes', key: 'x.key', meaning: 'witnessed'}}, code: 'sign-cosign-meaning', words: '--cosign-meaning must be witness or approval (or, as before, verified or approved), not "witnessed"'},
	])('$name: the failure carries the code, and the command line words it as before', ({options, code, words}) => {
		const home = caseHome();
		const result = signAndWrite(rules, answers, evaluate(rules, answers), options, {PRELASE_HOME: home});
		expect(result.ok ? [] : result.errors.map((found) => found.code)).toEqual([code]);
		let thrown: unknown;
		try {
			valueOrUsageError(result);
		} catch (error) {
			thrown = error;
		}
		expect(thrown).toBeInstanceOf(UsageError);
		expect((thrown as UsageError).message).toBe(words); // the words the command printed before the change
		expect(readdirSync(home)).toEqual([]);
	});
});

describe('a broken settings file read deep in a command', () => {
	it('is a usage error (exit 2) naming the file, not an internal error', async () => {
		const home = caseHome();
		writeFileSync(join(home, 'config.json'), '{not json');
		const {code, stderr} = await runIn(home, ['check', '--answers', join('docs', 'examples', 'bench3-808nm-clear.yaml')]);
		expect(code).toBe(2);
		expect(stderr).toContain(`prelase: the settings file ${join(home, 'config.json')} cannot be read (`);
		expect(stderr).not.toContain('internal error');
	});
});
