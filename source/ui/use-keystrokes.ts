import {useInput, type Key} from 'ink';
import {eachLine, type Arrival} from './text-buffer.js';

export type {Arrival} from './text-buffer.js';

/**
 * useInput, one keystroke at a time: a chunk of several keys (a paste, or keys typed faster
 * than the terminal is read) reaches the handler as the keys it was made of, each marked as
 * not arriving alone, so that a handler can refuse to take any of them as an answer.
 */
export function useKeystrokes(handler: (input: string, key: Key, arrival: Arrival) => void, options: {isActive?: boolean} = {}): void {
	useInput((chunk, key) => eachLine(chunk, key, handler), options);
}
