import {useStdin} from 'ink';
import {useEffect, useRef} from 'react';

/**
 * Calls `onCtrlC` for every Ctrl-C typed, from one listener attached once: a handler that
 * `useInput` re-attaches after each render can miss a Ctrl-C that arrives in between.
 */
export function useCtrlC(onCtrlC: () => void): void {
	const {internal_eventEmitter: emitter} = useStdin();
	const latest = useRef(onCtrlC);
	latest.current = onCtrlC;
	useEffect(() => {
		const listener = (data: string) => {
			if (data.includes('\u0003')) latest.current();
		};
		emitter?.on('input', listener);
		return () => {
			emitter?.removeListener('input', listener);
		};
	}, [emitter]);
}
