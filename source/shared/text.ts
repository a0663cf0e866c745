/**
 * JSON for a terminal or a pipe: as JSON.stringify, but C1 controls, bidirectional controls and
 * line separators inside strings are written as \u escapes, so the text stays exact and inert.
 */
export function terminalSafeJson(value: unknown): string {
	return JSON.stringify(value, null, 2).replaceAll(/[\u007F-\u009F\u061C\u200E\u200F\u2028\u2029\u202A-\u202E\u2066-\u2069]/g, (character) => `\\u${character.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/**
 * Removes control characters (C0, DEL, C1, the bidirectional overrides and marks) so text from a
 * file cannot move the cursor, recolour or rewrite what a terminal shows. Tabs and newlines stay.
 */
export function stripControl(text: string): string {
	return text.replaceAll(/[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/g, '');
}
