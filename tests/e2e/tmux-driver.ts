import {execFileSync, spawnSync} from 'node:child_process';

/** A program running in a private tmux server, driven like a person at a keyboard. */
export class TmuxSession {
	readonly socket: string;

	constructor(
		name: string,
		command: string,
		readonly width = 100,
		readonly height = 32,
	) {
		this.socket = `prelase-e2e-${name}-${process.pid}`;
		execFileSync('tmux', ['-L', this.socket, 'new-session', '-d', '-x', String(width), '-y', String(height), command]);
	}

	/** The screen as plain text. */
	screen(): string {
		return spawnSync('tmux', ['-L', this.socket, 'capture-pane', '-p'], {encoding: 'utf8'}).stdout ?? '';
	}

	/** The screen with its colour and attribute escapes, as the terminal holds it. */
	rawScreen(): string {
		return spawnSync('tmux', ['-L', this.socket, 'capture-pane', '-p', '-e'], {encoding: 'utf8'}).stdout ?? '';
	}

	/** Types literal text (no key names), as a paste would. */
	type(text: string): void {
		execFileSync('tmux', ['-L', this.socket, 'send-keys', '-l', text]);
	}

	/** Presses named keys: Enter, Down, Right, C-c… */
	press(...keys: string[]): void {
		execFileSync('tmux', ['-L', this.socket, 'send-keys', ...keys]);
	}

	/** Waits until the screen satisfies a test, or fails with the screen after a deadline. */
	async waitFor(test: (screen: string) => boolean, what: string, deadlineMs = 8000): Promise<string> {
		const start = Date.now();
		for (;;) {
			const screen = this.screen();
			if (test(screen)) return screen;
			if (Date.now() - start > deadlineMs) throw new Error(`timed out waiting for ${what}; the screen was:\n${screen}`);
			await new Promise((resolve) => setTimeout(resolve, 40));
		}
	}

	/** Waits until the screen stops changing (a frame has been drawn after the last key). */
	async settle(quietMs = 120, deadlineMs = 5000): Promise<string> {
		const start = Date.now();
		let last = this.screen();
		let since = Date.now();
		while (Date.now() - start < deadlineMs) {
			await new Promise((resolve) => setTimeout(resolve, 30));
			const now = this.screen();
			if (now !== last) {
				last = now;
				since = Date.now();
			} else if (Date.now() - since >= quietMs) return now;
		}
		return last;
	}

	kill(): void {
		spawnSync('tmux', ['-L', this.socket, 'kill-server']);
	}
}

/** True when tmux can be run here. */
export function haveTmux(): boolean {
	return spawnSync('tmux', ['-V']).status === 0;
}
