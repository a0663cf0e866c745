/**
 * Finds what JSON.parse hides: a name repeated in one object (the parser keeps the last, so an
 * unsigned value could sit in the file beside a signed one) and `__proto__` names (which a
 * validator may turn into a prototype, outside the canonical form). One linear pass; strings
 * are skipped with indexOf, and only names with escapes are decoded.
 */
export function unsafeJsonKey(text: string): {kind: 'duplicate' | 'prototype'; name: string} | undefined {
	const stack: Array<Names | undefined> = [];
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
				if (!top.add(name)) return {kind: 'duplicate', name};
				top.expectKey = false;
			}
			index = end;
		} else if (code === 123 /* { */) stack.push(new Names());
		else if (code === 91 /* [ */) stack.push(undefined);
		else if (code === 125 || code === 93 /* } ] */) stack.pop();
		else if (code === 44 /* , */) {
			const top = stack.at(-1);
			if (top) top.expectKey = true;
		}
	}
	return undefined;
}

/**
 * The names of one object seen so far. Most objects in a record have a few names: they are kept
 * in a list and compared in turn, which is cheaper than a set for each of a record's hundred
 * small objects; past 16 names (the inputs, the derived values) a set takes over.
 */
class Names {
	expectKey = true;
	#list: string[] = [];
	#set: Set<string> | undefined;

	/** Adds a name; false when the object has it already. */
	add(name: string): boolean {
		if (this.#set) {
			if (this.#set.has(name)) return false;
			this.#set.add(name);
			return true;
		}
		const list = this.#list;
		for (let index = 0; index < list.length; index += 1) if (list[index] === name) return false;
		list.push(name);
		if (list.length > 16) this.#set = new Set(list);
		return true;
	}
}
