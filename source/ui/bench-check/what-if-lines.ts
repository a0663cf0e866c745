import {whatIfLines} from '../../render/what-if-text.js';
import {analyseWhatIf} from '../../rules/evaluate/what-if.js';
import type {Session} from './session.js';
import type {SummaryLine} from './summary-lines.js';

/** The what-if analysis of the session's answers as summary lines, laid out already (the closest calls, fixes, the margin chart in block characters, the tornado chart, every flip point). */
export function whatIfSummaryLines(session: Session, width: number): SummaryLine[] {
	const result = analyseWhatIf(session.rules, session.answers, session.evaluation);
	return whatIfLines(result, width, session.evaluation.checks).map((text, index) => ({key: `what-if-${index}`, text, preformatted: true}));
}
