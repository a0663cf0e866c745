// Audit throughput benchmark: how much longer does `prelase audit FOLDER --json` take than a
// bare loop that only reads, parses, canonicalises and verifies the same signed records?
// Generates the records once (through prelase's own record code, bundled here), then times
// both as separate processes, side by side, alternating which goes first each round.
// Expects dist/prelase.js to be built already; `npm run bench` does that first.
import canonicalize from 'canonicalize';
import {spawnSync} from 'node:child_process';
import {createPublicKey, verify} from 'node:crypto';
import {closeSync, existsSync, mkdirSync, mkdtempSync, openSync, readdirSync, readFileSync, rmSync, statSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {fileURLToPath} from 'node:url';
import {parseArgs} from 'node:util';

const repoRoot = fileURLToPath(new URL('..', import.meta.url));
const TARGET_RATIO = 1.5;

const {values} = parseArgs({
	options: {
		records: {type: 'string', default: '10000'},
		rounds: {type: 'string', default: '1'},
		keep: {type: 'string'},
		strict: {type: 'boolean', default: false},
		bare: {type: 'string'},
		help: {type: 'boolean', short: 'h', default: false},
	},
	allowPositionals: false,
	strict: true,
});

if (values.help) {
	process.stdout.write(
		'usage: node bench/audit.mjs [--records N] [--rounds N] [--keep DIR] [--strict]\n' +
			'  --records N  signed records to generate (default 10000)\n' +
			'  --rounds N   timed rounds of each command (default 1)\n' +
			'  --keep DIR   generate into DIR and keep it; reuse it when it already holds the records\n' +
			'  --strict     exit 1 when the target does not hold\n',
	);
	process.exit(0);
}

/** The record files under a folder, as the audit finds them: recursive, no dotfiles, no *.tmp. */
function listFiles(folder) {
	const found = [];
	for (const name of readdirSync(folder).sort()) {
		if (name.startsWith('.') || name.endsWith('.tmp')) continue;
		const path = join(folder, name);
		if (statSync(path).isDirectory()) found.push(...listFiles(path));
		else found.push(path);
	}
	return found;
}

/**
 * The baseline: read, JSON.parse, RFC 8785 canonical form (the canonicalize package), Ed25519
 * verify of every signature, with each distinct public key parsed once. The body is put in
 * canonical form once per record, as the audit does; the signed bytes are the canonical form
 * of {body, signature statement}. Returns the exit status: 0 when every signature verifies.
 */
function bareLoop(folder) {
	const spki = Buffer.from('302a300506032b6570032100', 'hex');
	const keys = new Map();
	let verified = 0;
	let failed = 0;
	for (const file of listFiles(folder)) {
		const record = JSON.parse(readFileSync(file, 'utf8'));
		const body = canonicalize(record.body);
		for (const signature of record.signatures) {
			const {value, fingerprint, ...statement} = signature;
			let key = keys.get(signature.publicKey);
			if (!key) {
				key = createPublicKey({key: Buffer.concat([spki, Buffer.from(signature.publicKey, 'base64')]), format: 'der', type: 'spki'});
				keys.set(signature.publicKey, key);
			}
			const bytes = Buffer.from(`{"body":${body},"signature":${canonicalize(statement)}}`, 'utf8');
			if (verify(null, bytes, key, Buffer.from(value, 'base64'))) verified += 1;
			else failed += 1;
		}
	}
	process.stderr.write(`bare loop: ${verified} signatures verified, ${failed} failed\n`);
	return failed === 0 ? 0 : 1;
}

function fail(message) {
	process.stderr.write(`bench: ${message}\n`);
	process.exit(1);
}

async function main() {
	const count = Number(values.records);
	const rounds = Number(values.rounds);
	if (!Number.isInteger(count) || count < 2) fail(`--records wants a whole number of at least 2, not "${values.records}"`);
	if (!Number.isInteger(rounds) || rounds < 1) fail(`--rounds wants a whole number of at least 1, not "${values.rounds}"`);
	process.chdir(repoRoot);
	if (!existsSync('dist/prelase.js')) fail('dist/prelase.js is missing; run `npm run bench` (it builds first) or `npm run build`');

	const work = values.keep ?? mkdtempSync(join(tmpdir(), 'prelase-bench-audit-'));
	const folder = join(work, 'records');
	const home = join(work, 'home');
	const ready = existsSync(join(work, 'generated.json')) && JSON.parse(readFileSync(join(work, 'generated.json'), 'utf8')).count === count;
	if (!ready) {
		mkdirSync(folder, {recursive: true});
		const {generateRecords} = await import(await buildGenerator());
		const started = performance.now();
		generateRecords({folder, home, count, marker: join(work, 'generated.json')});
		process.stdout.write(`generated ${count} signed records in ${((performance.now() - started) / 1000).toFixed(1)} s (${folder})\n`);
	} else {
		process.stdout.write(`reusing ${count} signed records in ${folder}\n`);
	}

	const nullOut = openSync('/dev/null', 'w');
	const subjects = [
		{key: 'bare', label: 'bare loop: read, parse, canonicalise, verify', args: [fileURLToPath(import.meta.url), '--bare', folder], ok: [0]},
		{key: 'audit', label: 'node dist/prelase.js audit FOLDER --json > /dev/null', args: ['dist/prelase.js', 'audit', folder, '--json'], ok: [0, 1]},
	];
	const times = new Map(subjects.map((subject) => [subject.key, []]));
	const cpuTimes = new Map(subjects.map((subject) => [subject.key, []]));
	for (let round = 0; round < rounds; round += 1) {
		for (let i = 0; i < subjects.length; i += 1) {
			const subject = subjects[(round + i) % subjects.length];
			const startedCpu = childCpuSeconds();
			const started = process.hrtime.bigint();
			const result = spawnSync(process.execPath, subject.args, {cwd: repoRoot, stdio: ['ignore', nullOut, 'pipe'], encoding: 'utf8', env: {...process.env, NO_COLOR: '1', PRELASE_HOME: home}});
			const seconds = Number(process.hrtime.bigint() - started) / 1e9;
			if (result.error) fail(`${subject.label}: could not start: ${result.error.message}`);
			if (!subject.ok.includes(result.status)) fail(`${subject.label} exited ${result.status ?? result.signal}, expected ${subject.ok.join(' or ')}\n${result.stderr.trim()}`);
			times.get(subject.key).push(seconds);
			const cpu = childCpuSeconds();
			if (cpu !== undefined && startedCpu !== undefined) cpuTimes.get(subject.key).push(cpu - startedCpu);
		}
	}
	closeSync(nullOut);

	const median = (samples) => [...samples].sort((a, b) => a - b)[Math.floor((samples.length - 1) / 2)];
	const bare = median(times.get('bare'));
	const audit = median(times.get('audit'));
	const ratio = audit / bare;
	const holds = ratio <= TARGET_RATIO;
	const out = [
		`node ${process.version} on ${process.platform}/${process.arch}; ${count} records; ${rounds} round(s), alternating; medians`,
		`  bare loop  ${bare.toFixed(2)} s wall  (${((bare / count) * 1000).toFixed(2)} ms a record)`,
		`  audit      ${audit.toFixed(2)} s wall  (${((audit / count) * 1000).toFixed(2)} ms a record)`,
	];
	if (cpuTimes.get('bare').length === rounds) {
		const bareCpu = median(cpuTimes.get('bare'));
		const auditCpu = median(cpuTimes.get('audit'));
		out.push(`  CPU time (user + system): bare loop ${bareCpu.toFixed(2)} s, audit ${auditCpu.toFixed(2)} s, ratio ${(auditCpu / bareCpu).toFixed(2)}x (less affected by a busy machine)`);
	}
	out.push(`  audit / bare loop = ${ratio.toFixed(2)}x wall time; target at most ${TARGET_RATIO.toFixed(1)}x: ${holds ? 'HOLDS' : 'DOES NOT HOLD'}`);
	process.stdout.write(`${out.join('\n')}\n`);
	if (values.keep === undefined) rmSync(work, {recursive: true, force: true});
	if (values.strict && !holds) process.exitCode = 1;
}

/**
 * CPU seconds (user + system) of the child processes this process has waited for, from
 * /proc/self/stat (Linux); undefined elsewhere. Clock ticks are taken as 100 a second.
 */
function childCpuSeconds() {
	try {
		const stat = readFileSync('/proc/self/stat', 'utf8');
		const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
		// Fields 16 and 17 of the whole line (cutime, cstime) are 13 and 14 after the command name.
		return (Number(fields[13]) + Number(fields[14])) / 100;
	} catch {
		return undefined;
	}
}

/** Bundles the generator (prelase's own rule, record and key code) into bench/out/. */
async function buildGenerator() {
	const {build} = await import('esbuild');
	const outfile = join(repoRoot, 'bench/out/audit-generate.mjs');
	await build({
		absWorkingDir: repoRoot,
		stdin: {contents: generatorSource, resolveDir: repoRoot, sourcefile: 'audit-generate.ts', loader: 'ts'},
		outfile,
		bundle: true,
		platform: 'node',
		format: 'esm',
		target: 'node20',
		banner: {js: "import {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);"},
		define: {PRELASE_VERSION: JSON.stringify(JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8')).version)},
		logLevel: 'warning',
	});
	return outfile;
}

// Records as a site would have them: 500 setups checked about 20 times each by three operators,
// with setpoints and ambient temperatures that vary (some records clear, some do not), every
// tenth one also approved by the laser safety officer, and every hundredth an amendment of the
// setup's previous record. Each record is built, evaluated and signed by prelase's own code.
const generatorSource = `
import {mkdirSync, writeFileSync} from 'node:fs';
import {join} from 'node:path';
import {buildRecordBody, bodySha256} from './source/records/build-body.js';
import {writeTrusted} from './source/records/key-files.js';
import {fingerprint, generateKeyPair, rawPublicKey} from './source/records/key-material.js';
import {signRecord} from './source/records/sign.js';
import {evaluate} from './source/rules/evaluate/evaluate.js';
import {parseInputEntry} from './source/rules/evaluate/input-entry.js';
import {loadAnswers} from './source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from './source/rules/load.js';

export function generateRecords({folder, home, count, marker}) {
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error('the shipped rules do not load');
	const rules = loaded.value;
	const base = loadAnswers('docs/examples/bench3-808nm-clear.yaml', rules);
	if (!base.ok) throw new Error('the demo answers do not load');
	const people = ['Dana Whitlow', 'Kofi Mensah', 'Ines Duarte'].map((name) => ({name, role: 'test engineer', ...generateKeyPair()}));
	const officer = {name: 'R. Osei', role: 'laser safety officer', ...generateKeyPair()};
	writeTrusted(home, [...people, officer].map((person) => {
		const raw = rawPublicKey(person.publicKey);
		return {name: person.name, publicKey: raw.toString('base64'), fingerprint: fingerprint(raw), addedAt: '2026-01-01T00:00:00+00:00'};
	}));
	const entry = (id, text) => {
		const parsed = parseInputEntry(rules.inputs.get(id), text);
		if (!parsed.ok) throw new Error(id + ': ' + text);
		return parsed.value;
	};
	const setups = 500;
	const hashes = new Map();
	const start = Date.parse('2026-01-05T08:00:00Z');
	for (let index = 0; index < count; index += 1) {
		const setup = index % setups;
		const round = Math.floor(index / setups);
		const inputs = new Map(base.value.inputs);
		inputs.set('location', entry('location', 'Room B.' + (100 + Math.floor(setup / 10)) + ', bench ' + (setup % 10)));
		inputs.set('current_setpoint', entry('current_setpoint', (1 + ((index * 7) % 120) / 100).toFixed(2) + ' A'));
		inputs.set('ambient_max', entry('ambient_max', (20 + ((index * 3) % 30)) + ' degC'));
		const answers = {setup: 'Bench ' + setup + ' — FH-808-2 on LD-5L', inputs, confirmations: base.value.confirmations};
		const evaluation = evaluate(rules, answers);
		const now = new Date(start + index * 60_000);
		const person = people[setup % people.length];
		const amends = index >= setups && index % 100 === 0 && hashes.has(index - setups)
			? {record: 'record-' + (index - setups) + '.json', bodySha256: hashes.get(index - setups), reason: 'ambient maximum re-measured'}
			: undefined;
		const body = buildRecordBody({rules, answers, evaluation, operator: {name: person.name, role: person.role}, now, ...(amends ? {amends} : {})});
		if ((index + setups) % 100 === 0) hashes.set(index, bodySha256(body));
		const signers = [{signer: {name: person.name, role: person.role, meaning: 'performed'}, key: person.privateKey}];
		if (index % 10 === 0) signers.push({signer: {name: officer.name, role: officer.role, meaning: 'approved'}, key: officer.privateKey});
		const record = signRecord(body, signers, now);
		const month = join(folder, body.createdAt.slice(0, 7));
		mkdirSync(month, {recursive: true});
		writeFileSync(join(month, 'record-' + index + '.json'), JSON.stringify(record, null, 2) + '\\n');
	}
	writeFileSync(marker, JSON.stringify({count}));
}
`;

if (values.bare === undefined) await main();
else process.exitCode = bareLoop(values.bare);
