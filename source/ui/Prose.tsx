import {useStdout} from 'ink';
import {Text, type TextProps} from './Text.js';
import {showLineBreaks} from '../shared/one-line.js';
import {wrap} from '../shared/wrap.js';

/** Props of Prose: the text, and how it sits in its line. */
export type ProseProps = Omit<TextProps, 'children' | 'wrap'> & {
	text: string;
	/** Columns taken to the left of it by its parents. @default 0 */
	margin?: number;
	/** Put before the first line (as wide as `hang`). @default '' */
	lead?: string;
	/** Put before every later line. @default '' */
	hang?: string;
};

/**
 * Text wrapped by words to the terminal's width, before Ink sees it: a line that Ink wraps
 * itself at a space starts with that space. Values with their units stay on one line.
 */
export function Prose({text, margin = 0, lead = '', hang = '', lines: ownLines = false, ...props}: ProseProps) {
	const {stdout} = useStdout();
	// As the screens' Text does: a line break of the text's own shows as ⏎ unless it may have lines (a caution).
	const lines = wrap(ownLines ? text : showLineBreaks(text), (stdout.columns ?? 80) - margin, hang);
	lines[0] = lead + (lines[0] ?? '').slice(hang.length);
	// Its own line breaks (the wrapping's, and a caution's paragraphs); the screens' Text strips the rest.
	return (
		<Text {...props} lines>
			{lines.join('\n')}
		</Text>
	);
}
