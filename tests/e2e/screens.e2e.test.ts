import {execFileSync, spawnSync} from 'node:child_process';
import {mkdtempSync, readdirSync, readFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterEach, beforeAll, describe, expect, it} from 'vitest';
import {parse} from 'yaml';
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

function start(name: string, home: string, args = ''): TmuxSession {
	const session = new TmuxSession(name, `env -u CI -u CONTINUOUS_INTEGRATION PRELASE_HOME=${home} node ${program} ${args}; echo "EXITED $?"; sleep 30`);
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

beforeAll(() => {
	execFileSync('node', ['scripts/build.mjs']);
});

afterEach(() => {
	for (const session of sessions.splice(0)) session.kill();
});

describe.skipIf(!haveTmux())('the screens in a real terminal', () => {
	it('completes, signs and audits the demo check', {timeout: 120_000}, async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-e2e-'));
		const records = join(home, 'records');
		execFileSync('node', [program, 'keys'], {env: {...process.env, PRELASE_HOME: home}});
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
});
