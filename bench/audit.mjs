// Audit benchmark. Generates signed bench-check records once (through prelase's own record
// code, bundled here), then:
//  - the size of a record (target: at most 10 kB; the rule text is stored once beside them);
//  - `prelase audit FOLDER` (the default summary, stdout to a file; above 2,000 records it judges
//    in worker threads, one a core) against a bare loop in one thread that only reads, parses,
//    canonicalises and verifies the same records (target: at most 1.5x wall time); beside it the
//    audit in one thread (--jobs 1) and the CPU time of each, which show the work it does;
//  - growth: the audit of 1k and 10k records (100k with --with-100k), wall and CPU time, peak
//    memory of the child (maxRSS, through bench/rss-hook.mjs) and the size of its output.
// Expects dist/prelase.js to be built already; `npm run bench` does that first.
import canonicalize from 'canonicalize';
import {spawnSync} from 'node:child_process';
import {createPublicKey, verify} from 'node:crypto';
import {closeSync, existsSync, linkSync, mkdirSync, mkdtempSync, openSync, readdirSync, readFileSync, rmSync, statSync} from 'node:fs';
import {availableParallelism, tmpdir} from 'node:os';
import {join} from 'node:path';
import {fileURLToPath} from 'node:url';
import {parseArgs} from 'node:util';

const repoRoot = fileURLToPath(new URL('..', import.meta.url));
const TARGET_RATIO = 1.5;
const TARGET_RECORD_BYTES = 10_000;

const {values} = parseArgs({
	options: {
		records: {type: 'string', default: '10000'},
		rounds: {type: 'string', default: '1'},
		keep: {type: 'string'},
		strict: {type: 'boolean', default: false},
		bare: {type: 'string'},
		'with-100k': {type: 'boolean', default: false},
		help: {type: 'boolean', short: 'h', default: false},
	},
	allowPositionals: false,
	strict: true,
});

if (values.help) {
	process.stdout.write(
		'usage: node bench/audit.mjs [--records N] [--rounds N] [--keep DIR] [--with-100k] [--strict]\n' +
			'  --records N  signed records to generate (default 10000)\n' +
			'  --rounds N   timed rounds of each command (default 1)\n' +
			'  --keep DIR   generate into DIR and keep it; reuse it when it already holds the records\n' +
			'  --with-100k  also measure the growth at 100,000 records (generating them takes minutes)\n' +
			'  --strict     exit 1 when a target does not hold\n',
	);
	process.exit(0);
}

