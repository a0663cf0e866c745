import {useInput, type Key} from 'ink';
import {useRef} from 'react';
import {eachLine, type Arrival} from './text-buffer.js';

export type {Arrival} from './text-buffer.js';

/**
 * useInput, one keystroke at a time: a chunk of several keys (a paste, or keys typed faster
 * than the terminal is read) reaches the handler as the keys it was made of. Ink splits one
 * read at every escape sequence ("y↓y" becomes three events), so the events of one read are
 * gathered first: when they hold more than one key, none of their keys arrives alone, and a
 * handler can refuse to take any of them as an answer.
 */
export function useKeystrokes(handler: (input: string, key: Key, arrival: Arrival) => void, options: {isActive?: boolean} = {}): void {
	const latest = useRef(handler);
	latest.current = handler;
	const gathered = useRef<Array<[string, Key]>>([]);
	useInput((chunk, key) => {
		gathered.current.push([chunk, key]);
		if (gathered.current.length > 1) return;
		// Ink emits every event of one read before this microtask runs.
		queueMicrotask(() => {
			const events = gathered.current;
			gathered.current = [];
			const keys = events.reduce((count, [text]) => count + Math.max(1, [...text].length), 0);
			for (const [text, event] of events) eachLine(text, event, latest.current, keys > 1);
		});
	}, options);
}
