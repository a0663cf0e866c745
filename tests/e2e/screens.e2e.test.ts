import {execFileSync, spawnSync} from 'node:child_process';
import {existsSync, linkSync, mkdtempSync, readdirSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterEach, describe, expect, it, vi} from 'vitest';
import {parse} from 'yaml';
import {draftPath, loadDraft, saveDraft} from '../../source/services/drafts/draft-store.js';
import {planDraftPath} from '../../source/services/drafts/plan-draft-store.js';
import {openSettings} from '../../source/services/settings.js';
import {haveTmux, TmuxSession} from './tmux-driver.js';

type RuleFile = {steps: Array<{inputs?: Array<{id: string; label: string; kind?: string; options?: Record<string, string>}>; confirmations?: Array<{id: string; statement: string}>}>};
type Answers = {setup: string; inputs: Record<string, unknown>; confirmations: Record<string, unknown>};

const program = resolve('dist/prelase.js');
const rules = parse(readFileSync('rules/default.yaml', 'utf8')) as RuleFile;
const demo = parse(readFileSync('docs/examples/bench3-808nm-clear.yaml', 'utf8')) as Answers;
const sessions: TmuxSession[] = [];

/** Every field a screen can focus, by the first words of its label. */
const fields = rules.steps.flatMap((step) => [
	...(step.inputs ?? []).map((input) => ({id: input.id, label: input.label, kind: input.kind ?? 'quantity', options: Object.keys(input.options ?? {})})),
	...(step.confirmations ?? []).map((confirmation) => ({id: confirmation.id, label: confirmation.statement, kind: 'confirmation', options: [] as string[]})),
]);

function focusedField(screen: string) {
	const line = screen.split('\n').find((text) => text.startsWith('› '));
	if (!line) return undefined;
	const shown = line.slice(2).trim();
	return fields.find((field) => field.label.startsWith(shown) || shown.startsWith(field.label.slice(0, Math.min(field.label.length, 60))));
}

function start(name: string, home: string, args = '', size: [number, number] = [100, 32]): TmuxSession {
	const session = new TmuxSession(name, `env -u CI -u CONTINUOUS_INTEGRATION PRELASE_HOME=${home} node ${program} ${args}; echo "EXITED $?"; sleep 30`, ...size);
	sessions.push(session);
	return session;
}

/** Answers the focused field from the demo answers; returns false when there is no focused field. */
async function answerFocused(session: TmuxSession): Promise<boolean> {
	const screen = await session.settle();
	const field = focusedField(screen);
	if (!field) return false;
	const before = screen;
	if (field.kind === 'confirmation') {
		const raw = demo.confirmations[field.id];
		if (typeof raw === 'object' && raw !== null) {
			session.type('a');
			await session.waitFor((now) => now.includes('note (required'), 'the note prompt');
			session.type(String((raw as {note: string}).note));
			session.press('Enter');
		} else session.type(raw === true || raw === 'yes' ? 'y' : 'n');
	} else {
		const value = demo.inputs[field.id];
		if (field.kind === 'choice') session.type(String(field.options.indexOf(String(value)) + 1));
		if (field.kind === 'yes_no') session.type(value === true || value === 'yes' ? 'y' : 'n');
		else {
			// Clear a prefilled default, then type the demo's value (an optional input the demo leaves out stays blank).
			if (field.kind !== 'choice' && value !== undefined) {
				for (let index = 0; index < 12; index += 1) session.press('BSpace');
				session.type(String(value));
			}
			session.press('Enter');
		}
	}
	await session.waitFor((now) => now !== before, `the screen to change after answering ${field.id}`);
	return true;
}

afterEach(() => {
	for (const session of sessions.splice(0)) session.kill();
});

