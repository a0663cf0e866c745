import {describe, expect, it} from 'vitest';
import {od} from '../../source/calculations/od.js';
import {evaluateDocument, readDemo, shippedRules, withChanges} from '../rules/bench-answers.js';

// Below 400 nm the photochemical dose adds up over a working day: the shipped rules assess UV
// beams over the policy uv_exposure_duration, 3×10⁴ s (ANSI Z136.1 eyewear practice and the
// IEC 60825-1 time base for ≤ 400 nm, from memory).
//
// Hand arithmetic for a 50 mW beam at 375 nm focused into the 1 mm UV aperture:
//   E₀ = 4P/(π d²) = 4 × 0.05 W / (π × (10⁻³ m)²) = 63 661.98 W/m²
//   2014 reading (dose 10⁴ J/m² held to 3×10⁴ s, DGUV Information 203-042 Annex 6):
//     MPE = 10⁴ J/m² / 3×10⁴ s = 0.33333 W/m²  →  OD = log10(63 661.98 / 0.33333) = 5.28100
//   IEC 60825-1:2007 row (10 W/m² after 10³ s): OD = log10(63 661.98 / 10) = 3.80387
//   the former 10 s time base: MPE = 10⁴ J/m² / 10 s = 1000 W/m² → OD = log10(63.662) = 1.80387
const rules = shippedRules();
const clear = readDemo('bench3-808nm-clear.yaml');
const ultraviolet = withChanges(clear, {beam2_wavelength: '375 nm', beam2_power: '50 mW', beam2_diameter: '0 mm'});

function derived(id: string, document = ultraviolet): number {
	const entry = evaluateDocument(rules, document).derived.find((item) => item.id === id);
	if (entry?.status !== 'value') throw new Error(`${id} has no value`);
	return entry.value.si;
}

describe('UV beams are assessed over the UV exposure duration', () => {
	it('uses uv_exposure_duration = 3×10⁴ s below 400 nm', () => {
		expect(rules.policy.get('uv_exposure_duration')?.si).toBe(3e4); // ANSI Z136.1 / IEC 60825-1 time base for ≤ 400 nm (from memory)
		expect(derived('beam2_duration')).toBe(3e4);
	});

	it('a 50 mW beam at 375 nm needs OD 5.28 (2014 reading), not 1.80', () => {
		expect(derived('beam2_required_od')).toBeCloseTo(5.281, 3); // hand arithmetic above
	});

	it('the 2007 row gives OD 3.80 for the same beam', () => {
		const result = od.compute({power: 0.05, diameter: 0, wavelength: 375e-9, duration: 3e4, edition: 2007});
		expect(result['od']).toBeCloseTo(3.8039, 4); // hand arithmetic above
	});

	it.each([
		{spelling: '400 nm', duration: 3e4}, // on the 400 nm edge the longer UV time base applies (the more protective)
		{spelling: '0.4 um', duration: 3e4}, // the same edge in micrometres
		{spelling: '405 nm', duration: 0.25}, // visible: the aversion response, 0.25 s (ANSI Z136.1; IEC 60825-1)
		{spelling: '700 nm', duration: 10}, // on the 700 nm edge the longer invisible time base applies
		{spelling: '0.7 um', duration: 10}, // the same edge in micrometres
		{spelling: '699 nm', duration: 0.25}, // still visible
	])('$spelling is assessed over $duration s', ({spelling, duration}) => {
		expect(derived('beam2_duration', withChanges(ultraviolet, {beam2_wavelength: spelling}))).toBe(duration);
	});
});
