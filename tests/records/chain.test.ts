import {auditBothWays} from '../helpers/audit-both-ways.js';
import {createHash} from 'node:crypto';
import {existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, renameSync, rmSync, unlinkSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {basename, join} from 'node:path';
import {spawn} from 'node:child_process';
import {resolve} from 'node:path';
import {build} from 'esbuild';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';

import {listRecordFiles} from '../../source/audit/audit-files.js';
import {buildRecordBody} from '../../source/records/build-body.js';
import {ownFingerprint} from '../../source/records/key-files.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {signAndStore} from '../../source/services/sign-and-store.js';
import {problem} from '../../source/shared/problems.js';
import {sampleAnswers, sampleRules} from '../helpers/sample-record.js';
import {caseFolder} from '../helpers/run-cli.js';

const top = mkdtempSync(join(tmpdir(), 'prelase-chain-'));
afterAll(() => rmSync(top, {recursive: true, force: true}));
const fresh = (name: string) => caseFolder(top, name);

const rules = sampleRules();
const answers = sampleAnswers(rules);
const evaluation = evaluate(rules, answers);

/** Signs and stores a bench-check record made at `minute` past 09:00 UTC on 2026-03-04 with the key in `home`. */
function write(home: string, folder: string, minute: number): string {
	const now = new Date(Date.UTC(2026, 2, 4, 9, minute, 0));
	const body = buildRecordBody({rules, answers, evaluation, operator: {name: 'Dana Whitlow', role: 'bench operator'}, now});
	const stored = signAndStore(body, {name: 'Dana Whitlow', role: 'bench operator'}, undefined, home, folder, now);
	if (!stored.ok) throw new Error(stored.errors[0]!.code);
	return stored.value.path;
}

/** The chain link a record file states. */
const previousOf = (path: string) => (JSON.parse(readFileSync(path, 'utf8')) as {body: {previous?: unknown}}).body.previous;
/** The link that names a file: its base name and the SHA-256 of its exact bytes (checked with node:crypto directly). */
const linkTo = (path: string) => ({file: basename(path), sha256: createHash('sha256').update(readFileSync(path)).digest('hex')});

describe('each record names the previous record of the same key in the same folder', () => {
	it('the first names null; each later one names the one before by file and SHA-256 of its bytes; another key starts its own chain', () => {
		const [alex, sam, folder] = [fresh('alex'), fresh('sam'), fresh('records')];
		const first = write(alex, folder, 0);
		const other = write(sam, folder, 1);
		const second = write(alex, folder, 2);
		const third = write(alex, folder, 3);
		expect(previousOf(first)).toBeNull(); // the brief: the first record of a key names null
		expect(previousOf(other)).toBeNull(); // Sam's key has written nothing here before
		expect(previousOf(second)).toEqual(linkTo(first));
		expect(previousOf(third)).toEqual(linkTo(second));
	});

	it('a chain is per folder: the same key in another folder starts again', () => {
		const [alex, one, two] = [fresh('alex'), fresh('one'), fresh('two')];
		write(alex, one, 0);
		expect(previousOf(write(alex, two, 1))).toBeNull();
	});

	it('keeps a small index beside the records (a dot-folder the audit leaves out), one file per key', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const path = write(alex, folder, 0);
		const fingerprint = ownFingerprint(alex)!;
		const index = join(folder, '.prelase-chain', `${fingerprint.slice('sha256:'.length)}.json`);
		expect(JSON.parse(readFileSync(index, 'utf8'))).toEqual({format: 'prelase-chain-head', version: 1, key: fingerprint, head: linkTo(path)});
	});
});

describe('when the index is missing or names a record that is gone', () => {
	it('without the index, a scan of the folder finds the key\'s latest record (the one no other record of the key names)', () => {
		const [alex, sam, folder] = [fresh('alex'), fresh('sam'), fresh('records')];
		write(alex, folder, 0);
		const second = write(alex, folder, 5);
		write(sam, folder, 6);
		rmSync(join(folder, '.prelase-chain'), {recursive: true});
		// Renamed so that neither name order nor the date in the name gives it away: the chain does.
		const renamed = join(folder, '0000-renamed.json');
		renameSync(second, renamed);
		expect(previousOf(write(alex, folder, 7))).toEqual(linkTo(renamed));
	});

	it('an unreadable index is read as missing: the scan gives the link, and the index is written again', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const first = write(alex, folder, 0);
		const index = join(folder, '.prelase-chain', `${ownFingerprint(alex)!.slice('sha256:'.length)}.json`);
		writeFileSync(index, '{"format": "prelase-chain-head", "vers');
		const second = write(alex, folder, 1);
		expect(previousOf(second)).toEqual(linkTo(first));
		expect(JSON.parse(readFileSync(index, 'utf8'))).toMatchObject({head: linkTo(second)});
	});

	it('the latest record deleted: the next record still names it, so the deletion shows in the chain', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		write(alex, folder, 0);
		const second = write(alex, folder, 1);
		const link = linkTo(second);
		unlinkSync(second);
		expect(previousOf(write(alex, folder, 2))).toEqual(link);
	});
});

