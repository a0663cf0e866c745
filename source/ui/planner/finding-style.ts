import type {Finding} from '../../interlock/analysis/finding.js';

/** Word, symbol and colour of a finding's severity: the word and symbol carry the meaning, the colour only helps. */
export const findingStyle: Record<Finding['severity'], {label: string; color: string}> = {
	stop: {label: '✗ STOP', color: 'red'},
	advise: {label: '! advise', color: 'yellow'},
};
