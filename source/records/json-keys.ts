/**
 * Finds what JSON.parse hides: a name repeated in one object (the parser keeps the last, so an
 * unsigned value could sit in the file beside a signed one) and `__proto__` names (which a
 * validator may turn into a prototype, outside the canonical form). One linear pass.
 */
export function unsafeJsonKey(text: string): {kind: 'duplicate' | 'prototype'; name: string} | undefined {
	const stack: Array<{keys: Set<string>; expectKey: boolean} | undefined> = [];
	for (let index = 0; index < text.length; index += 1) {
		const character = text[index];
		if (character === '"') {
			let end = index + 1;
			while (end < text.length && text[end] !== '"') end += text[end] === '\\' ? 2 : 1;
			const top = stack.at(-1);
			if (top?.expectKey) {
				const name = JSON.parse(text.slice(index, end + 1)) as string;
				if (name === '__proto__') return {kind: 'prototype', name};
				if (top.keys.has(name)) return {kind: 'duplicate', name};
				top.keys.add(name);
				top.expectKey = false;
			}
			index = end;
		} else if (character === '{') stack.push({keys: new Set(), expectKey: true});
		else if (character === '[') stack.push(undefined);
		else if (character === '}' || character === ']') stack.pop();
		else if (character === ',') {
			const top = stack.at(-1);
			if (top) top.expectKey = true;
		}
	}
	return undefined;
}