describe.skipIf(!haveTmux())('the screens in a real terminal', () => {
	it('completes, signs and audits the demo check', {timeout: 120_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const records = join(home, 'records');
		execFileSync('node', [program, 'keys', '--name', 'Dana Whitlow'], {env: {...process.env, PRELASE_HOME: home}});
		const session = start('full', home, 'check');
		await session.waitFor((screen) => screen.includes('Step 1 of'), 'the first step');
		for (let guard = 0; guard < 200; guard += 1) {
			const screen = await session.settle();
			if (screen.includes('Summary:')) break;
			if (!(await answerFocused(session))) {
				session.press('Enter');
				await session.settle();
			}
		}
		const summary = await session.waitFor((screen) => screen.includes('Outcome: CLEAR TO ENERGIZE'), 'the summary with the outcome');
		expect(summary).toMatch(/! advise\s+Dissipation with the output shorted/);
		session.press('Enter');
		await session.waitFor((screen) => screen.includes('Sign-off'), 'the sign-off');
		session.type(demo.setup);
		session.press('Enter');
		session.type('Dana Whitlow');
		session.press('Enter');
		session.type('test engineer');
		session.press('Enter', 'Down', 'Down', 'Down');
		await session.settle();
		session.press('Enter');
		const done = await session.waitFor((screen) => screen.includes('Signed record written'), 'the record to be written');
		expect(done).toContain(records);
		const written = readdirSync(records).filter((file) => file.endsWith('.json'));
		expect(written).toHaveLength(1);
		const audit = spawnSync('node', [program, 'audit', records], {env: {...process.env, PRELASE_HOME: home}, encoding: 'utf8'});
		expect(audit.status, audit.stdout + audit.stderr).toBe(0);
		const record = JSON.parse(readFileSync(join(records, written[0]!), 'utf8')) as {body: {outcome: string; operator: {name: string}}};
		expect(record.body.outcome).toBe('clear_to_energize');
		expect(record.body.operator.name).toBe('Dana Whitlow');
		session.press('Enter');
		await session.waitFor((screen) => screen.includes('Start a bench check'), 'the home screen');
		session.press('C-c');
		await session.waitFor((screen) => screen.includes('EXITED 130'), 'the program to leave with 130');
	});

	it('refuses to sign under a name that is not the key\'s, at 80x24, and writes nothing', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		execFileSync('node', [program, 'keys', '--name', 'Dana Whitlow'], {env: {...process.env, PRELASE_HOME: home}});
		const session = start('wrong-name', home, 'check', [80, 24]);
		await session.waitFor((screen) => screen.includes('Step 1 of'), 'the first step');
		for (let step = 2; step <= 9; step += 1) {
			session.press('PageDown');
			await session.waitFor((screen) => screen.includes(`Step ${step} of 9`), `step ${step}`);
		}
		session.press('PageDown');
		await session.waitFor((screen) => screen.includes('Outcome: INCOMPLETE'), 'the summary');
		session.press('Enter');
		await session.waitFor((screen) => screen.includes('Sign-off'), 'the sign-off');
		session.type('Bench 3 demo');
		session.press('Enter');
		session.type('Sam Colleague');
		session.press('Enter');
		session.type('test engineer');
		session.press('Enter', 'Down', 'Down', 'Down');
		await session.settle();
		session.press('Enter');
		const refused = await session.waitFor((screen) => screen.includes('your key is the key of'), 'the refusal');
		expect(refused.replaceAll(/\s+/g, ' ')).toContain('✗ you sign as "Sam Colleague", but your key is the key of "Dana Whitlow"; sign under your key\'s name (prelase keys shows it)');
		expect(refused).toContain('Sign-off');
		// Nothing was written: no record, and not the rule text either.
		const records = join(home, 'records');
		expect(existsSync(records) ? readdirSync(records, {recursive: true}) : []).toEqual([]);
	});

	it('takes Down Down Down sent at once on the home menu as three moves, and keeps its place after Esc, at 80x24', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const session = start('home-burst', home, '', [80, 24]);
		await session.waitFor((screen) => screen.includes('❯ Start a bench check'), 'the home menu');
		// One send-keys: the three keys reach the program together.
		session.press('Down', 'Down', 'Down');
		await session.waitFor((screen) => screen.includes('❯ Settings'), 'the cursor on Settings (three items down)');
		session.press('Enter');
		await session.waitFor((screen) => screen.includes('Operator name'), 'the settings');
		session.press('Escape');
		const back = await session.waitFor((screen) => screen.includes('Start a bench check'), 'the home menu again');
		expect(back).toContain('❯ Settings (operator, role, records folder, rule file)');
	});

	it('resumes a check after the program is killed', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const first = start('killed', home, 'check');
		await first.waitFor((screen) => screen.includes('Step 1 of'), 'the first step');
		for (let count = 0; count < 3; count += 1) await answerFocused(first);
		// kill -9 the program, not politely: the draft on disk is all that is left
		const pid = spawnSync('tmux', ['-L', first.socket, 'list-panes', '-F', '#{pane_pid}'], {encoding: 'utf8'}).stdout.trim();
		spawnSync('pkill', ['-9', '-P', pid, '-f', 'prelase.js']);
		await first.waitFor((screen) => screen.includes('EXITED 137'), 'the killed program');
		const second = start('resumed', home);
		const homeScreen = await second.waitFor((screen) => screen.includes('Resume the draft'), 'the offer to resume');
		expect(homeScreen).toContain('Resume the draft');
		second.press('Enter');
		const resumed = await second.waitFor((screen) => screen.includes('Step 1 of'), 'the resumed step');
		expect(resumed).toContain(String(demo.inputs['diode_serial']));
		expect(resumed).toContain(String(demo.inputs['driver_serial']));
		expect(resumed).toContain(String(demo.inputs['location']));
	});

	it('takes no answer from a sentence typed at a confirmation, as a paste or key by key, at 80x24', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const session = start('sentence', home, 'check', [80, 24]);
		await session.waitFor((screen) => screen.includes('Step 1 of'), 'the first step');
		for (let step = 2; step <= 9; step += 1) {
			session.press('PageDown');
			await session.waitFor((screen) => screen.includes(`Step ${step} of 9`), `step ${step}`);
		}
		await session.waitFor((screen) => screen.includes('Step 9 of 9: ESD and transients'), 'the ESD step');
		const strap = '› The wrist strap was tested today';
		const mat = '› Work is on a grounded dissipative mat';
		expect(await session.settle()).toContain(strap);
		const esd = rules.steps.at(-1)!.confirmations!.map((confirmation) => confirmation.id);
		const answered = () => Object.keys(loadDraft(openSettings({PRELASE_HOME: home}).folder)?.confirmations ?? {}).filter((id) => esd.includes(id));

		// One chunk, as a paste or a fast typist delivers it; then Enter, which must not move on.
		session.type('by Kim');
		let screen = await session.settle();
		expect(answered()).toEqual([]);
		expect(screen).toContain(strap);
		expect(screen).toContain('typed "by Kim", not taken');
		expect(screen.replaceAll(/\s+/g, ' ')).toContain('typed text is not an answer');
		session.press('Enter');
		screen = await session.settle();
		expect(screen).toContain(strap);
		expect(screen).toMatch(/^ {2}\? unanswered · typed "by Kim", not taken/m);
		expect(answered()).toEqual([]);

		// Key by key, each its own keystroke, at the next confirmation.
		session.press('BSpace', 'Down');
		await session.waitFor((now) => now.includes(mat), 'the grounded-mat confirmation');
		for (const character of 'Strap tester ST-3') {
			const before = session.screen();
			session.type(character);
			await session.waitFor((now) => now !== before, `the screen to change after "${character}"`);
		}
		session.press('Enter');
		screen = await session.settle();
		expect(screen).toContain(mat);
		expect(screen).toContain('typed "Strap tester ST-3", not taken');
		expect(screen).not.toContain('note (required');
		for (const line of screen.split('\n').filter((text) => /^ {2}(The wrist strap|The diode's leads|Connections were|Nothing is plugged)/.test(text))) expect(line).toMatch(/\? unanswered$/);
		expect(answered()).toEqual([]);
		// Nothing scrolled off the 24 lines: the title on top, the key line below the fields.
		expect(screen.split('\n')[0]).toMatch(/^prelase · bench check/);
		expect(screen).toContain('Step 9 of 9: ESD and transients');
		expect(screen).toContain('Enter accept · ↑ ↓ field · PgDn PgUp step · Esc back · ? help');

		// A y pressed on its own, once the typed text is cleared, answers that one confirmation.
		session.press('BSpace');
		await session.waitFor((now) => !now.includes('not taken'), 'the typed text cleared');
		session.type('y');
		screen = await session.waitFor((now) => /Work is on a grounded dissipative mat.*✓ yes/.test(now), 'the grounded-mat confirmation answered yes');
		// The draft is written by the program beside the redraw: poll for it rather than race it.
		await vi.waitFor(() => expect(answered()).toEqual(['grounded_mat']), {timeout: 5000, interval: 50});
		session.press('C-c');
		await session.waitFor((now) => now.includes('EXITED 130'), 'the program to leave with 130');
	});

	// no-color.org: "Command-line software which adds ANSI color to its output by default should
	// check for a NO_COLOR environment variable that, when present and not an empty string
	// (regardless of its value), prevents the addition of ANSI color." ECMA-48 §5.4: every control
	// sequence of a colour or attribute starts with ESC [ (CSI).
	it.each([
		{colour: 'NO_COLOR unset', env: '', expectEscapes: true},
		{colour: 'NO_COLOR=1', env: 'NO_COLOR=1', expectEscapes: false},
	])('the first step drawn by the built bundle with $colour and FORCE_COLOR unset', {timeout: 30_000}, async ({env, expectEscapes}) => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const session = new TmuxSession(`colour-${expectEscapes ? 'on' : 'off'}`, `env -u CI -u CONTINUOUS_INTEGRATION -u FORCE_COLOR -u NO_COLOR ${env} PRELASE_HOME=${home} node ${program} check; sleep 30`);
		sessions.push(session);
		await session.waitFor((screen) => screen.includes('Step 1 of'), 'the first step');
		await session.settle();
		const raw = session.rawScreen();
		// The same screen is coloured without NO_COLOR (so the check below can fail), and has not one CSI with it.
		expect(raw.includes('\u001B['), raw).toBe(expectEscapes);
		expect(raw).toContain('Step 1 of 9');
	});

	// A terminal that closes, a service manager or `kill` sends SIGTERM; conventionally a program
	// ended by signal N exits with 128 + N (POSIX shells report it so): 143 for SIGTERM (15).
	it('leaves within 1.5 s on SIGTERM while the home screen audits a large records folder', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const records = join(home, 'records');
		const signed = spawnSync('node', [program, 'check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--sign', 'Dana Whitlow', '--records', records], {env: {...process.env, PRELASE_HOME: home}, encoding: 'utf8'});
		expect(signed.status, signed.stderr).toBe(0);
		const [record] = readdirSync(records).filter((file) => file.endsWith('.json'));
		// 1,500 names for one record: seconds of synchronous audit work (about 5 ms a record, measured).
		for (let copy = 0; copy < 1500; copy += 1) linkSync(join(records, record!), join(records, `copy-${copy}.json`));
		writeFileSync(join(home, 'config.json'), JSON.stringify({recordsFolder: records}));
		const session = start('sigterm', home);
		await session.waitFor((screen) => screen.includes('Audit the records folder'), 'the home screen');
		const menu = ['Start a bench check', 'Audit the records folder'];
		await session.settle();
		for (let step = 0; !/❯ Audit the records folder/.test(session.screen()) && step < 5; step += 1) {
			session.press('Down');
			await session.settle();
		}
		expect(session.screen()).toContain(`❯ ${menu[1]}`);
		session.press('Enter');
		// One second into the audit (a screen that works on its own thread shows "Auditing…" meanwhile; one that blocks shows nothing new).
		await new Promise((resolve) => setTimeout(resolve, 1000));
		const pane = spawnSync('tmux', ['-L', session.socket, 'list-panes', '-F', '#{pane_pid}'], {encoding: 'utf8'}).stdout.trim();
		const node = spawnSync('pgrep', ['-P', pane], {encoding: 'utf8'}).stdout.trim().split('\n')[0]!;
		const sent = Date.now();
		process.kill(Number(node), 'SIGTERM');
		await session.waitFor((screen) => screen.includes('EXITED 143'), 'the program to leave with 143', 1500);
		expect(Date.now() - sent).toBeLessThan(1500);
	});

	// The planner's edits and opening of a plan near the 1 MiB size limit take seconds of work (parse,
	// validate, analyse); a SIGTERM in the middle of either is honoured within about a second (exit
	// 143, as above), and the draft of the edits applied before it is on disk, whole.
	it('leaves within 1.5 s on SIGTERM during an edit of a 3,600-device plan, and while it opens, its draft intact', {timeout: 90_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const file = join(home, 'large-plan.yaml');
		writeFileSync(file, largePlan(3600));
		const session = start('plan-sigterm', home, `plan ${file} --edit`);
		await session.waitFor((screen) => screen.includes('Devices in wiring order (3600)'), 'the planner', 30_000);
		// A first edit, applied and kept as a draft: the first access point removed.
		session.press('x');
		await session.waitFor((screen) => screen.includes('Remove the access point enclosure_lid'), 'the removal prompt');
		session.press('y');
		await session.waitFor((screen) => screen.includes('Access points (4)'), 'the first edit', 30_000);
		const [draftFile] = readdirSync(join(home, 'drafts')).filter((name) => name.startsWith('plan-'));
		const kept = readFileSync(join(home, 'drafts', draftFile!), 'utf8');
		// A second edit, and SIGTERM once the program has spent 0.3 s of processor time on it (so the work has begun).
		const pane = spawnSync('tmux', ['-L', session.socket, 'list-panes', '-F', '#{pane_pid}'], {encoding: 'utf8'}).stdout.trim();
		const node = spawnSync('pgrep', ['-P', pane], {encoding: 'utf8'}).stdout.trim().split('\n')[0]!;
		session.press('x');
		await session.waitFor((screen) => screen.includes('Remove the access point side_panel'), 'the second removal prompt');
		const before = cpuSeconds(node);
		session.press('y');
		for (const deadline = Date.now() + 10_000; cpuSeconds(node) - before < 0.3 && Date.now() < deadline; ) await new Promise((resolve) => setTimeout(resolve, 10));
		const sent = Date.now();
		process.kill(Number(node), 'SIGTERM');
		await session.waitFor((screen) => screen.includes('EXITED 143'), 'the program to leave with 143', 5000);
		expect(Date.now() - sent).toBeLessThan(1500);
		// The draft is the first edit's, whole: the same bytes, and its plan has the four access points left.
		expect(readFileSync(join(home, 'drafts', draftFile!), 'utf8')).toBe(kept);
		const draft = JSON.parse(kept) as {text: string};
		expect((parse(draft.text) as {access_points: Array<{id: string}>}).access_points.map(({id}) => id)).toEqual(['side_panel', 'fibre_port', 'room_door', 'cable_gland']);

		// Opened again (the plan and its draft are read and checked after the first frame), and SIGTERM while it opens.
		const reopened = start('plan-sigterm-open', home, `plan ${file} --edit`);
		await reopened.waitFor((screen) => screen.includes('Opening'), 'the plan being opened', 10_000);
		const pane2 = spawnSync('tmux', ['-L', reopened.socket, 'list-panes', '-F', '#{pane_pid}'], {encoding: 'utf8'}).stdout.trim();
		const node2 = spawnSync('pgrep', ['-P', pane2], {encoding: 'utf8'}).stdout.trim().split('\n')[0]!;
		const opening = cpuSeconds(node2);
		for (const deadline = Date.now() + 10_000; cpuSeconds(node2) - opening < 0.5 && Date.now() < deadline; ) await new Promise((resolve) => setTimeout(resolve, 10));
		const sent2 = Date.now();
		process.kill(Number(node2), 'SIGTERM');
		await reopened.waitFor((screen) => screen.includes('EXITED 143'), 'the program to leave with 143', 5000);
		expect(Date.now() - sent2).toBeLessThan(1500);
		expect(readFileSync(join(home, 'drafts', draftFile!), 'utf8')).toBe(kept);
	});
});

