/** An ISO 8601 timestamp with the local offset: 2026-12-01T18:49:07+01:00. */
export function isoWithOffset(date: Date): string {
	const pad = (value: number, width = 2) => String(Math.abs(value)).padStart(width, '0');
	const offset = -date.getTimezoneOffset();
	const sign = offset >= 0 ? '+' : '-';
	return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}${sign}${pad(Math.floor(Math.abs(offset) / 60))}:${pad(Math.abs(offset) % 60)}`;
}
