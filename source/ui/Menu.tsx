import {Box} from 'ink';
import {Text} from './Text.js';
import {useKeystrokes} from './use-keystrokes.js';
import {useRefState} from './use-ref-state.js';
import {Prose} from './Prose.js';

/** One choice of a menu: `key` names it (the menu keeps its place by it). */
export type MenuItem<T> = {key: string; label: string; value: T};

/**
 * A list of choices moved through with ↑ ↓ and taken with Enter, one keystroke at a time:
 * keys that arrive together (Down Down Down typed fast, or sent at once) each move the cursor,
 * and Enter takes the item the keys before it reached. It opens on the item named `initial`
 * (the one chosen last time), else on the first.
 */
export function Menu<T>({items, initial, onSelect}: {items: ReadonlyArray<MenuItem<T>>; initial?: string; onSelect(item: MenuItem<T>): void}) {
	const cursor = useRefState(() => Math.max(0, items.findIndex((item) => item.key === initial)));
	const at = Math.min(cursor.current, items.length - 1);
	useKeystrokes((_input, key) => {
		const count = items.length;
		if (count === 0) return;
		const now = Math.min(cursor.current, count - 1);
		if (key.downArrow) cursor.set((now + 1) % count);
		else if (key.upArrow) cursor.set((now - 1 + count) % count);
		else if (key.return) onSelect(items[now]!);
	});
	return (
		<Box flexDirection="column">
			{items.map((item, index) => (
				// A long label (a draft's setup name) wraps under itself, never from a stray space.
				<Prose key={item.key} text={item.label} lead={index === at ? '❯ ' : '  '} hang="  " {...(index === at ? {color: 'blue'} : {})} />
			))}
		</Box>
	);
}
