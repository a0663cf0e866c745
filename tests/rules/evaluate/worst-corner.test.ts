import {describe, expect, it} from 'vitest';
import {stringify} from 'yaml';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {loadAnswersFromText} from '../../../source/rules/evaluate/load-answers.js';
import {loadRulesFromText} from '../../../source/rules/load.js';
import {checkResult, evaluateDocument, expectClose, readDemo, shippedRules, withChanges} from '../bench-answers.js';

const rules = shippedRules();
const demo = readDemo('bench3-808nm-clear.yaml');

describe('forward voltage as a range: each check takes the end worst for it', () => {
	const evaluation = evaluateDocument(rules, withChanges(demo, {diode_knee_voltage: '1.5 V .. 1.7 V'}));

	it('gives its maximum to the compliance headroom check, with the supply low', () => {
		const check = checkResult(evaluation, 'compliance_headroom');
		// hand arithmetic (Kirchhoff's voltage law around the output loop, common practice):
		// available = 5 V × 0.95 − 2 A × (0.05 + 0.10) Ω − 0.8 V = 4.75 − 0.30 − 0.80 = 3.65 V
		expectClose(check.value?.si, 3.65, 'available'); // hand arithmetic in the comment above
		// needed = knee 1.7 V + 0.15 Ω × 2 A + headroom_margin 0.5 V = 1.7 + 0.3 + 0.5 = 2.5 V
		expectClose(check.limit?.si, 2.5, 'needed'); // hand arithmetic in the comment above
		expect(check.corner?.inputs.map(({id, end}) => `${id} ${end}`)).toEqual(['diode_knee_voltage high', 'supply_nominal low']);
	});

	it('gives its minimum to the driver-dissipation check, with the supply high', () => {
		const check = checkResult(evaluation, 'dissipation_within_rating');
		// hand arithmetic (linear pass element, common practice): the peak (5.25 − 1.5)/(2 × 0.15) = 12.5 A
		// lies above the 2 A limit, so the worst is at 2 A: (5.25 − 1.5 − 0.15 × 2) × 2 = 3.45 × 2 = 6.9 W
		expectClose(check.value?.si, 6.9, 'dissipation'); // hand arithmetic in the comment above
		// linear derating (common practice): 10 W × (125 − 35)/(125 − 25) = 9 W
		expectClose(check.limit?.si, 9, 'allowed'); // hand arithmetic in the comment above
		expect(check.corner?.inputs.map(({id, end}) => `${id} ${end}`)).toEqual(['diode_knee_voltage low', 'supply_nominal high']);
		expect(check.corner?.inputs[0]?.value.text).toBe('1.5 V');
	});

	it('leaves a check that uses no ranged input without a corner', () => {
		expect(checkResult(evaluation, 'limit_below_diode_maximum').corner).toBeUndefined();
	});

	it('a range of one value (a supply at ± 0 %) is no range: no corner, the value itself', () => {
		const flat = evaluateDocument(rules, withChanges(demo, {supply_nominal: '5 V ± 0 %', supply_tolerance: null}));
		const check = checkResult(flat, 'compliance_headroom');
		// hand arithmetic: 5 − 2 × 0.15 − 0.8 = 3.9 V
		expectClose(check.value?.si, 3.9, 'available at 5 V'); // hand arithmetic in the comment above
		expect(check.corner).toBeUndefined();
	});
});

describe('the worst corner decides the verdict', () => {
	it('an ambient range derates at its hot end', () => {
		// hand arithmetic (linear derating, common practice): at 45 °C, 10 W × (125 − 45)/(125 − 25) = 8 W;
		// the dissipation at the supply's high end, (5.25 − 1.6 − 0.15 × 2) × 2 = 6.7 W, passes against it;
		// the shorted output, 5.25 V × 2 A = 10.5 W, is above 8 W and advises
		const evaluation = evaluateDocument(rules, withChanges(demo, {ambient_max: '25 degC .. 45 degC'}));
		const dissipation = checkResult(evaluation, 'dissipation_within_rating');
		expectClose(dissipation.limit?.si, 8, 'allowed at 45 °C'); // hand arithmetic in the comment above
		expect(dissipation.corner?.inputs.find(({id}) => id === 'ambient_max')?.end).toBe('high');
		expect(checkResult(evaluation, 'short_circuit_dissipation').verdict).toBe('advise');
	});

	it('a stop check fails at its worst corner: a supply of 3.3 V .. 5 V leaves too little headroom', () => {
		// hand arithmetic (Kirchhoff's voltage law, common practice): at the low end 3.3 − 2 × 0.15 − 0.8 = 2.2 V,
		// below the 1.6 + 0.15 × 2 + 0.5 = 2.4 V needed, so the check fails though 5 V would pass
		const evaluation = evaluateDocument(rules, withChanges(demo, {supply_nominal: '3.3 V .. 5 V', supply_tolerance: null}));
		const check = checkResult(evaluation, 'compliance_headroom');
		expect(check.verdict).toBe('fail');
		expectClose(check.value?.si, 2.2, 'available at 3.3 V'); // hand arithmetic in the comment above
		expect(check.corner?.inputs).toEqual([expect.objectContaining({id: 'supply_nominal', end: 'low'})]);
		expect(evaluation.outcome).toBe('do_not_energize');
	});
});

