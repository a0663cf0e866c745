import {describe, expect, it} from 'vitest';
import {calculations} from '../../../source/calculations/registry.js';
import {runCliNow} from '../../helpers/run-cli.js';

function run(...argv: string[]) {
	return runCliNow(argv);
}

describe('prelase calc', () => {
	it('lists every calculation with its summary', () => {
		const {code, stdout} = run('calc');
		expect(code).toBe(0);
		for (const calculation of calculations) expect(stdout).toContain(`${calculation.name}  `);
	});

	it.each(calculations.map(({name}) => ({name})))('$name --help lists inputs, outputs and basis', ({name}) => {
		const calculation = calculations.find((entry) => entry.name === name)!;
		const {code, stdout} = run('calc', name, '--help');
		expect(code).toBe(0);
		for (const key of [...Object.keys(calculation.inputs), ...Object.keys(calculation.outputs)]) expect(stdout).toContain(key);
		expect(stdout).toContain('Basis:');
	});

	it('prints the JSON contract: outputs in SI with unit and text', () => {
		// common practice: a 2 V diode at 1 A from 28 V puts 26 W in a linear driver
		const {code, stdout} = run('calc', 'dissipation', 'supply=28V', 'knee=2 V', 'series_resistance=0ohm', 'limit=1000mA', '--json');
		expect(code).toBe(0);
		const result = JSON.parse(stdout) as {calc: string; inputs: Record<string, {si: number}>; outputs: Record<string, {si: number; unit: string; text: string}>; basis: string[]};
		expect(result.calc).toBe('dissipation');
		expect(result.inputs['limit']!.si).toBe(1);
		expect(result.outputs['worst_power']).toEqual({si: 26, unit: 'W', text: '26 W'});
		expect(result.outputs['fault_power']!.si).toBe(28);
		expect(result.basis.length).toBeGreaterThan(0);
	});

	it('reads temperatures in degC as kelvin and uses defaults', () => {
		const {code, stdout} = run('calc', 'wire', 'awg=18', 'length=1000ft', '--json');
		expect(code).toBe(0);
		const result = JSON.parse(stdout) as {inputs: Record<string, {si: number}>; outputs: Record<string, {si: number}>};
		expect(result.inputs['temperature']!.si).toBeCloseTo(293.15, 9);
		// NBS Handbook 100 (from memory): 18 AWG at 20 °C ≈ 6.39 Ω/kft
		expect(result.outputs['resistance']!.si).toBeCloseTo(6.385, 2);
	});

	it('shows a note when no heat sink can do it', () => {
		const {code, stdout} = run('calc', 'heatsink', 'power=20W', 'ambient=40degC', 'max_temperature=100degC', 'theta_jc=2.5K/W', 'theta_cs=1K/W');
		expect(code).toBe(0);
		expect(stdout).toMatch(/No heat sink can do it/);
	});

	it.each([
		{name: 'an unknown calculation', argv: ['calc', 'dissipaton'], says: ['no calculation named "dissipaton"', 'did you mean "dissipation"']},
		{name: 'an unknown key', argv: ['calc', 'risetime', 'bandwith=1MHz'], says: ['risetime has no input "bandwith"', 'did you mean "bandwidth"']},
		{name: 'a wrong dimension', argv: ['calc', 'risetime', 'bandwidth=1 ms'], says: ['bandwidth', 'is a time', 'a frequency']},
		{name: 'a missing unit', argv: ['calc', 'risetime', 'bandwidth=1000'], says: ['bandwidth', 'has no unit']},
		{name: 'a missing input', argv: ['calc', 'dissipation', 'supply=28V', 'knee=2V', 'series_resistance=0ohm'], says: ['dissipation needs limit', 'a current']},
		{name: 'a value outside validity', argv: ['calc', 'risetime', 'bandwidth=0Hz'], says: ['bandwidth must be above 0 Hz']},
		{name: 'a negative current', argv: ['calc', 'forward-voltage', 'knee=1.6V', 'series_resistance=0.1ohm', 'current=-1A'], says: ['current must be between 0 A and 1 kA']},
		{name: 'not key=value', argv: ['calc', 'risetime', '1MHz'], says: ['"1MHz" is not key=value']},
		{name: 'a repeated key', argv: ['calc', 'risetime', 'bandwidth=1MHz', 'bandwidth=2MHz'], says: ['"bandwidth" is given twice']},
		{name: 'neither input of an inverse', argv: ['calc', 'photodiode', 'responsivity=0.5A/W'], says: ['power or monitor_current must be given']},
		{name: 'a prototype key', argv: ['calc', 'risetime', 'constructor=1'], says: ['risetime has no input "constructor"']},
	])('refuses $name with exit 2', ({argv, says}) => {
		const {code, stderr} = run(...argv);
		expect(code).toBe(2);
		for (const words of says) expect(stderr).toContain(words);
		expect(stderr).not.toContain('internal error');
	});

	// Each input has a declared range; a value outside it is refused naming the key and the range,
	// the same contract as a rule-file input (exit 2), never computed into a nonsense result.
	it.each([
		{name: 'gauge 100', argv: ['calc', 'wire', 'awg=100', 'length=1m'], says: ['awg must be', 'between -3 and 40']}, // NBS Handbook 100 tables run from 4/0 (−3) to 40 AWG
		{name: 'gauge −50', argv: ['calc', 'wire', 'awg=-50', 'length=1m'], says: ['awg must be', 'between -3 and 40']}, // NBS Handbook 100: no gauge finer than 4/0 (−3)
		{name: 'gauge 24.5', argv: ['calc', 'wire', 'awg=24.5', 'length=1m'], says: ['awg must be', 'whole']}, // NBS Handbook 100 lists whole gauges only
		{name: 'copper at −250 °C', argv: ['calc', 'wire', 'awg=18', 'length=1m', 'temperature=-250degC'], says: ['temperature must be', 'between -100 °C and 250 °C']}, // hand arithmetic: 1 + 0.00393·(−270) < 0, a negative resistance
		{name: 'a 150 % supply tolerance', argv: ['calc', 'headroom', 'supply=5V', 'tolerance=150%', 'cable_resistance=0ohm', 'sense_resistance=0ohm', 'driver_drop=0V', 'forward_voltage=2V', 'current=1A'], says: ['tolerance must be', '50 %']}, // hand arithmetic: 5 V × (1 − 1.5) = −2.5 V
		{name: 'a 150 % brownout tolerance', argv: ['calc', 'brownout', 'forward_voltage=2V', 'current=1A', 'cable_resistance=0ohm', 'sense_resistance=0ohm', 'driver_drop=0V', 'supply=5V', 'tolerance=150%'], says: ['tolerance must be', '50 %']}, // hand arithmetic: a negative supply
		{name: 'a threshold at 1000 °C', argv: ['calc', 'threshold', 'threshold_ref=10mA', 'temperature_ref=25degC', 't0=60K', 'temperature=1000degC'], says: ['temperature must be', '300 °C']}, // common practice: the T0 model is fitted over a diode's operating range, far below 1000 °C
		{name: 'zero dissipation below the rated ambient', argv: ['calc', 'derating', 'rated_power=10W', 'rated_ambient=70degC', 'max_temperature=50degC', 'ambient=60degC'], says: ['max_temperature', 'rated_ambient', 'above']}, // common practice: a derating line falls from the rated ambient to a higher zero point
	])('refuses $name with exit 2, naming the key and the range', ({argv, says}) => {
		const {code, stdout, stderr} = run(...argv);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		for (const words of says) expect(stderr).toContain(words);
	});

	// A range edge holds however the value is spelled: −100 °C is 173.15 K is −148 °F
	// (hand arithmetic: −100 + 273.15 = 173.15; (−148 − 32) × 5/9 = −100).
	it.each([
		{argv: ['calc', 'wire', 'awg=18', 'length=1m', 'temperature=-100degC']},
		{argv: ['calc', 'wire', 'awg=18', 'length=1m', 'temperature=173.15K']},
		{argv: ['calc', 'wire', 'awg=18', 'length=1m', 'temperature=-148degF']},
		{argv: ['calc', 'wire', 'awg=18', 'length=1m', 'temperature=250degC']},
		{argv: ['calc', 'wire', 'awg=18', 'length=1m', 'temperature=482degF']},
		{argv: ['calc', 'headroom', 'supply=5V', 'tolerance=50%', 'cable_resistance=0ohm', 'sense_resistance=0ohm', 'driver_drop=0V', 'forward_voltage=1V', 'current=1A']},
		{argv: ['calc', 'headroom', 'supply=5V', 'tolerance=0.5', 'cable_resistance=0ohm', 'sense_resistance=0ohm', 'driver_drop=0V', 'forward_voltage=1V', 'current=1A']},
	])('accepts a range edge however it is spelled: $argv', ({argv}) => {
		const {code, stderr} = run(...argv);
		expect(stderr).toBe('');
		expect(code).toBe(0);
	});

	// The optical calculations declare a range on every input too: the wavelengths and durations
	// the exposure-limit and class tables cover, and bench ranges for power, diameter and angle.
	it.each([
		{name: 'a 100 nm wavelength', argv: ['calc', 'mpe', 'wavelength=100nm', 'duration=1s'], says: ['wavelength must be between 180 nm and 1 mm (100 nm given)']}, // IEC 60825-1:2014 Annex A tables start at 180 nm (from memory)
		{name: 'a 2 mm wavelength', argv: ['calc', 'nohd', 'power=1W', 'diameter=1mm', 'divergence=1mrad', 'wavelength=2mm', 'duration=10s'], says: ['wavelength must be between 180 nm and 1 mm (2 mm given)']}, // IEC 60825-1:2014 Annex A tables end at 1 mm (from memory)
		{name: 'a 150 nm class', argv: ['calc', 'hazard-class', 'power=1mW', 'wavelength=150nm'], says: ['wavelength must be between 180 nm and 1 mm (150 nm given)']}, // IEC 60825-1:2014 Table 3 starts at 180 nm (from memory)
		{name: 'a 10⁵ s exposure', argv: ['calc', 'mpe', 'wavelength=532nm', 'duration=1e5s'], says: ['duration must be between 100 fs and 30 ks']}, // IEC 60825-1 Table A.1 durations end at 3×10⁴ s (from memory)
		{name: 'a 10 fs pulse', argv: ['calc', 'od', 'power=1W', 'diameter=1mm', 'wavelength=800nm', 'duration=10fs'], says: ['duration must be between 100 fs and 30 ks']}, // IEC 60825-1 Table A.1 durations start at 10⁻¹³ s (from memory)
		{name: 'a negative power', argv: ['calc', 'od', 'power=-1W', 'diameter=1mm', 'wavelength=808nm', 'duration=10s'], says: ['power must be between 0 W and 100 kW']}, // hand arithmetic: a power below zero has no meaning
		{name: 'a 1 MW class', argv: ['calc', 'hazard-class', 'power=1MW', 'wavelength=808nm'], says: ['power must be between 0 W and 100 kW (1 MW given)']}, // common practice: a diode bench is far below 100 kW; a megawatt is a unit slip
		{name: 'a 2 m beam', argv: ['calc', 'od', 'power=1W', 'diameter=2m', 'wavelength=808nm', 'duration=10s'], says: ['diameter must be between 0 m and 1 m (2 m given)']}, // common practice: a bench beam is far narrower than 1 m (the shipped rule file allows 0.3 m)
		{name: 'a 2 m exit beam', argv: ['calc', 'nohd', 'power=1W', 'diameter=2m', 'divergence=1mrad', 'wavelength=808nm', 'duration=10s'], says: ['diameter must be between 0 m and 1 m']}, // common practice: a bench beam is far narrower than 1 m
		{name: 'no divergence', argv: ['calc', 'nohd', 'power=1W', 'diameter=1mm', 'divergence=0rad', 'wavelength=808nm', 'duration=10s'], says: ['divergence must be between 1 µrad and 6.28 rad']}, // hand arithmetic: NOHD = (√(4P/πE) − a)/φ is infinite at φ = 0
		{name: 'more than a full turn', argv: ['calc', 'nohd', 'power=1W', 'diameter=1mm', 'divergence=400deg', 'wavelength=808nm', 'duration=10s'], says: ['divergence must be between 1 µrad and 6.28 rad']}, // hand arithmetic: a full angle is at most 360° = 2π rad = 6.283 rad
		{name: 'an edition that does not exist', argv: ['calc', 'mpe', 'wavelength=532nm', 'duration=1s', 'edition=2020'], says: ['edition must be a whole number between 2007 and 2014']}, // IEC 60825-1 editions 2007 (2nd) and 2014 (3rd)
		{name: 'an edition between the two', argv: ['calc', 'mpe', 'wavelength=532nm', 'duration=1s', 'edition=2010'], says: ['edition must be 2014 or 2007']}, // IEC 60825-1: no edition in 2010 (from memory)
		{name: 'a negative repetition rate', argv: ['calc', 'od', 'power=1W', 'diameter=1mm', 'wavelength=808nm', 'duration=1ns', 'repetition_rate=-1kHz'], says: ['repetition_rate must be between 0 Hz and 1 THz']}, // hand arithmetic: a rate below zero has no meaning
	])('refuses an optical input outside its range with exit 2: $name', ({argv, says}) => {
		const {code, stdout, stderr} = run(...argv);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		for (const words of says) expect(stderr).toContain(words);
	});

	// The edges of the optical ranges hold however they are spelled (hand arithmetic:
	// 180 nm = 0.18 µm = 1.8×10⁻⁷ m; 1 mm = 1000 µm = 10⁶ nm; 10⁻¹³ s = 0.1 ps = 100 fs;
	// 3×10⁴ s = 30 ks = 500 min; 100 kW = 10⁵ W = 0.1 MW; 1 m = 100 cm = 1000 mm; 1 µrad =
	// 0.001 mrad; 360° = 2π rad).
	it.each([
		{argv: ['calc', 'mpe', 'wavelength=180nm', 'duration=1ns']},
		{argv: ['calc', 'mpe', 'wavelength=0.18um', 'duration=1ns']},
		{argv: ['calc', 'mpe', 'wavelength=1.8e-7m', 'duration=1ns']},
		{argv: ['calc', 'mpe', 'wavelength=1mm', 'duration=10s']},
		{argv: ['calc', 'mpe', 'wavelength=1000um', 'duration=10s']},
		{argv: ['calc', 'mpe', 'wavelength=1e6nm', 'duration=10s']},
		{argv: ['calc', 'mpe', 'wavelength=532nm', 'duration=1e-13s']},
		{argv: ['calc', 'mpe', 'wavelength=532nm', 'duration=0.1ps']},
		{argv: ['calc', 'mpe', 'wavelength=532nm', 'duration=100fs']},
		{argv: ['calc', 'mpe', 'wavelength=1550nm', 'duration=3e4s']},
		{argv: ['calc', 'mpe', 'wavelength=1550nm', 'duration=30ks']},
		{argv: ['calc', 'mpe', 'wavelength=375nm', 'duration=500min']},
		{argv: ['calc', 'mpe', 'wavelength=532nm', 'duration=1s', 'edition=2007']},
		{argv: ['calc', 'od', 'power=100kW', 'diameter=1m', 'wavelength=808nm', 'duration=10s']},
		{argv: ['calc', 'od', 'power=1e5W', 'diameter=100cm', 'wavelength=808nm', 'duration=10s']},
		{argv: ['calc', 'od', 'power=0W', 'diameter=0mm', 'wavelength=0.18um', 'duration=30ks']},
		{argv: ['calc', 'nohd', 'power=1W', 'diameter=1000mm', 'divergence=1urad', 'wavelength=808nm', 'duration=10s']},
		{argv: ['calc', 'nohd', 'power=1W', 'diameter=0m', 'divergence=0.001mrad', 'wavelength=808nm', 'duration=10s']},
		{argv: ['calc', 'nohd', 'power=1W', 'diameter=1mm', 'divergence=360deg', 'wavelength=808nm', 'duration=10s']},
		{argv: ['calc', 'hazard-class', 'power=0.1MW', 'wavelength=180nm']},
		{argv: ['calc', 'hazard-class', 'power=0W', 'wavelength=0.1cm']},
		{argv: ['calc', 'photon-slope-limit', 'wavelength=0.18um']},
		{argv: ['calc', 'photon-slope-limit', 'wavelength=1000um']},
	])('accepts an optical range edge however it is spelled: $argv', ({argv}) => {
		const {code, stderr} = run(...argv);
		expect(stderr).toBe('');
		expect(code).toBe(0);
	});

	it('shows each input\'s range in --help', () => {
		const {stdout} = run('calc', 'wire', '--help');
		// NBS Handbook 100 AWG tables: 4/0 (−3) to 40
		expect(stdout).toMatch(/awg[\s\S]*-3 to 40 \(whole\)/);
		expect(stdout).not.toContain('awg=4.5'); // a whole-gauge input is not shown a fractional example
	});

	it('shows an example inside the range in --help', () => {
		const {stdout} = run('calc', 'mpe', '--help');
		// IEC 60825-1 editions 2007 and 2014: an example outside 2007–2014 would be refused
		expect(stdout).not.toContain('edition=5');
		expect(stdout).toContain('edition=2014');
	});

	it('prints the caution with every exposure figure, in text and JSON', () => {
		const text = run('calc', 'od', 'power=2W', 'diameter=3mm', 'wavelength=808nm', 'duration=10s');
		expect(text.code).toBe(0);
		expect(text.stdout).toMatch(/CAUTION: For planning only/);
		const json = JSON.parse(run('calc', 'mpe', 'wavelength=532nm', 'duration=0.25s', '--json').stdout) as {caution?: string; notes: string[]; outputs: Record<string, {si: number}>};
		expect(json.caution).toMatch(/laser safety officer/);
		expect(json.notes.join(' ')).toMatch(/Limit applied: retinal thermal/);
		// FoS-2015 (seen): 18·t^0.75 J/m² at 0.25 s = 25.456 W/m²
		expect(json.outputs['irradiance']!.si).toBeCloseTo(25.4558, 3);
	});

	it('says "not covered" and exits 2 outside the tables', () => {
		const {code, stderr} = run('calc', 'mpe', 'wavelength=100nm', 'duration=1s');
		expect(code).toBe(2);
		expect(stderr).toContain('wavelength must be between 180 nm and 1 mm');
		expect(run('calc', 'hazard-class', 'power=1mW', 'wavelength=2mm').code).toBe(2); // the class tables end at 1 mm
	});

	it('gives the same number as the rule formula that calls the same calculation', () => {
		const check = run('check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--json');
		const evaluation = JSON.parse(check.stdout) as {checks: Array<{id: string; value?: {si: number}}>};
		// the clear demo: supply 5 V ± 5 % (the dissipation check is judged at its high end, 5.25 V), knee 1.6 V, 0.15 Ω, limit 2 A
		const calc = run('calc', 'dissipation', 'supply=5.25V', 'knee=1.6V', 'series_resistance=0.15ohm', 'limit=2A', '--json');
		const result = JSON.parse(calc.stdout) as {outputs: Record<string, {si: number}>};
		expect(result.outputs['worst_power']!.si).toBeCloseTo(evaluation.checks.find((entry) => entry.id === 'dissipation_within_rating')!.value!.si, 12);
	});
});
