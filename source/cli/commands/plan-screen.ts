import {isInteractive, startScreens} from '../screens.js';
import {UsageError} from '../usage-error.js';
import type {Io} from '../io.js';

/**
 * `prelase plan FILE --edit [--rules FILE]`: the planner screen on FILE. It needs a terminal;
 * without one the message says how to get the figures and findings instead.
 */
export function editPlan(file: string, values: Record<string, unknown>, io: Io): number | Promise<number> {
	const others = Object.keys(values).filter((name) => name !== 'edit' && name !== 'rules' && values[name] !== undefined);
	if (others.length > 0) throw new UsageError(`--edit opens the planner screen and cannot be used with ${others.map((name) => `--${name}`).join(', ')}`);
	if (!isInteractive(io)) {
		throw new UsageError('the planner screen needs a terminal (stdin and stdout), so prelase does not open it here. Without --edit, prelase plan FILE prints the loop figures and findings (--json for scripts).');
	}
	return startScreens(io, {...(typeof values['rules'] === 'string' ? {rules: values['rules']} : {}), startPlan: file});
}
