import {formatQuantity, roundedText} from '../../quantities/format.js';

/** A time for a person: milliseconds and seconds as usual, minutes, hours and days when long (4 h, not 14.4 ks). */
export function durationText(seconds: number): string {
	if (seconds >= 2 * 86_400) return `${roundedText(seconds / 86_400)} days`;
	if (seconds >= 3600) return `${roundedText(seconds / 3600)} h`;
	if (seconds >= 60) return `${roundedText(seconds / 60)} min`;
	return formatQuantity(seconds, 'time');
}
