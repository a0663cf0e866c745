// Timed in bench/what-if.mjs (bundled there): one evaluation of a demo setup, and the full
// what-if analysis of it, each repeated and reported as medians in milliseconds.
import {evaluate} from '../source/rules/evaluate/evaluate.js';
import {loadAnswers} from '../source/rules/evaluate/load-answers.js';
import {analyseWhatIf} from '../source/rules/evaluate/what-if.js';
import {loadRules, shippedRulesPath} from '../source/rules/load.js';

function median(values: number[]): number {
	const sorted = [...values].sort((a, b) => a - b);
	return sorted[Math.floor(sorted.length / 2)]!;
}

/** Times `work` `rounds` times after `warm` untimed runs; the median, p10 and p90 in ms. */
function time(work: () => unknown, rounds: number, warm: number): {median: number; p10: number; p90: number} {
	for (let index = 0; index < warm; index++) work();
	const samples: number[] = [];
	for (let index = 0; index < rounds; index++) {
		const start = performance.now();
		work();
		samples.push(performance.now() - start);
	}
	const sorted = [...samples].sort((a, b) => a - b);
	return {median: median(samples), p10: sorted[Math.floor(sorted.length * 0.1)]!, p90: sorted[Math.floor(sorted.length * 0.9)]!};
}

const [answersFile = 'docs/examples/bench3-808nm-clear.yaml', roundsText = '15'] = process.argv.slice(2);
const rules = loadRules(shippedRulesPath());
if (!rules.ok) throw new Error('the shipped rules did not load');
const answers = loadAnswers(answersFile, rules.value);
if (!answers.ok) throw new Error(`${answersFile} was refused`);
const rounds = Number(roundsText);
const evaluation = evaluate(rules.value, answers.value);
const single = time(() => evaluate(rules.value, answers.value), rounds * 20, 20);
const whatIf = time(() => analyseWhatIf(rules.value, answers.value, evaluation), rounds, 2);
const result = analyseWhatIf(rules.value, answers.value, evaluation);
const flips = result.checks.reduce((sum, entry) => sum + entry.flips.length, 0);
process.stdout.write(`${JSON.stringify({answersFile, single, whatIf, checks: result.checks.length, flips})}\n`);
