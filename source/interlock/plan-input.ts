/** The rule-file input that names the interlock plan of a bench setup (kept apart so the check loads the planner only when it is named). */
export const interlockPlanInput = 'interlock_plan';
