import {recordTestResults, type PlanAsTested, type RecordedTest} from '../../services/record-functional-test.js';
import {loadPlanAndText} from '../../interlock/plan/plan-and-text.js';
import type {TestResults} from '../../interlock/functional-test/results-schema.js';
import {describeProblem, formatProblem} from '../../shared/problems.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {machineFailure} from '../../shared/machine-failure.js';
import {refusedWrite} from '../refused-write.js';
import type {SettingsStore} from '../../services/settings.js';

/** What the planner needs to record a test: the plan as saved on disk, and signing. */
export type TestRecorder = {
	/** The tester as the settings remember them. */
	tester(): {name: string; role: string};
	/** Reads the plan file as it is on disk now: a test is of the plan as wired. */
	open(file: string): {ok: true; tested: PlanAsTested} | {ok: false; message: string};
	/** Signs and writes the record (the witness too, with their key file), if the file on disk is still the text tested. */
	sign(tested: PlanAsTested, results: TestResults, witnessKey?: string): {ok: true; recorded: RecordedTest} | {ok: false; message: string};
};

/** The recorder of the screens: the rule file in force, the settings, and the shared recordTestResults. */
export function testRecorder(rules: CompiledRules, settings: SettingsStore, env: NodeJS.ProcessEnv): TestRecorder {
	const open: TestRecorder['open'] = (file) => {
		const loaded = loadPlanAndText(file, rules);
		if (!loaded.ok) return {ok: false, message: formatProblem(loaded.errors[0]!)};
		return {ok: true, tested: {file, ...loaded.value}};
	};
	return {
		tester() {
			const saved = settings.read();
			return {name: saved.operator ?? '', role: saved.role ?? ''};
		},
		open,
		sign(tested, results, witnessKey) {
			const now = open(tested.file);
			if (!now.ok || now.tested.text !== tested.text) return {ok: false, message: `${tested.file} changed on disk since this test was started; leave (Esc) and start the test again on the plan as it is now`};
			let recorded: ReturnType<typeof recordTestResults>;
			try {
				recorded = recordTestResults(tested, rules, results, {witnessKey, witnessKeyName: 'the witness key file'}, env);
			} catch (error) {
				// The machine refused the write (disk full, read-only folder): no record was written; say so on the screen.
				const refused = machineFailure(error);
				if (refused === undefined) throw error;
				return {ok: false, message: refused};
			}
			// The first problem says the most: the detail when there are several, else what was refused.
			if (!recorded.ok) return {ok: false, message: describeProblem(recorded.errors[0]!)};
			// The record is written; remembering the tester's name is a convenience a refused write does not undo.
			refusedWrite(() => settings.write({operator: results.tested_by.name, role: results.tested_by.role}));
			return {ok: true, recorded: recorded.value};
		},
	};
}
