import type {Io} from '../../source/cli/io.js';

/** A write stream that keeps what was written, for asserting on a command's output. */
export type FakeStream = NodeJS.WriteStream & {
	/** Everything written so far, joined. */
	readonly text: string;
};

/** Makes a stream that collects text; not a terminal, no width. */
export function fakeStream(): FakeStream {
	const chunks: string[] = [];
	const stream = {
		isTTY: false,
		columns: undefined,
		write(chunk: string | Uint8Array, ...rest: unknown[]): boolean {
			chunks.push(typeof chunk === 'string' ? chunk : Buffer.from(chunk).toString('utf8'));
			const callback = rest.find((entry): entry is () => void => typeof entry === 'function');
			callback?.();
			return true;
		},
		get text() {
			return chunks.join('');
		},
	};
	return stream as unknown as FakeStream;
}

/** The io a command is given, with collecting stdout and stderr and an environment without colour. */
export type FakeIo = Io & {stdout: FakeStream; stderr: FakeStream};

/** Makes an io for `main(argv, io)`; `env` defaults to an empty environment. */
export function fakeIo(env: NodeJS.ProcessEnv = {}): FakeIo {
	return {stdout: fakeStream(), stderr: fakeStream(), env};
}
