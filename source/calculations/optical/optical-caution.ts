/** Shown with every exposure limit, hazard distance, optical density and class that prelase computes. */
export const opticalCaution =
	"For planning only: these figures do not replace the laser safety officer's hazard evaluation or the standards in force (IEC 60825-1, ANSI Z136.1, local law). Point source and a single wavelength are assumed.";
