import type {Io} from './io.js';

/** True when both ends are a terminal, so the screens can run. */
export function isInteractive(io: Io): boolean {
	return Boolean(io.stdin?.isTTY && io.stdout.isTTY);
}

/** Loads the screens (and Ink) only now: the non-interactive commands never pay for them. */
export async function startScreens(io: Io, options: {rules?: string; startCheck?: {setup?: string}; startPlan?: string}): Promise<number> {
	const {runScreens} = await import('../ui/run.js');
	const {code, farewell} = await runScreens({env: io.env, stderr: io.stderr, ...options});
	// After the screens, on a line of its own: where the drafts are kept, or that nothing was pending.
	if (farewell !== undefined) io.stdout.write(`${farewell}\n`);
	return code;
}
