import {Text as InkText, type TextProps as InkTextProps} from 'ink';
import {cloneElement, Fragment, isValidElement, type ReactElement, type ReactNode} from 'react';
import {showLineBreaks} from '../shared/one-line.js';
import {stripControl} from '../shared/text.js';

/** Props of the screens' Text: Ink's, and whether the text may break lines of its own. */
export type TextProps = InkTextProps & {
	/**
	 * The text may hold line breaks of its own (lines joined by the screen, a caution, a paragraph
	 * of a rule file). Without it, each line break is shown as ⏎, so text from a file (a setup name,
	 * a path, a statement) cannot start a line that passes for one of the screen's own. Either way
	 * the text may still wrap.
	 * @default false
	 */
	lines?: boolean;
};

/**
 * Ink's Text with the screens' one boundary in front of it: every string child (and the strings of
 * fragments inside it) loses its control and bidirectional characters before Ink measures, wraps
 * or draws it, so text from a record, rule file, plan, answers, draft or file name cannot move the
 * cursor, recolour, conceal or reorder what the screen shows. Every screen draws text through
 * this; no file of source/ui imports Ink's Text or strips text itself (a test holds both).
 */
export function Text({lines = false, children, ...props}: TextProps) {
	return <InkText {...props}>{inert(children, lines)}</InkText>;
}

function inert(node: ReactNode, lines: boolean): ReactNode {
	if (typeof node === 'string') return stripControl(lines ? node : showLineBreaks(node));
	if (Array.isArray(node)) return node.map((child: ReactNode) => inert(child, lines));
	// A nested Text strips its own children; a fragment's strings would otherwise reach Ink as they are.
	if (isValidElement(node) && node.type === Fragment) {
		const fragment = node as ReactElement<{children?: ReactNode}>;
		return cloneElement(fragment, undefined, inert(fragment.props.children, lines));
	}
	return node;
}