/** Processor time a process has used, user and system, in seconds (Linux proc(5): fields 14 and 15 of /proc/PID/stat, in clock ticks of 1/100 s). */
function cpuSeconds(pid: string): number {
	const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
	return (Number(fields[11]) + Number(fields[12])) / 100;
}

/** The demo interlock plan with its devices replaced by `count` invented door switches in series (about 280 bytes each). */
function largePlan(count: number): string {
	const text = readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8');
	const devices = Array.from({length: count}, (_, index) => `  - id: sw_${index}\n    kind: door_switch\n    description: Invented door switch ${index}\n    contact: normally_closed\n    contact_resistance: 1 mohm\n    rated_current: 2 A\n    rated_voltage: 30 V\n    positive_opening: true\n    opening_time: 8 ms\n    wire_to_next: {awg: 22, length: 0.01 m}\n`);
	return `${text.slice(0, text.indexOf('devices:')).replaceAll(/device: \w+/g, 'device: sw_0')}devices:\n${devices.join('')}`;
}

/** A draft of the demo check as if typed on screen, less some confirmations, resumed at a step (0-based). */
function seedDemoDraft(home: string, leaveOut: string[], step = 0): void {
	const confirmations: Record<string, {answer: 'yes' | 'no' | 'not_applicable'; note?: string}> = {};
	for (const [id, raw] of Object.entries(demo.confirmations)) {
		if (leaveOut.includes(id)) continue;
		if (typeof raw === 'object' && raw !== null) {
			const {answer, note} = raw as {answer: string; note: string};
			confirmations[id] = {answer: answer.replace(' ', '_') as 'not_applicable', note};
		} else confirmations[id] = {answer: raw === true || raw === 'yes' ? 'yes' : 'no'};
	}
	const entries = Object.fromEntries(Object.entries(demo.inputs).map(([id, value]) => [id, String(value)]));
	saveDraft(openSettings({PRELASE_HOME: home}).folder, {rulesFile: resolve('rules/default.yaml'), rulesSha256: '', setup: demo.setup, entries, confirmations, step, savedAt: '2026-12-05T09:00:00.000Z'});
}

