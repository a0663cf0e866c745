import {terminalText} from '../shared/terminal-text.js';
import type {Io} from './io.js';

/**
 * The one boundary between text and the terminal: the io every command is given writes all it is
 * asked to through `terminalText`, so text from a record, rule file, plan, answers or results
 * (or an argument) reaches stdout and stderr without control or bidirectional characters.
 */
export function terminalIo(io: Io): Io {
	return {...io, stdout: terminalStream(io.stdout), stderr: terminalStream(io.stderr)};
}

const decoder = new TextDecoder();

function terminalStream(stream: NodeJS.WriteStream): NodeJS.WriteStream {
	const write = (chunk: string | Uint8Array, ...rest: unknown[]): boolean => (stream.write as (...args: unknown[]) => boolean)(terminalText(typeof chunk === 'string' ? chunk : decoder.decode(chunk)), ...rest);
	return new Proxy(stream, {
		get(target, property) {
			if (property === 'write') return write;
			const value: unknown = Reflect.get(target, property, target);
			return typeof value === 'function' ? (value as (...args: unknown[]) => unknown).bind(target) : value;
		},
	});
}