/** The record files under a folder, as the audit finds them: recursive, .json only, no dotfiles, no *.tmp. */
function listFiles(folder) {
	const found = [];
	for (const name of readdirSync(folder).sort()) {
		if (name.startsWith('.') || name.endsWith('.tmp')) continue;
		const path = join(folder, name);
		if (statSync(path).isDirectory()) found.push(...listFiles(path));
		else if (name.endsWith('.json')) found.push(path);
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

/** Runs one child to its end: wall and CPU seconds, peak memory (MB), output bytes. */
function timed(subject, work, home) {
	const outFile = join(work, 'child-stdout');
	const rssFile = join(work, 'child-rss');
	rmSync(rssFile, {force: true});
	const out = openSync(outFile, 'w');
	const startedCpu = childCpuSeconds();
	const started = process.hrtime.bigint();
	const result = spawnSync(process.execPath, ['--import', rssHook, ...subject.args], {cwd: repoRoot, stdio: ['ignore', out, 'pipe'], encoding: 'utf8', env: {...process.env, NO_COLOR: '1', PRELASE_HOME: home, BENCH_RSS_FILE: rssFile}});
	const seconds = Number(process.hrtime.bigint() - started) / 1e9;
	closeSync(out);
	if (result.error) fail(`${subject.label}: could not start: ${result.error.message}`);
	if (!subject.ok.includes(result.status)) fail(`${subject.label} exited ${result.status ?? result.signal}, expected ${subject.ok.join(' or ')}\n${result.stderr.trim()}`);
	const cpu = childCpuSeconds();
	const rss = existsSync(rssFile) ? Number(readFileSync(rssFile, 'utf8')) / 1024 : undefined;
	return {seconds, cpu: cpu !== undefined && startedCpu !== undefined ? cpu - startedCpu : undefined, rssMb: rss, outputBytes: statSync(outFile).size};
}

const rssHook = new URL('./rss-hook.mjs', import.meta.url).href;
const auditSubject = (folder) => ({label: 'node dist/prelase.js audit FOLDER', args: ['dist/prelase.js', 'audit', folder], ok: [0, 1]});
const oneThreadSubject = (folder) => ({label: 'node dist/prelase.js audit FOLDER --jobs 1', args: ['dist/prelase.js', 'audit', folder, '--jobs', '1'], ok: [0, 1]});
const bareSubject = (folder) => ({label: 'bare loop: read, parse, canonicalise, verify', args: [fileURLToPath(import.meta.url), '--bare', folder], ok: [0]});

/** A folder holding the first `count` generated records (hard links) and the stored rule texts. */
function subset(work, all, count) {
	const folder = join(work, `records-${count}`);
	if (existsSync(join(folder, '.complete'))) return folder;
	rmSync(folder, {recursive: true, force: true});
	for (const name of readdirSync(join(all, 'rules'))) {
		mkdirSync(join(folder, 'rules'), {recursive: true});
		linkSync(join(all, 'rules', name), join(folder, 'rules', name));
	}
	const files = listFiles(all).filter((path) => !path.includes('/rules/'));
	const byIndex = files.map((path) => ({path, index: Number(/record-(\d+)\.json$/.exec(path)?.[1])})).filter((entry) => entry.index < count);
	for (const {path} of byIndex) {
		const target = join(folder, path.slice(all.length + 1));
		mkdirSync(join(target, '..'), {recursive: true});
		linkSync(path, target);
	}
	openSync(join(folder, '.complete'), 'w');
	return folder;
}

async function main() {
	const count = Number(values.records);
	const rounds = Number(values.rounds);
	if (!Number.isInteger(count) || count < 2) fail(`--records wants a whole number of at least 2, not "${values.records}"`);
	if (!Number.isInteger(rounds) || rounds < 1) fail(`--rounds wants a whole number of at least 1, not "${values.rounds}"`);
	process.chdir(repoRoot);
	if (!existsSync('dist/prelase.js')) fail('dist/prelase.js is missing; run `npm run bench` (it builds first) or `npm run build`');

	const growth = [...new Set([1000, 10_000, ...(values['with-100k'] ? [100_000] : []), count])].sort((a, b) => a - b);
	const largest = growth.at(-1);
	const work = values.keep ?? mkdtempSync(join(tmpdir(), 'prelase-bench-audit-'));
	const all = join(work, 'records');
	const home = join(work, 'home');
	const marker = join(work, 'generated.json');
	const ready = existsSync(marker) && JSON.parse(readFileSync(marker, 'utf8')).count >= largest;
	if (!ready) {
		rmSync(all, {recursive: true, force: true});
		for (const name of existsSync(work) ? readdirSync(work) : []) if (name.startsWith('records-')) rmSync(join(work, name), {recursive: true, force: true});
		mkdirSync(all, {recursive: true});
		const {generateRecords} = await import(await buildGenerator());
		const started = performance.now();
		generateRecords({folder: all, home, count: largest, marker});
		const seconds = (performance.now() - started) / 1000;
		process.stdout.write(`generated ${largest} signed records in ${seconds.toFixed(1)} s (${((seconds / largest) * 1000).toFixed(2)} ms a record; ${all})\n`);
	} else {
		process.stdout.write(`reusing the signed records in ${all}\n`);
	}
	const holds = [];

	// Record size.
	const sizes = listFiles(all).slice(0, 2000).map((path) => statSync(path).size).sort((a, b) => a - b);
	const largestRecord = sizes.at(-1);
	const sizeHolds = largestRecord <= TARGET_RECORD_BYTES;
	holds.push(sizeHolds);
	const stored = readdirSync(join(all, 'rules')).map((name) => statSync(join(all, 'rules', name)).size);
	process.stdout.write(
		`record size: median ${(sizes[Math.floor(sizes.length / 2)] / 1000).toFixed(1)} kB, largest ${(largestRecord / 1000).toFixed(1)} kB (of ${sizes.length}); ` +
			`target at most ${TARGET_RECORD_BYTES / 1000} kB: ${sizeHolds ? 'HOLDS' : 'DOES NOT HOLD'}; rule texts stored once: ${stored.length} (${stored.map((size) => `${(size / 1000).toFixed(1)} kB`).join(', ')})\n`,
	);

	// Audit against the bare loop, at --records.
	const folder = subset(work, all, count);
	const subjects = [
		{key: 'bare', ...bareSubject(folder)},
		{key: 'audit', ...auditSubject(folder)},
		{key: 'one', ...oneThreadSubject(folder)},
	];
	const runs = new Map(subjects.map((subject) => [subject.key, []]));
	for (let round = 0; round < rounds; round += 1) {
		for (let i = 0; i < subjects.length; i += 1) {
			const subject = subjects[(round + i) % subjects.length];
			runs.get(subject.key).push(timed(subject, work, home));
		}
	}
	const median = (samples) => [...samples].sort((a, b) => a - b)[Math.floor((samples.length - 1) / 2)];
	const bare = median(runs.get('bare').map((run) => run.seconds));
	const audit = median(runs.get('audit').map((run) => run.seconds));
	const one = median(runs.get('one').map((run) => run.seconds));
	const ratio = audit / bare;
	const out = [
		`node ${process.version} on ${process.platform}/${process.arch}, ${availableParallelism()} cores; ${count} records; ${rounds} round(s), alternating; medians`,
		`  bare loop          ${bare.toFixed(2)} s wall  (${((bare / count) * 1000).toFixed(2)} ms a record; one thread)`,
		`  audit              ${audit.toFixed(2)} s wall  (${((audit / count) * 1000).toFixed(2)} ms a record; worker threads, the default above 2,000 records)`,
		`  audit --jobs 1     ${one.toFixed(2)} s wall  (${((one / count) * 1000).toFixed(2)} ms a record; one thread: ${(one / bare).toFixed(2)}x the bare loop)`,
	];
	let cpuRatio;
	if (runs.get('bare').every((run) => run.cpu !== undefined)) {
		const bareCpu = median(runs.get('bare').map((run) => run.cpu));
		const auditCpu = median(runs.get('audit').map((run) => run.cpu));
		const oneCpu = median(runs.get('one').map((run) => run.cpu));
		cpuRatio = auditCpu / bareCpu;
		out.push(`  CPU time (user + system): bare loop ${bareCpu.toFixed(2)} s, audit ${auditCpu.toFixed(2)} s (${cpuRatio.toFixed(2)}x), --jobs 1 ${oneCpu.toFixed(2)} s (${(oneCpu / bareCpu).toFixed(2)}x): the work the audit does beyond the bare loop`);
	}
	const ratioHolds = ratio <= TARGET_RATIO;
	holds.push(ratioHolds);
	out.push(`  audit / bare loop = ${ratio.toFixed(2)}x wall time; target at most ${TARGET_RATIO.toFixed(1)}x: ${ratioHolds ? 'HOLDS' : 'DOES NOT HOLD'}`);
	process.stdout.write(`${out.join('\n')}\n`);

	// Growth.
	const rows = [];
	for (const size of growth) {
		const measured = size === count ? runs.get('audit')[0] : timed(auditSubject(subset(work, all, size)), work, home);
		rows.push({size, ...measured});
	}
	process.stdout.write('growth of `prelase audit FOLDER` (default summary):\n');
	process.stdout.write(`  ${'records'.padStart(8)}  ${'wall s'.padStart(8)}  ${'CPU s'.padStart(8)}  ${'ms/record'.padStart(9)}  ${'peak MB'.padStart(8)}  ${'output MB'.padStart(9)}\n`);
	for (const row of rows) {
		process.stdout.write(`  ${String(row.size).padStart(8)}  ${row.seconds.toFixed(2).padStart(8)}  ${(row.cpu?.toFixed(2) ?? '-').padStart(8)}  ${((row.seconds / row.size) * 1000).toFixed(2).padStart(9)}  ${(row.rssMb?.toFixed(0) ?? '-').padStart(8)}  ${(row.outputBytes / 1e6).toFixed(2).padStart(9)}\n`);
	}
	const biggest = rows.at(-1);
	if (biggest.size >= 100_000 && biggest.rssMb !== undefined) {
		const memoryHolds = biggest.rssMb < 300;
		holds.push(memoryHolds);
		process.stdout.write(`  peak memory at ${biggest.size} records ${biggest.rssMb.toFixed(0)} MB; target under 300 MB: ${memoryHolds ? 'HOLDS' : 'DOES NOT HOLD'}\n`);
	}
	if (values.keep === undefined) rmSync(work, {recursive: true, force: true});
	if (values.strict && holds.includes(false)) process.exitCode = 1;
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
	const {taskBuildOptions} = await import('./task-build-options.mjs');
	await build({
		...taskBuildOptions,
		stdin: {contents: generatorSource, resolveDir: repoRoot, sourcefile: 'audit-generate.ts', loader: 'ts'},
		outfile,
		define: {PRELASE_VERSION: JSON.stringify(JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8')).version)},
	});
	return outfile;
}

// Records as a site would have them: 500 setups checked about 20 times each by three operators
// (each operator's records chained as prelase chains them),
// with setpoints and ambient temperatures that vary (some records clear, some do not), every
// tenth one also approved by the laser safety officer, and every hundredth an amendment of the
// setup's previous record. Each record is built and signed by prelase's own code; the rule text
// is stored once beside them, as prelase stores it. The setpoint repeats every 120 records and
// the ambient every 10, so there are only 120 distinct evaluations: each is made once and
// reused (the setup name and location, plain text, enter no check). Every 997th record is
// evaluated afresh and its body compared with the one built from the reused evaluation.
const generatorSource = `
import {mkdirSync, writeFileSync} from 'node:fs';
import {isDeepStrictEqual} from 'node:util';
import {join} from 'node:path';
import {buildRecordBody, bodySha256} from './source/records/build-body.js';
import {recordJson} from './source/records/record-json.js';
import {sha256Hex} from './source/shared/sha256.js';
import {writeTrusted} from './source/records/key-files.js';
import {fingerprint, generateKeyPair, rawPublicKey} from './source/records/key-material.js';
import {storeRuleText} from './source/records/rule-texts.js';
import {signRecord} from './source/records/sign.js';
import {evaluate} from './source/rules/evaluate/evaluate.js';
import {parseInputEntry} from './source/rules/evaluate/input-entry.js';
import {loadAnswers} from './source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from './source/rules/load.js';

export function generateRecords({folder, home, count, marker}) {
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error('the shipped rules do not load');
	const rules = loaded.value;
	storeRuleText(folder, rules.text);
	const base = loadAnswers('docs/examples/bench3-808nm-clear.yaml', rules);
	if (!base.ok) throw new Error('the demo answers do not load');
	const people = ['Dana Whitlow', 'Kofi Mensah', 'Ines Duarte'].map((name) => ({name, role: 'test engineer', ...generateKeyPair()}));
	const officer = {name: 'R. Osei', role: 'laser safety officer', ...generateKeyPair()};
	writeTrusted(home, [...people, officer].map((person) => {
		const raw = rawPublicKey(person.publicKey);
		return {name: person.name, publicKey: raw.toString('base64'), fingerprint: fingerprint(raw), addedAt: '2026-01-01T00:00:00+00:00', ...(person === officer ? {roles: ['laser safety officer']} : {})};
	}));
	const entry = (id, text) => {
		const parsed = parseInputEntry(rules.inputs.get(id), text);
		if (!parsed.ok) throw new Error(id + ': ' + text);
		return parsed.value;
	};
	const setups = 500;
	const hashes = new Map();
	const evaluations = new Map();
	const months = new Set();
	// Each operator's records form a chain: each names the previous record of its key (file and SHA-256 of its bytes).
	const last = new Map();
	const start = Date.parse('2026-01-05T08:00:00Z');
	for (let index = 0; index < count; index += 1) {
		const setup = index % setups;
		const inputs = new Map(base.value.inputs);
		inputs.set('location', entry('location', 'Room B.' + (100 + Math.floor(setup / 10)) + ', bench ' + (setup % 10)));
		const setpoint = (1 + ((index * 7) % 120) / 100).toFixed(2) + ' A';
		const ambient = (20 + ((index * 3) % 30)) + ' degC';
		inputs.set('current_setpoint', entry('current_setpoint', setpoint));
		inputs.set('ambient_max', entry('ambient_max', ambient));
		const answers = {setup: 'Bench ' + setup + ' — FH-808-2 on LD-5L', inputs, confirmations: base.value.confirmations};
		const key = setpoint + '|' + ambient;
		let evaluation = evaluations.get(key);
		if (!evaluation) {
			evaluation = evaluate(rules, answers);
			evaluations.set(key, evaluation);
		}
		const now = new Date(start + index * 60_000);
		const person = people[setup % people.length];
		const amends = index >= setups && index % 100 === 0 && hashes.has(index - setups)
			? {record: 'record-' + (index - setups) + '.json', bodySha256: hashes.get(index - setups), reason: 'ambient maximum re-measured'}
			: undefined;
		const body = {...buildRecordBody({rules, answers, evaluation, operator: {name: person.name, role: person.role}, now, ...(amends ? {amends} : {})}), previous: last.get(person.name) ?? null};
		if (index % 997 === 0) {
			const fresh = buildRecordBody({rules, answers, evaluation: evaluate(rules, answers), operator: {name: person.name, role: person.role}, now, ...(amends ? {amends} : {})});
			if (!isDeepStrictEqual({...fresh, previous: body.previous}, body)) throw new Error('record ' + index + ': the reused evaluation gives another body than a fresh one');
		}
		if ((index + setups) % 100 === 0) hashes.set(index, bodySha256(body));
		const signers = [{signer: {name: person.name, role: person.role, purpose: 'operator'}, key: person.privateKey}];
		if (index % 10 === 0) signers.push({signer: {name: officer.name, role: officer.role, purpose: 'approval'}, key: officer.privateKey});
		const record = signRecord(body, signers, now);
		const month = join(folder, body.createdAt.slice(0, 7));
		if (!months.has(month)) {
			mkdirSync(month, {recursive: true});
			months.add(month);
		}
		const text = recordJson(record);
		writeFileSync(join(month, 'record-' + index + '.json'), text);
		last.set(person.name, {file: 'record-' + index + '.json', sha256: sha256Hex(Buffer.from(text, 'utf8'))});
	}
	writeFileSync(marker, JSON.stringify({count}));
}
`;

if (values.bare === undefined) await main();
else process.exitCode = bareLoop(values.bare);