/** Resumes the seeded draft from the home screen and pages on until the wanted screen shows. */
async function resumeAndPage(session: TmuxSession, until: (screen: string) => boolean, what: string): Promise<string> {
	await session.waitFor((screen) => screen.includes('Resume the draft'), 'the offer to resume');
	await session.settle();
	session.press('Enter');
	await session.waitFor((screen) => /Step \d of 9/.test(screen), 'the resumed step');
	for (let guard = 0; guard < 12; guard += 1) {
		const screen = await session.settle();
		if (until(screen)) return screen;
		session.press('PageDown');
		await session.waitFor((now) => now !== screen, 'the next page');
	}
	return session.waitFor(until, what, 100);
}

/** Pages from the step shown on to the summary. */
async function resumeAndPageFromStep(session: TmuxSession): Promise<string> {
	for (let guard = 0; guard < 12; guard += 1) {
		const screen = await session.settle();
		if (screen.includes('Outcome:')) return screen;
		session.press('PageDown');
		await session.waitFor((now) => now !== screen, 'the next page');
	}
	return session.waitFor((now) => now.includes('Outcome:'), 'the summary', 100);
}

const cautionStart = 'prelase checks arithmetic and records answers';
const deferralStart = 'prelase says which checks held';

describe.skipIf(!haveTmux())('the screens at 80x24, as a technician meets them', () => {
	it('the summary puts what blocks energizing first and keeps its reason, title and one caution line in view', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		seedDemoDraft(home, ['use_authorised', 'sop_present', 'operator_trained']);
		const session = start('summary-order', home, '', [80, 24]);
		const screen = await resumeAndPage(session, (now) => now.includes('Summary:'), 'the summary');
		const lines = screen.split('\n');
		expect(lines[0]).toMatch(/^prelase · bench check/);
		expect(screen).toContain('Outcome: INCOMPLETE');
		// The reason for the outcome, in view without scrolling: the first confirmation left unanswered.
		expect(screen).toContain('? unanswered');
		expect(screen).toContain('Use of this laser on this bench is authorised');
		const first = (pattern: RegExp) => lines.findIndex((line) => pattern.test(line));
		expect(first(/^\? unanswered/)).toBeGreaterThan(0);
		// Unanswered before advice, advice before passes.
		expect(first(/^\? unanswered/)).toBeLessThan(first(/^! advise/));
		if (first(/^✓ pass/) >= 0) expect(first(/^! advise/)).toBeLessThan(first(/^✓ pass/));
		// The caution is said once, on the home screen; here one line with the key that opens it.
		expect(screen).not.toContain(cautionStart);
		expect(screen).not.toContain(deferralStart);
		const cautionLines = lines.filter((line) => line.includes('local codes'));
		expect(cautionLines).toHaveLength(1);
		expect(cautionLines[0]).toMatch(/\? /);
		expect(lines.filter((line) => line.trim() !== '').at(-1)).toContain('Enter sign-off');
		session.type('?');
		await session.waitFor((now) => now.includes('? again: the caution in full'), 'the keys of the summary');
		session.type('?');
		const opened = await session.waitFor((now) => now.replaceAll(/\s+/g, ' ').includes(cautionStart), 'the full caution');
		expect(opened.replaceAll(/\s+/g, ' ')).toContain(deferralStart);
		expect(opened.split('\n')[0]).toMatch(/^prelase · bench check/);
	});

	it("shows a step's verdicts after its last answer until the user moves on, each title whole", {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		seedDemoDraft(home, [], 4);
		const session = start('step-verdicts', home, '', [80, 24]);
		let screen = await resumeAndPage(session, (now) => now.includes('Step 5 of 9: Driver dissipation'), 'step 5');
		// Enter on each field accepts the value the draft holds; after the last one the step stays.
		for (let guard = 0; guard < 8 && screen.split('\n').some((line) => line.startsWith('› ')); guard += 1) {
			session.press('Enter');
			screen = await session.waitFor((now) => now !== screen, 'the next field');
			screen = await session.settle();
		}
		expect(screen).toContain('Step 5 of 9: Driver dissipation');
		const flat = screen.replaceAll(/\s+/g, ' ');
		// The step's two checks (rules/default.yaml, step thermal), whole, with their verdicts.
		expect(flat).toContain('✓ pass Worst-case driver dissipation within its derated rating');
		expect(flat).toContain('! advise Dissipation with the output shorted within the derated rating');
		// Each judged at the supply's high end: the demo's 5 V with the rules' default 5 % (5 × 1.05 = 5.25 V, hand arithmetic).
		expect(flat).toContain('judged at supply_nominal 5.25 V (high end)');
		expect(screen).toContain('Enter or PgDn: on to step 6');
		expect(screen.split('\n')[0]).toMatch(/^prelase · bench check/);
		// ↑ goes back to the last field, ↓ from it shows the verdicts again.
		session.press('Up');
		await session.waitFor((now) => now.split('\n').some((line) => line.startsWith('› ')), 'the last field');
		session.press('Down');
		await session.waitFor((now) => now.includes('Enter or PgDn: on to step 6'), 'the verdicts again');
		session.press('Enter');
		await session.waitFor((now) => now.includes('Step 6 of 9'), 'step 6 after Enter');
	});

	it('Settings refuses a rule file with problems, shows them in place, and stores a good one as an absolute path', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const work = mkdtempSync(join(tmpdir(), 'prelase-e2e-work-'));
		writeFileSync(join(work, 'site.yaml'), 'name: Site policy\nsteps: [\n');
		writeFileSync(join(work, 'good.yaml'), readFileSync('rules/default.yaml'));
		const session = new TmuxSession('settings-rules', `cd ${work} && env -u CI -u CONTINUOUS_INTEGRATION PRELASE_HOME=${home} node ${program}; echo "EXITED $?"; sleep 30`, 80, 24);
		sessions.push(session);
		await session.waitFor((screen) => screen.includes('Settings ('), 'the home screen');
		await session.settle();
		for (let step = 0; !session.screen().includes('❯ Settings') && step < 6; step += 1) {
			session.press('Down');
			await session.settle();
		}
		session.press('Enter');
		await session.waitFor((screen) => /^Settings$/m.test(screen), 'the settings');
		session.press('Down', 'Down', 'Down');
		await session.waitFor((screen) => /^› Rule file/m.test(screen), 'the rule file field');
		session.type('site.yaml');
		session.press('Enter');
		// rules validate says of this file: site.yaml:3:1: error: YAML syntax error (a flow sequence never closed).
		let screen = await session.waitFor((now) => now.includes('YAML syntax error'), 'the problem shown in place');
		expect(screen).toContain(`${join(work, 'site.yaml')}:3:1`);
		expect(screen).not.toContain('Rule file saved');
		expect(openSettings({PRELASE_HOME: home}).read().rulesFile).toBeUndefined();
		for (let index = 0; index < 9; index += 1) session.press('BSpace');
		session.type('good.yaml');
		session.press('Enter');
		screen = await session.waitFor((now) => now.includes('✓ Rule file'), 'the good file saved');
		expect(screen).not.toContain('YAML syntax error');
		expect(openSettings({PRELASE_HOME: home}).read().rulesFile).toBe(join(work, 'good.yaml'));
	});

	it('opens the home screen with a broken rule file in the settings, names the setting, and offers Settings and the shipped policy', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const broken = join(home, 'site.yaml');
		writeFileSync(broken, 'name: Site policy\nsteps: [\n');
		writeFileSync(join(home, 'config.json'), JSON.stringify({rulesFile: broken}));
		const session = start('broken-rules', home, '', [80, 24]);
		let screen = await session.waitFor((now) => now.includes('Quit') || now.includes('EXITED'), 'the home screen');
		screen = await session.settle();
		const flat = screen.replaceAll(/\s+/g, ' ');
		expect(screen).not.toContain('EXITED');
		expect(flat).toContain('Rule file');
		expect(flat).toContain(join(home, 'config.json'));
		expect(flat).toContain('YAML syntax error');
		expect(screen).toContain('Settings');
		expect(screen).toMatch(/shipped policy/);
		expect(screen).not.toContain('Start a bench check');
		for (let step = 0; !/❯ .*shipped policy/.test(session.screen()) && step < 6; step += 1) {
			session.press('Down');
			await session.settle();
		}
		session.press('Enter');
		screen = await session.waitFor((now) => now.includes('Start a bench check'), 'the check offered under the shipped policy');
		expect(screen).toContain('prelase bench policy (shipped default)');
		session.press('Enter');
		await session.waitFor((now) => now.includes('Step 1 of 9'), 'the first step');
	});

	it('prelase check with a broken rule file in the settings opens the home screen, not an error', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		writeFileSync(join(home, 'config.json'), JSON.stringify({rulesFile: 'nowhere/site.yaml'}));
		const session = start('broken-check', home, 'check', [80, 24]);
		const screen = await session.waitFor((now) => now.includes('Quit') || now.includes('EXITED'), 'the home screen');
		expect(screen).not.toContain('EXITED');
		expect(screen).not.toContain('Step 1 of 9');
		expect(screen.replaceAll(/\s+/g, ' ')).toContain('nowhere/site.yaml');
	});

	it('the audit on the home screen fits 80 columns and scrolls, title and key line in place', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const records = join(home, 'records');
		for (let index = 0; index < 3; index += 1) {
			const signed = spawnSync('node', [program, 'check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--sign', 'Dana Whitlow', '--records', records], {env: {...process.env, PRELASE_HOME: home}, encoding: 'utf8'});
			expect(signed.status, signed.stderr).toBe(0);
		}
		writeFileSync(join(home, 'config.json'), JSON.stringify({recordsFolder: records}));
		const session = start('audit-fit', home, '', [80, 24]);
		await session.waitFor((screen) => screen.includes('Audit the records folder'), 'the home screen');
		await session.settle();
		for (let step = 0; !session.screen().includes('❯ Audit the records folder') && step < 5; step += 1) {
			session.press('Down');
			await session.settle();
		}
		session.press('Enter');
		let screen = await session.waitFor((now) => now.includes('↓') && now.includes('more'), 'the audit, with more below');
		const check = (now: string) => {
			const lines = now.split('\n');
			expect(lines[0]).toMatch(/^prelase · bench check/);
			expect(lines[2]).toContain(`Audit of ${records}`);
			// No table row wrapped into the next line: a column head is never cut in two.
			expect(now).not.toMatch(/^rded|^-on-ld/m);
			expect(now).toContain('Enter or Esc back');
		};
		check(screen);
		expect(screen).not.toContain('Result:');
		for (let page = 0; page < 30 && !session.screen().includes('Result:'); page += 1) {
			const before = session.screen();
			session.press('PageDown');
			screen = await session.waitFor((now) => now !== before, 'the next page of the audit');
			check(screen);
		}
		expect(screen).toContain('Result: authentic');
		session.press('Escape');
		await session.waitFor((now) => now.includes('Audit the records folder'), 'the home screen again');
	});

	it('step 8 keeps its title line and key line on the screen', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		seedDemoDraft(home, [], 7);
		const session = start('step-eight', home, '', [80, 24]);
		const screen = await resumeAndPage(session, (now) => now.includes('Step 8 of 9'), 'step 8');
		const lines = screen.split('\n');
		expect(lines[0]).toMatch(/^prelase · bench check +\S/);
		expect(lines[2]).toBe('Step 8 of 9: People around the bench');
		expect(screen).toContain('Enter accept · ↑ ↓ field · PgDn PgUp step · Esc back · ? help');
		expect(lines.filter((line) => line.includes('local codes') && line.includes('?'))).toHaveLength(1);
	});
	it('the summary shows on w what would flip each verdict, with the margin and tornado charts in characters, scrolling within 80x24', {timeout: 60_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		seedDemoDraft(home, []);
		const session = start('what-if', home, '', [80, 24]);
		await resumeAndPage(session, (now) => now.includes('Outcome: CLEAR TO ENERGIZE'), 'the summary');
		expect(await session.settle()).toContain('w what-if');
		session.type('w');
		let screen = await session.waitFor((now) => now.includes('WHAT WOULD FLIP EACH VERDICT'), 'the what-if view');
		const seen: string[] = [];
		for (let page = 0; page < 40; page += 1) {
			const lines = screen.trimEnd().split('\n');
			expect(lines.length).toBeLessThanOrEqual(24);
			expect(lines[0]).toMatch(/^prelase · bench check/);
			for (const line of lines) expect([...line].length).toBeLessThanOrEqual(80);
			seen.push(...lines);
			if (!/↓ \d+ more/.test(screen)) break;
			session.press('PageDown');
			screen = await session.waitFor((now) => now !== screen, 'the next page');
			screen = await session.settle();
		}
		const all = seen.join('\n');
		// Ambient flip: 125 °C − 100 K·6.7 W/10 W = 58 °C (hand arithmetic, linear derating); 23 K of 308.15 K = 7.46 %.
		expect(all).toContain('fails if ambient_max > 58 °C (now 35 °C)');
		expect(all).toMatch(/ambient_max +·+│█ +no flip \/ \+7\.46 %/);
		// The margin chart: the ceiling 2 A of 2.25 A fills 18 of 20 cells (hand arithmetic).
		expect(all).toMatch(/✓ limit_below_diode_maxim… █{18} {2}│ +11\.1 % left/);
		session.type('w');
		await session.waitFor((now) => !now.includes('WHAT WOULD FLIP') && /! advise/.test(now), 'the list again');
	});
});

