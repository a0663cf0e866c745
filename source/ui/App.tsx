import {Box, useApp, useInput, useStdout} from 'ink';
import {Text} from './Text.js';
import {resolve} from 'node:path';
import {useEffect, useMemo, useRef, useState} from 'react';
import {signAndWrite, type WrittenRecord} from '../services/sign-check.js';
import {cachedLinker} from '../interlock/functional-test/test-link.js';
import {recordsFolder, trustedFingerprints} from '../services/records-folder.js';
import {loadDraft, removeDraft, saveDraft, type Draft} from '../services/drafts/draft-store.js';
import {listSetups, loadSetup, saveSetup} from '../services/drafts/setup-store.js';
import {displayPath} from '../shared/display-path.js';
import {checkRuleFileSetting} from '../services/rule-file-setting.js';
import {planEditingText, type PlanEditing} from '../interlock/plan/plan-edit.js';
import {removePlanDraft, savePlanDraft} from '../services/drafts/plan-draft-store.js';
import {runInSlices} from '../services/run-in-slices.js';
import {openPlan as openPlanAtOnce, openPlanSteps, opensInSteps, type OpenedPlan} from './planner/plan-opening.js';
import {describeProblem, formatProblem} from '../shared/problems.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import type {SettingsStore} from '../services/settings.js';
import {CautionContext} from './caution-context.js';
import {CautionLine} from './CautionLine.js';
import {DoneScreen} from './DoneScreen.js';
import {HelpOverlay} from './HelpOverlay.js';
import {HomeScreen, type HomeChoice} from './HomeScreen.js';
import {InfoScreen} from './InfoScreen.js';
import {PlannerScreen} from './planner/PlannerScreen.js';
import {PlanOpenScreen} from './planner/PlanOpenScreen.js';
import {planProblemWords} from './planner/plan-problem-words.js';
import {testDraftsIn} from './functional-test/test-drafts.js';
import {testRecorder} from './functional-test/test-recorder.js';
import {nameSetup, startSession, type Session} from './bench-check/session.js';
import {SettingsScreen} from './SettingsScreen.js';
import {SignOffScreen, type SignOffForm} from './bench-check/SignOffScreen.js';
import {StepScreen} from './bench-check/StepScreen.js';
import {SummaryScreen} from './bench-check/SummaryScreen.js';
import {refusedWrite} from './refused-write.js';
import {machineFailure} from '../shared/machine-failure.js';
import {exitLine} from './exit-line.js';
import {useCtrlC} from './use-ctrl-c.js';

type Screen = 'home' | 'step' | 'summary' | 'signoff' | 'done' | 'settings' | 'info' | 'plan-open' | 'planner';

/** Props of the whole interface. */
export type AppProps = {
	rules: CompiledRules;
	settings: SettingsStore;
	env: NodeJS.ProcessEnv;
	/** Start straight in the bench check (`prelase check`), optionally from a saved setup. */
	startCheck?: {setup?: string};
	/** Start straight in the interlock planner on this plan file (`prelase plan FILE --edit`). */
	startPlan?: string;
	/** Audits the records folder and returns lines to show (kept outside so the core stays out of the screens). */
	audit?: (folder: string) => Promise<string[]>;
	/** Called once when the screens close, with the exit status and the one line to print after them (where the drafts are). */
	onExit(code: number, farewell?: string): void;
	/** The rule file named in the settings does not load: the home screen says so and no check starts until it is fixed or the shipped policy is chosen. */
	brokenRules?: {file: string; settingsPath: string; problems: string[]};
};

