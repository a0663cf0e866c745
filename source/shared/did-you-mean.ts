/** The closest known name to a mistyped one, for "did you mean" hints. */
export function closestName(name: string, known: Iterable<string>): string | undefined {
	let best: string | undefined;
	let bestDistance = Math.max(2, Math.floor(name.length / 3)) + 1;
	for (const candidate of known) {
		const distance = editDistance(name, candidate);
		if (distance < bestDistance) {
			best = candidate;
			bestDistance = distance;
		}
	}
	return best;
}

function editDistance(a: string, b: string): number {
	const previous = Array.from({length: b.length + 1}, (_, index) => index);
	for (let i = 1; i <= a.length; i += 1) {
		let diagonal = previous[0]!;
		previous[0] = i;
		for (let j = 1; j <= b.length; j += 1) {
			const above = previous[j]!;
			previous[j] = Math.min(above + 1, previous[j - 1]! + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
			diagonal = above;
		}
	}
	return previous[b.length]!;
}

/** " (did you mean x?)" or "" — the hint placeholder used in messages. */
export function didYouMean(name: string, known: Iterable<string>): string {
	const guess = closestName(name, known);
	return guess ? ` (did you mean "${guess}"?)` : '';
}