/** A child process that signs one record with prelase's own signAndStore when it reads a line. */
const writerSource = `
import {readFileSync, writeSync} from 'node:fs';
import {signAndStore} from './source/services/sign-and-store.js';
const [home, folder, bodyFile] = process.argv.slice(2);
const body = JSON.parse(readFileSync(bodyFile, 'utf8'));
// Each process's check differs, as two real checks would (the same body twice would be one record, a duplicate).
body.operator.role = 'bench operator ' + process.pid;
writeSync(1, 'ready\\n');
process.stdin.once('data', () => {
	const stored = signAndStore(body, {name: 'Dana Whitlow', role: 'bench operator'}, undefined, home, folder);
	writeSync(1, (stored.ok ? 'wrote ' + stored.value.path : 'failed ' + stored.errors[0].code) + '\\n');
	process.exit(0);
});
`;

describe('8 processes of one key writing at the same moment', () => {
	let writer: string;
	beforeAll(async () => {
		writer = join(top, 'chain-writer.mjs');
		const {version} = JSON.parse(readFileSync('package.json', 'utf8')) as {version: string};
		await build({stdin: {contents: writerSource, resolveDir: resolve('.'), sourcefile: 'writer.js', loader: 'js'}, outfile: writer, bundle: true, platform: 'node', format: 'esm', target: 'node20', define: {PRELASE_VERSION: JSON.stringify(version)}, logLevel: 'silent'});
	});

	it('leave a whole index naming one of them, and 8 records each naming a record of the key (two naming the same one are a fork the audit reports)', async () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const first = write(alex, folder, 0);
		const bodyFile = join(top, 'body.json');
		writeFileSync(bodyFile, JSON.stringify(buildRecordBody({rules, answers, evaluation, operator: {name: 'Dana Whitlow', role: 'bench operator'}})));
		const children = Array.from({length: 8}, () => {
			const child = spawn(process.execPath, [writer, alex, folder, bodyFile], {stdio: ['pipe', 'pipe', 'pipe']});
			let out = '';
			let err = '';
			child.stdout.setEncoding('utf8').on('data', (chunk: string) => (out += chunk));
			child.stderr.setEncoding('utf8').on('data', (chunk: string) => (err += chunk));
			const ready = new Promise<void>((done) => {
				const poll = setInterval(() => {
					if (out.includes('ready')) {
						clearInterval(poll);
						done();
					}
				}, 5);
			});
			const exited = new Promise<{code: number | null; out: string; err: string}>((done) => child.on('close', (code) => done({code, out, err})));
			return {child, ready, exited};
		});
		await Promise.all(children.map((entry) => entry.ready));
		for (const entry of children) entry.child.stdin.write('go\n');
		const results = await Promise.all(children.map((entry) => entry.exited));
		expect(results.map((result) => [result.code, result.err])).toEqual(Array.from({length: 8}, () => [0, '']));
		const written = results.map((result) => /wrote (.+)/.exec(result.out)![1]!);
		expect(new Set(written).size).toBe(8);
		// Each names the first record or one of the others (whichever head it read); none names itself.
		const links = [first, ...written].map(linkTo);
		for (const path of written) {
			expect(links).toContainEqual(previousOf(path));
			expect(previousOf(path)).not.toEqual(linkTo(path));
		}
		const chainFolder = join(folder, '.prelase-chain');
		expect(readdirSync(chainFolder)).toEqual([`${ownFingerprint(alex)!.slice('sha256:'.length)}.json`]); // no temporary file left behind
		const index = JSON.parse(readFileSync(join(chainFolder, readdirSync(chainFolder)[0]!), 'utf8')) as {head: {file: string}};
		expect(written.map((path) => basename(path))).toContain(index.head.file);
		expect(existsSync(join(folder, index.head.file))).toBe(true);

		// The audit reports every record that shares its predecessor with another as a fork, and no other chain finding.
		const report = auditBothWays(listRecordFiles([folder]).files, {current: rules, trust: {own: ownFingerprint(alex), trusted: []}});
		const sharing = written.filter((path) => written.some((other) => other !== path && JSON.stringify(previousOf(other)) === JSON.stringify(previousOf(path))));
		const chainCodes = (path: string) => report.records.find((record) => record.file === path)!.findings.filter((found) => found.code.startsWith('audit-chain')).map((found) => found.code);
		for (const path of [first, ...written]) expect(chainCodes(path)).toEqual(sharing.includes(path) ? ['audit-chain-fork'] : []);
	});
});
