import {execFileSync} from 'node:child_process';

/**
 * Vitest global set-up: builds dist/prelase.js once before any test file runs, so every test
 * that starts the program as a user would (bundle, tmux screens, NO_COLOR) runs the same fresh
 * bundle and no file rebuilds it.
 */
export default function setup(): void {
	execFileSync(process.execPath, ['scripts/build.mjs'], {stdio: 'pipe'});
}
