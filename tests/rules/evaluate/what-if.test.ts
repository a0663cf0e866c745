import {describe, expect, it} from 'vitest';
import {od} from '../../../source/calculations/od.js';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {analyseWhatIf, type FlipPoint, type WhatIf} from '../../../source/rules/evaluate/what-if.js';
import {evaluateDocument, expectClose, readAnswers, readDemo, shippedRules, withChanges, type AnswersDocument} from '../bench-answers.js';

const rules = shippedRules();

function whatIf(document: AnswersDocument): WhatIf {
	const answers = readAnswers(rules, document);
	if (!answers.ok) throw new Error(`the answers were refused: ${answers.errors.map((found) => found.code).join(', ')}`);
	return analyseWhatIf(rules, answers.value, evaluate(rules, answers.value));
}

function flipOf(result: WhatIf, check: string, input: string): FlipPoint {
	const found = result.checks.find((entry) => entry.check === check)?.flips.find((flip) => flip.input === input);
	if (!found) throw new Error(`no flip of ${check} on ${input}`);
	return found;
}

const bench3 = readDemo('bench3-808nm-clear.yaml');
const clear = whatIf(bench3);
const kelvin = 273.15;

describe('flip points checked by hand (bench 3 demo: supply 5 V ± 5 %, knee 1.6 V, 0.15 Ω, limit 2 A)', () => {
	// Worst dissipation (common practice, linear pass element; the maximum of (V−V_k−R·I)·I lies above 2 A here):
	// (5.25 V − 1.6 V − 0.15 Ω·2 A)·2 A = 3.35 V·2 A = 6.7 W.
	// Linear derating (common practice, derating curve): allowed = 10 W·(125 °C − T_a)/(125 °C − 25 °C).
	// Flip on ambient: 10·(125 − T)/100 = 6.7 → T = 125 − 67 = 58 °C.
	// Flip on the rating: P·(125 − 35)/100 = 6.7 → P = 6.7/0.9 = 7.4444 W.
	it.each([
		{check: 'dissipation_within_rating', input: 'ambient_max', direction: 'up', at: 58 + kelvin, text: '58 °C'}, // hand arithmetic above
		{check: 'dissipation_within_rating', input: 'driver_rated_dissipation', direction: 'down', at: 6.7 / 0.9, text: '7.45 W'}, // hand arithmetic above, shown rounded up (the passing side)
		// Current ceiling (common practice, margin is site policy 10 %): limit ≤ 2.5 A·(1 − 0.10) = 2.25 A.
		{check: 'limit_below_diode_maximum', input: 'current_limit', direction: 'up', at: 2.25, text: '2.25 A'}, // 2.5·0.9 = 2.25
		{check: 'limit_below_diode_maximum', input: 'diode_max_current', direction: 'down', at: 2 / 0.9, text: '2.23 A'}, // 2/0.9 = 2.2222, shown rounded up
	])('$check on $input flips at $text', ({check, input, direction, at, text}) => {
		const flip = flipOf(clear, check, input);
		expect(flip.direction).toBe(direction);
		expect(flip.becomes).toBe('fail');
		expect(Math.abs(flip.at.si - at) / at).toBeLessThan(1e-9);
		expect(flip.at.text).toBe(text);
		expect(flip.method).toBe('closed_form');
	});

	it('the eyewear OD threshold against power: flip power = 10^OD·MPE·aperture area', () => {
		// The MPE the tool computes (checked against IEC 60825-1 in tests/calculations/od.reference.test.ts);
		// by hand (IEC 60825-1 table for t ≥ 10 s, 700–1050 nm): 10·C4 W/m², C4 = 10^(0.002·(808 − 700)) = 1.644 → 16.44 W/m².
		const duration = evaluateDocument(rules, bench3).derived.find((entry) => entry.id === 'beam1_duration');
		if (duration?.status !== 'value') throw new Error('no beam 1 duration');
		const computed = od.compute({power: 2, diameter: 0, wavelength: 808e-9, duration: duration.value.si});
		const mpe = computed.mpe_irradiance!;
		expect(Math.abs(mpe - 16.44) / 16.44).toBeLessThan(1e-3); // 10·10^0.216 = 16.44 W/m² (IEC 60825-1, hand arithmetic)
		const area = (Math.PI * 0.007 ** 2) / 4; // 7 mm limiting aperture (IEC 60825-1): 3.848e-5 m²
		const expected = 10 ** 5 * mpe * area; // OD 5: 1e5·16.44·3.848e-5 = 63.27 W
		expect(Math.abs(expected - 63.27) / 63.27).toBeLessThan(1e-3); // hand arithmetic above
		const flip = flipOf(clear, 'beam1_eyewear_sufficient', 'beam1_power');
		expect(flip.direction).toBe('up');
		expectClose(flip.at.si, expected, 'flip power');
		// And the OD that flips it at 2 W: log10(2 W/(3.848e-5 m²·16.44 W/m²)) = log10(3161) = 3.4999 (hand arithmetic)
		const odFlip = flipOf(clear, 'beam1_eyewear_sufficient', 'beam1_eyewear_od');
		expectClose(odFlip.at.si, Math.log10(2 / (area * mpe)), 'flip OD');
		expect(odFlip.at.text).toBe('3.5');
	});
});

