import {join, resolve} from 'node:path';
import {describe, expect, it} from 'vitest';
import {runCliNow} from '../../helpers/run-cli.js';

const examples = resolve('docs/examples');
const clearDemo = join(examples, 'bench3-808nm-clear.yaml');
const failDemo = join(examples, 'bench6-chilled-mount-cold-power-fail.yaml');

describe('check --what-if', () => {
	it('prints the closest calls, each flip point in the input\'s unit, and a tornado chart (text)', () => {
		const {code, stdout} = runCliNow(['check', '--answers', clearDemo, '--what-if'], {NO_COLOR: '1'});
		expect(code).toBe(0);
		// Bench 3: worst dissipation (5.25 V − 1.6 V − 0.15 Ω·2 A)·2 A = 6.7 W (common practice, linear pass element);
		// allowed 10 W·(125 − T)/100 reaches 6.7 W at T = 58 °C (hand arithmetic, linear derating).
		expect(stdout).toContain('fails if ambient_max > 58 °C (now 35 °C)');
		// Ceiling 2.5 A·(1 − 10 %) = 2.25 A (hand arithmetic; margin is site policy).
		expect(stdout).toContain('fails if current_limit > 2.25 A (now 2 A)');
		// Each pass's nearest flip is marked: the ceiling's is diode_max_current at 2/0.9 = 2.2222 A, 11.1 % below 2.5 A (hand arithmetic).
		expect(stdout).toContain('fails if diode_max_current < 2.23 A (now 2.5 A) · nearest, 11.1 % away');
		expect(stdout).toContain('1. Emission delay at or above the policy minimum');
		expect(stdout).toMatch(/ambient_max\s+·+│█ +no flip \/ \+7\.46 %/); // 23 K of 308.15 K (hand arithmetic)
		expect(stdout).toContain('laser safety officer');
		expect(stdout).not.toMatch(/\u001B\[/);
	});

	it('says the smallest changes that clear a fail', () => {
		const {code, stdout} = runCliNow(['check', '--answers', failDemo, '--what-if'], {NO_COLOR: '1'});
		expect(code).toBe(1);
		expect(stdout.replaceAll(/\n +/g, ' ')).toContain('lower current_limit by 120 mA to ≤ 2.88 A, or lower diode_slope_efficiency by 0.05 W/A to ≤ 1 W/A');
	});

	it('adds the analysis to the JSON under whatIf', () => {
		const {stdout} = runCliNow(['check', '--answers', clearDemo, '--what-if', '--json']);
		const json = JSON.parse(stdout) as {whatIf: {closest: Array<{check: string; flip: {input: string; fraction: number; words: string}}>; checks: Array<{check: string; flips: Array<{input: string; at: {si: number}}>}>}};
		expect(json.whatIf.closest.map((call) => call.check)).toEqual(['emission_delay_long_enough', 'dissipation_within_rating', 'beam1_power_within_diode_maximum']);
		expect(json.whatIf.closest[1]!.flip.words).toBe('fails if ambient_max > 58 °C (now 35 °C)');
		const ceiling = json.whatIf.checks.find((entry) => entry.check === 'limit_below_diode_maximum')!.flips.find((flip) => flip.input === 'current_limit')!;
		expect(Math.abs(ceiling.at.si - 2.25)).toBeLessThan(1e-9); // 2.5 A·0.9 (hand arithmetic)
	});

	it('is a usage error without --answers (on screen it is the key w)', () => {
		const {code, stderr} = runCliNow(['check', '--what-if']);
		expect(code).toBe(2);
		expect(stderr).toContain('--what-if goes with --answers FILE');
	});

	it('leaves the plain check as it was', () => {
		const {stdout} = runCliNow(['check', '--answers', clearDemo, '--json']);
		expect(JSON.parse(stdout)).not.toHaveProperty('whatIf');
	});
});
