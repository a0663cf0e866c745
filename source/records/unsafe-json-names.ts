/**
 * Finds what JSON.parse hides: a name repeated in one object (the parser keeps the last, so an
 * unsigned value could sit in the file beside a signed one) and `__proto__` names (which a
 * validator may turn into a prototype, outside the canonical form). One linear pass; strings
 * are skipped with indexOf, and only names with escapes are decoded.
 */
export function unsafeJsonKey(text: string): {kind: 'duplicate' | 'prototype'; name: string} | undefined {
	const stack: Array<{keys: Set<string>; expectKey: boolean} | undefined> = [];
	const length = text.length;
	for (let index = 0; index < length; index += 1) {
		const code = text.charCodeAt(index);
		if (code === 34 /* " */) {
			let end = text.indexOf('"', index + 1);
			let escaped = false;
			// A quote preceded by an odd number of backslashes is part of the string.
			while (end > 0) {
				let slashes = 0;
				for (let back = end - 1; text.charCodeAt(back) === 92; back -= 1) slashes += 1;
				if (slashes % 2 === 0) break;
				escaped = true;
				end = text.indexOf('"', end + 1);
			}
			if (end < 0) return undefined;
			const top = stack.at(-1);
			if (top?.expectKey) {
				const raw = text.slice(index + 1, end);
				const name = escaped || raw.includes('\\') ? (JSON.parse(`"${raw}"`) as string) : raw;
				if (name === '__proto__') return {kind: 'prototype', name};
				if (top.keys.has(name)) return {kind: 'duplicate', name};
				top.keys.add(name);
				top.expectKey = false;
			}
			index = end;
		} else if (code === 123 /* { */) stack.push({keys: new Set(), expectKey: true});
		else if (code === 91 /* [ */) stack.push(undefined);
		else if (code === 125 || code === 93 /* } ] */) stack.pop();
		else if (code === 44 /* , */) {
			const top = stack.at(-1);
			if (top) top.expectKey = true;
		}
	}
	return undefined;
}
