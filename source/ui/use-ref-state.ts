import {useReducer, useRef} from 'react';

/**
 * A screen's state kept in a ref: key handlers read and change it at once (several keys can
 * arrive before React draws the next frame, and each must see the change made by the one
 * before), and each change through set or patch asks for a redraw.
 */
export type RefState<T> = {
	/** The latest state. Assigning it changes the state without a redraw (one follows from elsewhere). */
	current: T;
	/** Replaces the state, then redraws. */
	set(next: T): void;
	/** Replaces some fields of the state, then redraws. */
	patch(changes: Partial<T>): void;
	/** Redraws with the state as it is. */
	redraw(): void;
};

/** State in a ref with a forced redraw; the object returned is the same on every render. */
export function useRefState<T>(initial: () => T): RefState<T> {
	const [, redraw] = useReducer((count: number) => count + 1, 0);
	const holder = useRef<RefState<T> | undefined>(undefined);
	if (!holder.current) {
		let value = initial();
		holder.current = {
			get current() {
				return value;
			},
			set current(next: T) {
				value = next;
			},
			set(next) {
				value = next;
				redraw();
			},
			patch(changes) {
				value = {...value, ...changes};
				redraw();
			},
			redraw: () => redraw(),
		};
	}
	return holder.current;
}
