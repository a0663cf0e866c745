import {stripVTControlCharacters} from 'node:util';
import {cleanup, render} from 'ink-testing-library';
import {createElement} from 'react';
import {afterEach, describe, expect, it} from 'vitest';
import {problem} from '../../source/shared/problems.js';
import {DoneScreen} from '../../source/ui/DoneScreen.js';

afterEach(() => {
	cleanup();
});

const base = {path: '/lab/records/r.json', fingerprint: 'fe18 4103 bc83 6715', outcome: 'clear_to_energize' as const, setup: 'Bench 3', onSaveSetup: () => 'Bench 3', onHome: () => undefined};

function frame(commit?: Parameters<typeof DoneScreen>[0]['commit']): string {
	const {lastFrame} = render(createElement(DoneScreen, {...base, ...(commit === undefined ? {} : {commit})}));
	return stripVTControlCharacters(lastFrame() ?? '').replaceAll(/\s+/g, ' ');
}

describe('after signing on screen, the records repository', () => {
	it.each([
		{case: 'a plain folder says nothing of commits', commit: undefined, says: undefined, never: 'ommitted'},
		{case: 'a commit is named', commit: '0123456789abcdef0123', says: 'Committed to the records repository as 0123456789ab; share it with: prelase records sync', never: 'NOT'},
		{case: 'a record not committed says so, with what to do', commit: problem('git-missing', {folder: '/lab/records'}), says: 'NOT committed to the records repository: the program git is needed for the records repository /lab/records, but it is not installed or not on PATH; install git', never: 'Committed to'},
	])('$case', ({commit, says, never}) => {
		const shown = frame(commit);
		expect(shown).toContain('Signed record written /lab/records/r.json');
		if (says !== undefined) expect(shown).toContain(says);
		expect(shown).not.toContain(never);
	});
});
