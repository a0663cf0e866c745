import {create, all, type FactoryFunctionMap} from 'mathjs';
import {describe, expect, it} from 'vitest';
import {photonSlopeLimit} from '../../source/calculations/photon-slope-limit.js';

// η_max = h·c/(q·λ): one photon of energy h·c/λ per electron of charge q. CODATA 2018 fixes
// h = 6.62607015e-34 J·s, c = 299792458 m/s and q = 1.602176634e-19 C exactly, so
// h·c/q = 1.2398419843320026e-6 V·m (hand arithmetic).
const cases = [
	{wavelength: 808e-9, limit: 1.5344579014009934}, // hand arithmetic with CODATA h, c, q (2018): 1.23984198e-6/808e-9 = 1.53 W/A
	{wavelength: 980e-9, limit: 1.2651448819714313}, // hand arithmetic with CODATA h, c, q (2018): 1.23984198e-6/980e-9 = 1.27 W/A
	{wavelength: 1550e-9, limit: 0.7998980544077436}, // hand arithmetic with CODATA h, c, q (2018): 1.23984198e-6/1550e-9 = 0.80 W/A
	{wavelength: 405e-9, limit: 3.061338232918525}, // hand arithmetic with CODATA h, c, q (2018): 1.23984198e-6/405e-9 = 3.06 W/A
	{wavelength: 1239.8419843320026e-9, limit: 1}, // hand arithmetic: at λ = h·c/q ÷ 1 V a photon carries 1 eV, so 1 W/A
];

describe('photon-slope-limit reference values', () => {
	it.each(cases)('$wavelength m gives $limit W/A', ({wavelength, limit}) => {
		expect(photonSlopeLimit.compute({wavelength})['slope_limit']).toBeCloseTo(limit, 12);
	});

	it('agrees with the physical constants of mathjs', () => {
		const math = create(all as FactoryFunctionMap);
		// mathjs physical constants (CODATA): planckConstant, speedOfLight, elementaryCharge
		const reference = math.evaluate('planckConstant * speedOfLight / (elementaryCharge * 808 nm)').toNumber('W/A') as number;
		expect(photonSlopeLimit.compute({wavelength: 808e-9})['slope_limit']).toBeCloseTo(reference, 9);
	});
});
