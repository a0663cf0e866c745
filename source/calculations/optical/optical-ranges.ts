import {between, wholeBetween, type InputRange} from '../calculation.js';
import {benchRanges} from '../bench-ranges.js';

/**
 * Validity ranges of the optical-hazard calculations, in SI: what the exposure-limit and class
 * tables cover, and bench ranges wider than the shipped rule file's inputs. A value outside is
 * refused, naming the range; inside, a table gap (such as a pulse under 1 ns outside 400–1400 nm)
 * is still refused by the lookup, never guessed.
 */
export const opticalRanges = {
	/** Wavelength: 180 nm to 1 mm, the span of the exposure-limit and class tables. */
	wavelength: between(180e-9, 1e-3),
	/** Exposure or pulse duration: 10⁻¹³ s to 3×10⁴ s, the span of the exposure-limit tables. */
	duration: between(1e-13, 3e4),
	/** Beam power (CW, average, or a single pulse's peak): 0 W to 100 kW, as the bench calculations. */
	power: benchRanges.power,
	/** Beam diameter at the exit or at the eye: 0 m (focused, or a bare diode) to 1 m. */
	diameter: between(0, 1),
	/**
	 * Full-angle divergence: 1 µrad (below what a bench beam reaches; the NOHD grows as 1/φ) to
	 * 2π rad, a full turn; the shipped rule file's 3 rad FWHM becomes 3.6 rad at the 1/e points.
	 */
	divergence: between(1e-6, 2 * Math.PI),
	/** Edition year of the exposure limits; only 2007 and 2014 are implemented. */
	edition: wholeBetween(2007, 2014),
	/** Pulse repetition rate (refused in any case: pulse trains are not covered). */
	repetitionRate: benchRanges.frequency,
} satisfies Record<string, InputRange>;
