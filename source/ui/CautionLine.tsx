import {Text} from './Text.js';

/** The caution, said in one line on every screen but home, with the key that shows it in full. */
export const cautionLineText = '? keys, caution in full · the laser safety officer and local codes decide';

/** One dim line above the key line: the full caution is on the home screen and behind `?`. */
export function CautionLine() {
	return (
		<Text dimColor wrap="truncate">
			{cautionLineText}
		</Text>
	);
}