describe('the summary', () => {
	it('ranks the three closest passing calls by the fraction of the current value', () => {
		// emission_delay 3 s sits on its 3 s minimum: 0 % away (site policy min_emission_delay 3 s);
		// ambient_max 35 °C → 58 °C: 23 K of 308.15 K = 7.46 % (hand arithmetic, absolute temperature);
		// diode_max_power 2 W → 1.8182 W = 2 W/1.1 (beam power 2 W ≤ max·(1 + 10 %)): 9.09 % (hand arithmetic).
		expect(clear.closest.map((call) => [call.check, call.flip.input])).toEqual([
			['emission_delay_long_enough', 'emission_delay'],
			['dissipation_within_rating', 'ambient_max'],
			['beam1_power_within_diode_maximum', 'diode_max_power'],
		]);
		expect(clear.closest[0]!.flip.fraction).toBe(0);
		expectClose(clear.closest[1]!.flip.fraction, 23 / (35 + kelvin), 'ambient fraction');
		expectClose(clear.closest[2]!.flip.fraction, 1 - 1 / 1.1, 'max power fraction');
	});

	it('gives each fail its smallest single change that clears it', () => {
		// current_limit 2.4 A fails the ceiling 2.25 A: lower it to 2.25 A (6.25 %) or raise diode_max_current to 2.4/0.9 = 2.6667 A (6.67 %).
		const failing = whatIf(withChanges(bench3, {current_limit: '2.4 A'}));
		const fix = failing.fixes.find((entry) => entry.check === 'limit_below_diode_maximum');
		expect(fix?.options.map((option) => [option.input, option.direction, option.becomes, option.at.text])).toEqual([
			['current_limit', 'down', 'pass', '2.25 A'], // 2.5·0.9 (hand arithmetic)
			['diode_max_current', 'up', 'pass', '2.67 A'], // 2.4/0.9 = 2.6667, rounded up (hand arithmetic)
		]);
		expectClose(fix!.options[0]!.fraction, 0.15 / 2.4, 'fraction');
	});
});

// An input entered as a range moves as a whole: its flip point is the range's middle, the range
// kept as wide around it (given as a fraction, as wide a fraction). Replacing the range by one
// exact value would leave the tolerance out and report a flip the setup has already passed.
describe('flip points of an input given as a range (the supply at 5 V ± 5 %, the shipped default tolerance)', () => {
	// Compliance headroom (common practice, linear driver): the low supply V·(1 − 5 %) less the drops
	// (dropout 0.8 V, 50 mΩ + 100 mΩ at 2 A = 0.3 V) must cover the diode at the limit, 1.6 V + 0.15 Ω·2 A = 1.9 V,
	// plus the policy's 0.5 V of headroom (the check's limit, 2.4 V):
	// V·0.95 − 0.8 − 0.3 = 2.4 → V = 3.5/0.95 = 3.6842 V. Without the tolerance it would be 3.5 V.
	// Worst dissipation (as above, derated rating 10 W·(125 − 35)/100 = 9 W): (V·1.05 − 1.9)·2 = 9 → V·1.05 = 6.4 → V = 6.0952 V.
	it.each([
		{check: 'compliance_headroom', direction: 'down', at: 3.5 / 0.95}, // hand arithmetic above
		{check: 'dissipation_within_rating', direction: 'up', at: 6.4 / 1.05}, // hand arithmetic above
	])('$check flips with the supply\'s middle at $at V', ({check, direction, at}) => {
		const flip = flipOf(clear, check, 'supply_nominal');
		expect(flip.direction).toBe(direction);
		expectClose(flip.at.si, at, `${check} flip`);
	});

	it('an absolute half-width moves with the middle: 5 V ± 0.25 V keeps ±0.25 V on the low side', () => {
		const absolute = whatIf(withChanges(bench3, {supply_nominal: '5 V ± 0.25 V'}));
		// Typed as an amount each way, the range keeps ±0.25 V: V − 0.25 − 1.1 = 2.4 → V = 3.75 V.
		expectClose(flipOf(absolute, 'compliance_headroom', 'supply_nominal').at.si, 3.75, 'headroom flip'); // hand arithmetic
	});
});