/** A rule file with one value that peaks inside its input's range: P = (10 V − I × 1 Ω) × I. */
const peakRules = `
format: 1
name: peak inside a range
caution: Defer to the laser safety officer and local codes (IEC 60825 / ANSI Z136 / local law).
steps:
  - id: only
    title: Only
    inputs:
      - {id: current, label: Current, dimension: current, range: [0 A, 20 A]}
checks:
  - id: peak_power
    step: only
    title: Power within 20 W
    value: (10 V - current * 1 ohm) * current
    at_most: 20 W
    dimension: power
    severity: stop
    explanation: test
    basis: hand arithmetic
`;

describe('a value not monotone in its input is searched inside the range', () => {
	const loaded = loadRulesFromText(peakRules, 'peak.yaml');
	if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
	const judge = (entry: string) => {
		const answers = loadAnswersFromText(stringify({inputs: {current: entry}}), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error(answers.errors.map((found) => found.code).join(', '));
		return checkResult(evaluate(loaded.value, answers.value), 'peak_power');
	};

	it('finds the peak at 5 A, where both corners pass', () => {
		// hand arithmetic: P(0 A) = 0 W and P(10 A) = 0 W pass; dP/dI = 10 − 2I = 0 at I = 5 A, P = 5 × 5 = 25 W > 20 W
		const check = judge('0 A .. 10 A');
		expect(check.verdict).toBe('fail');
		expect(check.value?.si).toBeCloseTo(25, 6); // hand arithmetic in the comment above
		expect(check.corner?.method).toBe('searched');
		expect(check.corner?.inputs[0]?.end).toBe('inside');
		expect(check.corner?.inputs[0]?.value.si).toBeCloseTo(5, 3); // hand arithmetic in the comment above
	});

	it('keeps a corner where the range does not hold the peak', () => {
		// hand arithmetic: P rises on 1 A .. 2 A; P(2 A) = 8 × 2 = 16 W ≤ 20 W, the worst at the high end
		const check = judge('1 A .. 2 A');
		expect(check.verdict).toBe('pass');
		expect(check.value?.si).toBeCloseTo(16, 9); // hand arithmetic in the comment above
		expect(check.corner).toEqual({method: 'corners', inputs: [expect.objectContaining({id: 'current', end: 'high'})]});
	});
});

/** A rule file whose one check sums nine inputs: 2^9 = 512 corners, past the cap of 8 ranged inputs. */
const nineRules = (limit: string) => `
format: 1
name: nine ranged inputs
caution: Defer to the laser safety officer and local codes (IEC 60825 / ANSI Z136 / local law).
steps:
  - id: only
    title: Only
    inputs:
${Array.from({length: 9}, (_, index) => `      - {id: v${index}, label: V${index}, dimension: voltage, range: [0 V, 10 V]}`).join('\n')}
checks:
  - id: total
    step: only
    title: Total within the limit
    value: ${Array.from({length: 9}, (_, index) => `v${index}`).join(' + ')}
    at_most: ${limit}
    severity: stop
    explanation: test
    basis: hand arithmetic
  - id: first_only
    step: only
    title: First and second
    value: v0 + v1 * 0
    at_most: 10 V
    severity: stop
    explanation: test
    basis: hand arithmetic
`;

describe('past the cap of ranged inputs in one check', () => {
	const judge = (limit: string, id: string) => {
		const loaded = loadRulesFromText(nineRules(limit), 'nine.yaml');
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
		const inputs = Object.fromEntries(Array.from({length: 9}, (_, index) => [`v${index}`, '1 V .. 2 V']));
		const answers = loadAnswersFromText(stringify({inputs}), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error(answers.errors.map((found) => found.code).join(', '));
		return checkResult(evaluate(loaded.value, answers.value), id);
	};

	it('a fail found one input at a time stands, at every high end', () => {
		// hand arithmetic: nine high ends 9 × 2 V = 18 V > 15 V
		const check = judge('15 V', 'total');
		expect(check.verdict).toBe('fail');
		expect(check.value?.si).toBeCloseTo(18, 12); // hand arithmetic in the comment above
		expect(check.corner?.method).toBe('capped');
		expect(check.corner?.inputs.every(({end}) => end === 'high')).toBe(true);
	});

	it('a pass found so is not trusted: the check is open, naming the ranged inputs', () => {
		// hand arithmetic: 18 V ≤ 20 V would pass, but not every corner was tried
		const check = judge('20 V', 'total');
		expect(check.verdict).toBe('open');
		expect(check.needs).toHaveLength(9);
	});

	it('an input the check reads but that does not move it is named "either end"', () => {
		// hand arithmetic: v0 + 0 × v1; the worst is v0 = 2 V whatever v1 is
		const check = judge('20 V', 'first_only');
		expect(check.corner?.inputs.map(({id, end}) => `${id} ${end}`)).toEqual(['v0 high', 'v1 either']);
	});
});
