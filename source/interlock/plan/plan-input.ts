/** The rule-file input that names the interlock plan of a bench setup (kept apart so the check loads the planner only when it is named). */
export const interlockPlanInput = 'interlock_plan';

/** The rule-file input that gives where the bench check is (room and bench); an interlock test answers only a check at its plan's location. */
export const locationInput = 'location';
