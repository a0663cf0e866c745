/** The short deferral shown with every caution, on screens, summaries, records and reports. */
export const deferral =
	'prelase says which checks held; it never says a setup is safe. The laser safety officer and the codes in force (IEC 60825 series, ANSI Z136 series, local law) have the final word.';