/** The bench-check interface: home, steps, summary, sign-off, and the pages around them. */
export function App({rules: givenRules, settings, env, startCheck, startPlan, audit, onExit, brokenRules}: AppProps) {
	const {exit} = useApp();
	const [rules, setRules] = useState(givenRules);
	const [broken, setBroken] = useState(brokenRules);
	const {stdout} = useStdout();
	const rows = stdout.rows ?? 24;
	const width = stdout.columns ?? 80;
	// The plan is opened before the first frame, so `plan FILE --edit` starts on it (or on its problems);
	// a large one is opened in steps after it (`opening`), so a signal is honoured meanwhile.
	const [plan, setPlan] = useState<OpenedPlan & {opening?: string}>(() => (startPlan === undefined ? {} : opensInSteps(startPlan) ? {opening: startPlan} : openPlan(startPlan)));
	const [screen, setScreen] = useState<Screen>(startPlan !== undefined ? (plan.editing || plan.opening ? 'planner' : 'plan-open') : startCheck && !broken ? 'step' : 'home');
	useEffect(() => {
		if (plan.opening === undefined) return;
		const stop = new AbortController();
		runInSlices(openPlanSteps(plan.opening, rules, settings), stop.signal).then(
			(opened) => {
				if (!opened) return;
				setPlan(opened);
				setScreen(opened.editing ? 'planner' : 'plan-open');
			},
			// A bug is a bug: thrown where nothing catches it, as it would be when opened at once.
			(error: unknown) => setImmediate(() => {
				throw error;
			}),
		);
		return () => stop.abort();
	}, [plan.opening]);
	const [stepIndex, setStepIndex] = useState(0);
	// Confirmations answered by the interlock test come from the records folder; plan paths are read from the working folder.
	const linker = useMemo(() => cachedLinker(rules, () => ({base: process.cwd(), folder: recordsFolder(env), trusted: trustedFingerprints(env), now: new Date()})), [rules, env]);
	const [session, setSessionState] = useState<Session>(() => {
		const saved = startCheck?.setup ? loadSetup(settings.folder, startCheck.setup) : undefined;
		return startSession(rules, {setup: startCheck?.setup ?? '', ...(saved ? {entries: saved.entries} : {})}, linker);
	});
	// The latest session for key handlers, which may run several times before the next frame.
	const sessionRef = useRef(session);
	const setSession = (next: Session) => {
		sessionRef.current = next;
		setSessionState(next);
	};
	const [help, setHelp] = useState(false);
	const [info, setInfo] = useState<{title: string; lines: string[]}>({title: '', lines: []});
	const [signError, setSignError] = useState<string | undefined>();
	const [writeProblem, setWriteProblem] = useState<string | undefined>();
	const [written, setWritten] = useState<Pick<WrittenRecord, 'path' | 'fingerprint' | 'commit'> | undefined>();
	const [draft, setDraft] = useState<Draft | undefined>(() => loadDraft(settings.folder));

	// Read from disk when a screen is entered, not on every frame drawn.
	const setups = useMemo(() => (screen === 'home' ? listSetups(settings.folder) : []), [screen]);
	const saved = useMemo(() => settings.read(), [screen]);

	// A declaration, not a const: the state above opens the start plan with it before this line runs.
	function openPlan(path: string): OpenedPlan {
		return openPlanAtOnce(path, rules, settings);
	}

	const planDrafts = {
		save: (editing: PlanEditing) => setWriteProblem(refusedWrite(() => savePlanDraft(settings.folder, editing.file, editing.original, planEditingText(editing)))),
		clear: (file: string) => removePlanDraft(settings.folder, file),
	};

	// Leaving draws an empty frame first, so the terminal is left clear for the line printed after it.
	const [leaving, setLeaving] = useState(false);
	const left = useRef(false);
	const quit = (code: number) => {
		if (left.current) return;
		left.current = true;
		onExit(code, exitLine(settings.folder, code === 130 ? 'Ctrl-C' : 'Quit', screen === 'planner' ? plan.editing?.file : undefined));
		setLeaving(true);
	};
	useEffect(() => {
		if (leaving) exit();
	}, [leaving]);
	useCtrlC(() => quit(130));
	useInput((input) => {
		// Screens without a field to type in take `?` here: the keys, then the caution in full.
		if (input === '?' && !help && (screen === 'done' || screen === 'info')) setHelp(true);
	});

	// Never lose an answer: the draft is saved after every change while a check is open.
	useEffect(() => {
		if (screen !== 'step' && screen !== 'summary' && screen !== 'signoff') return;
		const confirmations = Object.fromEntries(Object.entries(session.confirmations).map(([id, answer]) => [id, answer.note ? {answer: answer.answer, note: answer.note} : {answer: answer.answer}]));
		setWriteProblem(refusedWrite(() => saveDraft(settings.folder, {rulesFile: rules.file, rulesSha256: rules.sha256, setup: session.setup, entries: {...session.entries}, confirmations, step: stepIndex, savedAt: new Date().toISOString()})));
	}, [session, stepIndex, screen]);

	/** Rules that loaded, from Settings or the shipped policy: they are in force from now on, and a check may start. */
	const useRules = (loaded: CompiledRules) => {
		setRules(loaded);
		setBroken(undefined);
	};
	const checkRuleFile = (typed: string) => {
		const checked = checkRuleFileSetting(typed, process.cwd());
		if (!checked.ok) return {ok: false as const, problems: checked.errors.map(formatProblem)};
		useRules(checked.value.rules);
		return {ok: true as const, value: checked.value.file};
	};

	// The home menu opens where it was left: Esc back from a screen finds the cursor on what led there.
	const lastHomeChoice = useRef<string | undefined>(undefined);
	const choose = (choice: HomeChoice, key?: string) => {
		if (key !== undefined) lastHomeChoice.current = key;
		// No check starts on a rule file that does not load (the menu does not offer one; this holds for any other way in).
		if (broken && (choice.action === 'start' || choice.action === 'resume' || choice.action === 'setup')) return;
		switch (choice.action) {
			case 'start':
				setSession(startSession(rules, {}, linker));
				setStepIndex(0);
				return setScreen('step');
			case 'resume':
				if (draft) {
					setSession(startSession(rules, {setup: draft.setup, entries: draft.entries, confirmations: draft.confirmations}, linker));
					setStepIndex(Math.min(draft.step, rules.rules.steps.length - 1));
				}
				return setScreen('step');
			case 'setup': {
				const saved = loadSetup(settings.folder, choice.name);
				setSession(startSession(rules, {setup: choice.name, ...(saved ? {entries: saved.entries} : {})}, linker));
				setStepIndex(0);
				return setScreen('step');
			}
			case 'rules':
				setInfo({
					title: 'Rules in force',
					lines: [rules.rules.name, displayPath(rules.file), `SHA-256 ${rules.sha256}`, `${rules.rules.steps.length} steps, ${rules.inputs.size} inputs, ${rules.confirmations.size} confirmations, ${rules.checks.length} checks`, '', rules.rules.caution],
				});
				return setScreen('info');
			case 'audit': {
				const folder = settings.read().recordsFolder ?? `${settings.folder}/records`;
				setInfo({title: `Audit of ${folder}`, lines: audit ? ['Auditing…'] : [`Run: prelase audit ${folder}`]});
				audit?.(folder).then(
					(lines) => setInfo({title: `Audit of ${folder}`, lines}),
					(error: unknown) => setInfo({title: `Audit of ${folder}`, lines: [`The audit stopped: ${(error as Error).message}`]}),
				);
				return setScreen('info');
			}
			case 'planner':
				setPlan({});
				return setScreen('plan-open');
			case 'settings':
				return setScreen('settings');
			case 'shipped': {
				const shipped = checkRuleFileSetting('', process.cwd());
				if (shipped.ok) useRules(shipped.value.rules);
				return;
			}
			case 'quit':
				return quit(0);
		}
	};

	const sign = (form: SignOffForm) => {
		const named = nameSetup(session, form.setup);
		setSession(named);
		let result: ReturnType<typeof signAndWrite>;
		try {
			result = signAndWrite(
			rules,
			named.answers,
			named.evaluation,
			{
				name: form.name,
				role: form.role,
				...(form.cosignName.trim() ? {cosign: {name: form.cosignName, role: form.cosignRole, key: form.cosignKey.trim(), meaning: 'witness'}} : {}),
			},
			env,
			named.interlockTest,
		);
		} catch (error) {
			// The machine refused the write (disk full, read-only folder): no record was written; say so on the form.
			const refused = machineFailure(error);
			if (refused === undefined) throw error;
			setSignError(refused);
			return;
		}
		// A mistake in the form comes back as a failure and is shown on the form; anything thrown is a bug and propagates.
		if (!result.ok) {
			setSignError(describeProblem(result.errors.at(-1)!));
			return;
		}
		setWriteProblem(refusedWrite(() => settings.write({operator: form.name.trim(), role: form.role.trim()})));
		removeDraft(settings.folder);
		setDraft(undefined);
		setWritten({path: result.value.path, fingerprint: result.value.fingerprint, ...(result.value.commit === undefined ? {} : {commit: result.value.commit})});
		setSignError(undefined);
		setScreen('done');
	};

	const header = (
		<Box borderStyle="single" borderLeft={false} borderRight={false} borderTop={false} justifyContent="space-between">
			<Box flexShrink={0}>
				<Text bold>prelase · {screen === 'planner' || screen === 'plan-open' ? 'interlock planner' : 'bench check'}</Text>
			</Box>
			{/* A long setup name is cut, never drawn over the title. */}
			<Box flexShrink={1} marginLeft={2} justifyContent="flex-end">
				<Text dimColor wrap="truncate">
					{/* The setup while a check is open; everywhere else the rules in force. */}
					{broken ? 'no rules in force: the rule file does not load' : (['step', 'summary', 'signoff', 'done'].includes(screen) && session.setup) || rules.rules.name}
				</Text>
			</Box>
		</Box>
	);
	const footer: Record<Screen, string> = {
		home: '↑ ↓ choose · Enter open · Ctrl-C quit',
		step: 'Enter accept · ↑ ↓ field · PgDn PgUp step · Esc back · ? help',
		summary: 'Enter sign-off · w what-if · ↑ ↓ scroll · Esc back · ? help',
		signoff: 'Enter next · ↑ ↓ field · Esc back',
		done: 's save setup · Enter home',
		settings: 'Enter saves the field · ↑ ↓ move · Esc back',
		info: 'Enter or Esc back · ↑ ↓ PgUp PgDn scroll',
		'plan-open': 'Enter open · Esc back · ? help',
		// The planner draws its own key line: its keys change with what it shows.
		planner: '',
	};

	let body;
	if (screen === 'home') body = <HomeScreen {...(broken ? {broken} : {})} rulesName={rules.rules.name} rulesFile={displayPath(rules.file)} rulesSha256={rules.sha256} caution={rules.rules.caution} {...(draft ? {draft: {setup: draft.setup, savedAt: draft.savedAt}} : {})} setups={setups} {...(lastHomeChoice.current ? {last: lastHomeChoice.current} : {})} onChoose={choose} />;
	else if (screen === 'step')
		body = (
			<StepScreen
				key={stepIndex}
				session={session}
				getSession={() => sessionRef.current}
				stepIndex={stepIndex}
				rows={rows - 4}
				width={width}
				onSession={setSession}
				onStep={(index) => (index >= rules.rules.steps.length ? setScreen('summary') : setStepIndex(Math.max(0, index)))}
				onBack={() => (stepIndex > 0 ? setStepIndex(stepIndex - 1) : setScreen('home'))}
				onHelp={() => setHelp(true)}
				active={!help}
			/>
		);
	else if (screen === 'summary') body = <SummaryScreen session={session} rows={rows - 4} width={width} onSign={() => setScreen('signoff')} onBack={() => setScreen('step')} onHelp={() => setHelp(true)} active={!help} />;
	else if (screen === 'signoff') {
		body = <SignOffScreen session={session} initial={{setup: session.setup, name: saved.operator ?? '', role: saved.role ?? '', cosignName: '', cosignRole: '', cosignKey: ''}} {...(signError ? {error: signError} : {})} onSign={sign} onBack={() => {
			// A refusal belongs to the sign-off it was made on: leaving it clears it.
			setSignError(undefined);
			setScreen('summary');
		}} onHelp={() => setHelp(true)} active={!help} />;
	} else if (screen === 'done' && written)
		body = (
			<DoneScreen
				path={written.path}
				fingerprint={written.fingerprint}
				{...(written.commit === undefined ? {} : {commit: written.commit})}
				outcome={session.evaluation.outcome}
				setup={session.setup}
				onSaveSetup={() => {
					// A refused write is shown under the header, and the key offer stays so it can be tried again.
					let path = '';
					setWriteProblem(refusedWrite(() => (path = saveSetup(settings.folder, {name: session.setup || 'unnamed setup', entries: {...session.entries}, savedAt: new Date().toISOString()}))));
					return path;
				}}
				onHome={() => setScreen('home')}
			/>
		);
	else if (screen === 'plan-open') {
		const open = (path: string) => {
			const opened: OpenedPlan & {opening?: string} = opensInSteps(path) ? {opening: path} : openPlan(path);
			if (!opened.editing && !opened.opening) return opened.problems;
			setPlan(opened);
			setScreen('planner');
			return undefined;
		};
		body = <PlanOpenScreen initial={plan.problems && startPlan ? startPlan : (saved.planFile ?? '')} {...(plan.problems ? {problems: plan.problems} : {})} onOpen={open} onBack={() => setScreen('home')} onHelp={() => setHelp(true)} active={!help} />;
	} else if (screen === 'planner' && plan.opening !== undefined) body = <Text>Opening {displayPath(resolve(plan.opening))}: a large plan takes a few seconds to check…</Text>;
	else if (screen === 'planner' && plan.editing) body = <PlannerScreen editing={plan.editing} rulesName={rules.rules.name} rows={rows - 3} width={width} recorder={testRecorder(rules, settings, env)} drafts={planDrafts} testDrafts={testDraftsIn(settings.folder)} notice={plan.notice} onLeave={() => setScreen('home')} />;
	else if (screen === 'settings') body = <SettingsScreen initial={saved} path={settings.path} onSave={(changes) => settings.write(changes)} check={{rulesFile: checkRuleFile}} onHelp={() => setHelp(true)} active={!help} onBack={() => setScreen('home')} />;
	else body = <InfoScreen title={info.title} lines={info.lines} rows={rows - 4} width={width} onBack={() => setScreen('home')} />;

	if (leaving) return null;
	return (
		<CautionContext.Provider value={rules.rules.caution}>
		<Box flexDirection="column" width={width}>
			{header}
			{writeProblem === undefined ? null : <Text color="red">{writeProblem}</Text>}
			{help ? <HelpOverlay screen={screen} onClose={() => setHelp(false)} /> : null}
			{/* Hidden, not unmounted, under the help: the step keeps its focus and what was typed. */}
			<Box display={help ? 'none' : 'flex'} flexDirection="column">
				{body}
			</Box>
			{/* The full caution is on the home screen; every other screen says it in one line, with the key that shows it. */}
			{screen === 'home' || help ? null : <CautionLine />}
			{footer[screen] ? (
				<Text dimColor wrap="truncate">
					{footer[screen]}
				</Text>
			) : null}
		</Box>
		</CautionContext.Provider>
	);
}
