/**
 * Wavelength correction factors of the ocular exposure limits, λ in nanometres.
 * Names as in ICNIRP and ANSI Z136.1 (IEC 60825-1 calls them C4, C3 and C7).
 * `band` picks the piece of a piecewise factor (it defaults to λ); on a band edge the caller
 * probes each side with it while the factor's value is still taken at λ itself.
 */

/** Near-infrared retinal factor C_A (IEC C4): 1 below 700 nm, 10^(0.002(λ − 700)) to 1050 nm, 5 to 1400 nm. */
export function factorA(wavelength: number, band = wavelength): number {
	if (band < 700) return 1;
	if (band < 1050) return 10 ** (0.002 * (wavelength - 700));
	return 5;
}

/** Blue-light photochemical factor C_B (IEC C3): 1 for 400–450 nm, 10^(0.02(λ − 450)) above. */
export function factorB(wavelength: number, band = wavelength): number {
	return band < 450 ? 1 : 10 ** (0.02 * (wavelength - 450));
}

/**
 * Factor C_C (IEC C7) for 1150–1400 nm: 1 below 1150 nm, 10^(0.018(λ − 1150)) to 1200 nm, then
 * 8 (2007 edition) or 8 + 10^(0.04(λ − 1250)) (2013/2014 editions).
 */
export function factorC(wavelength: number, edition: 2007 | 2014, band = wavelength): number {
	if (band < 1150) return 1;
	if (band < 1200) return 10 ** (0.018 * (wavelength - 1150));
	return edition === 2007 ? 8 : 8 + 10 ** (0.04 * (wavelength - 1250));
}

/** UV factor C1 = 5.6×10³·t^0.25 J/m² (IEC 60825-1). */
export function factorC1(duration: number): number {
	return 5.6e3 * duration ** 0.25;
}

/** UV factor C2 = 10^(0.2(λ − 295)) J/m², 302.5–315 nm (IEC 60825-1). */
export function factorC2(wavelength: number): number {
	return 10 ** (0.2 * (wavelength - 295));
}

/** UV time T1 = 10^(0.8(λ − 295))×10⁻¹⁵ s, 302.5–315 nm (IEC 60825-1). */
export function uvTime(wavelength: number): number {
	return 10 ** (0.8 * (wavelength - 295)) * 1e-15;
}