/** The demo plan copied to a fresh folder, with a home for the settings and drafts. */
function planCopy(): {home: string; file: string} {
	const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
	const file = join(home, 'plan.yaml');
	writeFileSync(file, readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml'));
	return {home, file};
}

/** Opens the planner's form of the last device of the demo (alignment_bypass, which has no wire run) and focuses a field by its label. */
async function lastDeviceField(session: TmuxSession, label: string): Promise<string> {
	await session.waitFor((screen) => screen.includes('Devices in wiring order'), 'the planner');
	// 5 access points and 7 devices: the last device is 11 places down.
	for (let step = 0; step < 11; step += 1) session.press('Down');
	await session.waitFor((screen) => /^› .*alignment_bypass/m.test(screen), 'alignment_bypass selected');
	session.press('Enter');
	await session.waitFor((screen) => screen.includes('Device 7 of 7 in wiring order: alignment_bypass'), 'the form of alignment_bypass');
	for (let step = 0; step < 20 && !session.screen().includes(`› ${label}`); step += 1) {
		const before = session.screen();
		session.press('Down');
		await session.waitFor((now) => now !== before, 'the next field');
	}
	return session.waitFor((screen) => screen.includes(`› ${label}`), `the field ${label}`);
}

/** No internal path of the plan file (devices.6.…) nor a schema library's wording reaches the screen. */
function expectPlainWords(screen: string): void {
	expect(screen).not.toMatch(/(devices|access_points)\.\d/);
	expect(screen).not.toMatch(/expected (number|string), got/);
	expect(screen).not.toMatch(/\bawg or cross_section\b/);
}

describe.skipIf(!haveTmux())('the planner and the exits at 80x24', () => {
	it('adds a wire run to a device that has none as one small form: size and length together, in plain words', {timeout: 60_000}, async () => {
		const {home, file} = planCopy();
		const session = start('wire-run', home, `plan ${file} --edit`, [80, 24]);
		let screen = await lastDeviceField(session, 'Wire run to next device');
		expect(screen).toMatch(/› Wire run to next device +\(none\)/);
		session.press('Enter');
		screen = await session.waitFor((now) => now.includes('Wire size (AWG or mm²)'), 'the wire run form');
		expect(screen).toContain('Length to the next device');
		// A length typed where the size goes is refused in words, and the cursor stays to correct it.
		session.type('262 m');
		session.press('Enter');
		screen = await session.waitFor((now) => now.includes('✗'), 'the refusal of a length as a size');
		expect(screen.replaceAll(/\s+/g, ' ')).toContain('wire size: give the gauge as AWG 26, or the cross-section as 0.5 mm²');
		expectPlainWords(screen);
		for (let index = 0; index < 6; index += 1) session.press('BSpace');
		// The size alone is not refused for want of a length: it waits in the form for the length.
		session.type('AWG 26');
		session.press('Enter');
		screen = await session.waitFor((now) => /› Length to the next device/.test(now), 'the length field');
		expect(screen).not.toContain('✗');
		session.type('262 m');
		session.press('Enter');
		await session.waitFor((now) => /› Conductors/.test(now), 'the conductors field');
		session.press('Enter');
		await session.waitFor((now) => /› \[ Apply the wire run \]/.test(now), 'the apply line');
		session.press('Enter');
		screen = await session.waitFor((now) => now.includes('Device 7 of 7') && now.includes('wire run to the next device set'), 'the run applied');
		expect(screen).toMatch(/› Wire run to next device +AWG 26 · 262 m/);
		expectPlainWords(screen);
		session.press('Escape');
		await session.waitFor((now) => now.includes('Devices in wiring order'), 'the list');
		session.type('s');
		await session.waitFor((now) => now.includes('Saved'), 'the plan saved');
		expect(readFileSync(file, 'utf8')).toMatch(/time_limit: 4 h\n {4}wire_to_next: \{awg: 26, length: 262 m\}\n/);
	});

	it('names a wire run that the plan refuses by device and field, never by its path in the file', {timeout: 60_000}, async () => {
		const {home, file} = planCopy();
		const session = start('wire-words', home, `plan ${file} --edit`, [80, 24]);
		await lastDeviceField(session, 'Wire run to next device');
		session.press('Enter');
		await session.waitFor((now) => now.includes('Wire size (AWG or mm²)'), 'the wire run form');
		session.type('0.5 mm²');
		session.press('Enter');
		await session.waitFor((now) => /› Length to the next device/.test(now), 'the length field');
		// A length with no unit: the plan's schema refuses it; the words name the device and the field.
		session.type('262');
		session.press('Enter', 'Enter');
		await session.waitFor((now) => /› \[ Apply the wire run \]/.test(now), 'the apply line');
		session.press('Enter');
		const screen = await session.waitFor((now) => now.includes('✗'), 'the refusal');
		expect(screen.replaceAll(/\s+/g, ' ')).toContain('device 7 (alignment_bypass): length to the next device: "262" has no unit');
		expect(screen).toMatch(/› Length to the next device/);
		expectPlainWords(screen);
	});

	it('Esc on a change not yet applied asks before discarding it, in the planner and in the check alike', {timeout: 60_000}, async () => {
		const {home, file} = planCopy();
		const planner = start('discard-plan', home, `plan ${file} --edit`, [80, 24]);
		await planner.waitFor((screen) => screen.includes('Devices in wiring order'), 'the planner');
		for (let step = 0; step < 5; step += 1) planner.press('Down');
		await planner.waitFor((screen) => /^› .*lid_switch/m.test(screen), 'lid_switch selected');
		planner.press('Enter');
		await planner.waitFor((screen) => screen.includes('Device 1 of 7 in wiring order: lid_switch'), 'the form of lid_switch');
		planner.press('Down', 'Down', 'Down');
		await planner.waitFor((screen) => /› Contact/.test(screen), 'the contact field');
		planner.press('Right');
		await planner.waitFor((screen) => screen.includes('‹ normally_open ›'), 'a choice moved, not applied');
		planner.press('Escape');
		let screen = await planner.waitFor((now) => now.includes('Discard the change to contact?'), 'the question');
		expect(screen.replaceAll(/\s+/g, ' ')).toContain('y discard it and go back · any other key keeps editing');
		// Any other key keeps the change in the field, still to be applied.
		planner.type('n');
		screen = await planner.waitFor((now) => !now.includes('Discard the change'), 'the question gone');
		expect(screen).toContain('‹ normally_open ›');
		planner.press('Escape');
		await planner.waitFor((now) => now.includes('Discard the change to contact?'), 'the question again');
		planner.type('y');
		screen = await planner.waitFor((now) => now.includes('Devices in wiring order'), 'the list after discarding');
		expect(screen).not.toContain('(not saved)');
		// The wire run's form asks too, naming the run.
		await lastDeviceField(planner, 'Wire run to next device');
		planner.press('Enter');
		await planner.waitFor((now) => now.includes('Wire size (AWG or mm²)'), 'the wire run form');
		planner.type('AWG 26');
		planner.press('Escape');
		await planner.waitFor((now) => now.includes('Discard the change to the wire run?'), 'the question on the run');

		const checkHome = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const check = start('discard-check', checkHome, 'check', [80, 24]);
		await check.waitFor((now) => now.includes('Step 1 of 9'), 'the first step');
		await check.settle();
		check.type('FH-9');
		await check.waitFor((now) => now.includes('FH-9'), 'the text typed');
		check.press('Escape');
		screen = await check.waitFor((now) => now.includes('Discard the change to'), 'the question in the check');
		expect(screen).toContain('Step 1 of 9');
		expect(screen.split('\n')[0]).toMatch(/^prelase · bench check/);
		check.type('x');
		await check.waitFor((now) => !now.includes('Discard the change'), 'the question gone');
		check.press('Escape');
		await check.waitFor((now) => now.includes('Discard the change to'), 'the question again');
		check.type('y');
		await check.waitFor((now) => now.includes('Start a bench check') || now.includes('Resume the draft'), 'the home screen after discarding');
	});

	// The line printed on leaving, whole: it may wrap at 80 columns, so it is read with its line breaks removed.
	const leftLine = (screen: string) => screen.slice(0, screen.indexOf('EXITED')).replaceAll('\n', '');

	it('Ctrl-C clears the screen, says where the drafts are (or that nothing was pending), and leaves the prompt on a line of its own', {timeout: 60_000}, async () => {
		const checkHome = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const check = start('ctrl-c-check', checkHome, 'check', [80, 24]);
		await check.waitFor((now) => now.includes('Step 1 of 9'), 'the first step');
		await check.settle();
		check.type('FH-9');
		check.press('Enter');
		await check.waitFor(() => loadDraft(openSettings({PRELASE_HOME: checkHome}).folder) !== undefined, 'the draft saved');
		// At once, as a person would: a Ctrl-C right after a key is never lost.
		check.press('C-c');
		let screen = await check.waitFor((now) => now.includes('EXITED 130'), 'the program to leave with 130');
		// The prompt (here the line the shell prints next) starts a line of its own.
		expect(screen).toMatch(/^EXITED 130$/m);
		// The screen is cleared: no line of the step is left above the farewell.
		expect(screen).not.toContain('Step 1 of 9');
		expect(leftLine(screen)).toContain(`prelase: left with Ctrl-C; the check draft is saved in ${draftPath(openSettings({PRELASE_HOME: checkHome}).folder)} (the next start offers to resume it)`);

		const {home, file} = planCopy();
		const planner = start('ctrl-c-plan', home, `plan ${file} --edit`, [80, 24]);
		await planner.waitFor((now) => now.includes('Devices in wiring order'), 'the planner');
		for (let step = 0; step < 5; step += 1) planner.press('Down');
		await planner.waitFor((now) => /^› .*lid_switch/m.test(now), 'lid_switch selected');
		planner.type(']');
		await planner.waitFor((now) => now.includes('(not saved)'), 'an unsaved change');
		planner.press('C-c');
		screen = await planner.waitFor((now) => now.includes('EXITED 130'), 'the planner to leave with 130');
		expect(screen).toMatch(/^EXITED 130$/m);
		expect(leftLine(screen)).toContain(`the plan edits not saved to ${file} are kept in ${planDraftPath(openSettings({PRELASE_HOME: home}).folder, file)} (opening the plan again restores them)`);

		const idle = start('ctrl-c-idle', mkdtempSync(join(tmpdir(), 'prelase-e2e-')), '', [80, 24]);
		await idle.waitFor((now) => now.includes('Start a bench check'), 'the home screen');
		await idle.settle();
		idle.press('C-c');
		screen = await idle.waitFor((now) => now.includes('EXITED 130'), 'the home screen to leave with 130');
		expect(screen).toMatch(/^EXITED 130$/m);
		expect(screen).not.toContain('Start a bench check');
		expect(leftLine(screen)).toContain('prelase: left with Ctrl-C; nothing was pending');
	});

	it('one key line per screen, no wrapped line starting with a stray space, the rules in the home header, and no error left after Esc', {timeout: 90_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		execFileSync('node', [program, 'keys', '--name', 'Dana Whitlow'], {env: {...process.env, PRELASE_HOME: home}});
		seedDemoDraft(home, [], 0);
		const session = start('words', home, '', [80, 24]);
		let screen = await session.waitFor((now) => now.includes('Resume the draft'), 'the home screen');
		// A line Ink wrapped at a space never starts with that space (the caution on the home screen wraps at 80).
		expect(screen).not.toMatch(/^ \S/m);
		session.press('Enter');
		await session.waitFor((now) => now.includes('Step 1 of 9'), 'the resumed check');
		// In the check the header names the setup; back home it names the rules in force, not the last setup.
		expect(session.screen().split('\n')[0]).toContain('Fenwick Hollow bench 3');
		session.press('Escape');
		screen = await session.waitFor((now) => now.includes('Resume the draft'), 'the home screen again');
		expect(screen.split('\n')[0]).toMatch(/^prelase · bench check +prelase bench policy \(shipped default\)$/);
		expect(screen).not.toMatch(/^ \S/m);

		// Settings: one key line (its own), not its own plus the App's.
		for (let step = 0; !session.screen().includes('❯ Settings') && step < 8; step += 1) {
			session.press('Down');
			await session.settle();
		}
		session.press('Enter');
		screen = await session.waitFor((now) => /^Settings$/m.test(now), 'the settings');
		expect(screen.split('\n').filter((line) => line.includes('Esc back'))).toHaveLength(1);
		session.press('Escape');
		await session.waitFor((now) => now.includes('Resume the draft'), 'the home screen from the settings');

		// A refusal on the sign-off is gone once Esc has left it: neither on the summary nor on the sign-off again.
		for (let step = 0; !session.screen().includes('❯ Resume the draft') && step < 8; step += 1) {
			session.press('Up');
			await session.settle();
		}
		session.press('Enter');
		await session.waitFor((now) => now.includes('Step 1 of 9'), 'the resumed check');
		await resumeAndPageFromStep(session);
		session.press('Enter');
		await session.waitFor((now) => now.includes('Sign-off'), 'the sign-off');
		session.press('Enter');
		session.type('Sam Colleague');
		session.press('Enter');
		session.type('test engineer');
		session.press('Enter', 'Down', 'Down', 'Down');
		await session.settle();
		session.press('Enter');
		await session.waitFor((now) => now.includes('your key is the key of'), 'the refusal');
		session.press('Escape');
		screen = await session.waitFor((now) => now.includes('Outcome:'), 'the summary');
		expect(screen).not.toContain('your key is the key of');
		session.press('Enter');
		screen = await session.waitFor((now) => now.includes('Sign-off'), 'the sign-off again');
		expect(screen).not.toContain('your key is the key of');
		expect(screen).not.toContain('✗');
	});
});
