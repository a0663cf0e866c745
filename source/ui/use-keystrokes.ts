import {useInput, type Key} from 'ink';
import {eachLine} from './text-buffer.js';

/**
 * useInput, one keystroke at a time: a chunk of several keys (a paste, or keys typed faster
 * than the terminal is read) reaches the handler as the keys it was made of.
 */
export function useKeystrokes(handler: (input: string, key: Key) => void, options: {isActive?: boolean} = {}): void {
	useInput((chunk, key) => eachLine(chunk, key, handler), options);
}
