import {Text} from 'ink';
import {cleanup, render} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {useRefState, type RefState} from '../../source/ui/use-ref-state.js';

afterEach(() => cleanup());

type Counter = {count: number; label: string};

/** Renders the count and label, and hands the state to the test as a key handler would hold it. */
function mount(initial: Counter) {
	const seen: Array<RefState<Counter>> = [];
	let initials = 0;
	function Probe() {
		const state = useRefState(() => {
			initials += 1;
			return initial;
		});
		seen.push(state);
		return <Text>{`${state.current.label} ${state.current.count}`}</Text>;
	}
	const view = render(<Probe />);
	return {view, seen, state: () => seen.at(-1)!, initials: () => initials};
}

const tick = () => new Promise((resolve) => setTimeout(resolve, 30));

describe('useRefState', () => {
	// Hand arithmetic: each call reads the count the call before left, so n calls from 0 give n
	// (a value captured at render time would give 1 however many calls came before the frame).
	it.each([
		{calls: 1, shown: 'n 1'},
		{calls: 2, shown: 'n 2'},
		{calls: 5, shown: 'n 5'},
	])('$calls changes before one frame each see the last one: $shown', async ({calls, shown}) => {
		const probe = mount({count: 0, label: 'n'});
		const state = probe.state();
		for (let index = 0; index < calls; index += 1) state.set({...state.current, count: state.current.count + 1});
		expect(state.current.count).toBe(calls);
		await tick();
		expect(probe.view.lastFrame()).toBe(shown);
	});

	it('patch changes only the fields given, and redraws', async () => {
		const probe = mount({count: 3, label: 'a'});
		probe.state().patch({label: 'b'});
		await tick();
		expect(probe.view.lastFrame()).toBe('b 3');
	});

	it('assigning current does not redraw; redraw then shows it', async () => {
		const probe = mount({count: 0, label: 'n'});
		const renders = probe.seen.length;
		probe.state().current = {count: 7, label: 'n'};
		await tick();
		expect(probe.seen.length).toBe(renders);
		expect(probe.view.lastFrame()).toBe('n 0');
		probe.state().redraw();
		await tick();
		expect(probe.view.lastFrame()).toBe('n 7');
	});

	it('is the same object on every render, made from its initial value once', async () => {
		const probe = mount({count: 0, label: 'n'});
		probe.state().set({count: 1, label: 'n'});
		probe.state().patch({count: 2});
		await tick();
		expect(probe.seen.length).toBeGreaterThan(1);
		expect(new Set(probe.seen).size).toBe(1);
		expect(probe.initials()).toBe(1);
	});
});
