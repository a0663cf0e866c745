import {parseDocument, stringify} from 'yaml';

/**
 * Seeded mutation of valid input files for the fuzz run: byte flips, truncation, duplicated
 * and dropped lines, hostile tokens spliced in, random edits of the parsed YAML/JSON data, and
 * random bytes. Deterministic for a seed (mulberry32, a small public-domain PRNG), so a failing
 * case is reproduced by its seed and index.
 */
export class Random {
	#state: number;

	constructor(seed: number) {
		this.#state = seed >>> 0;
	}

	/** A float in [0, 1). */
	next(): number {
		this.#state = (this.#state + 0x6d2b79f5) >>> 0;
		let t = this.#state;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
	}

	/** An integer in [0, n). */
	int(n: number): number {
		return Math.floor(this.next() * n);
	}

	pick<T>(items: readonly T[]): T {
		return items[this.int(items.length)]!;
	}
}

/** Text that has broken parsers and checkers before: YAML structure, quantities at the edges, control and bidi characters, prototype names. */
const tokens = [
	': ', '- ', '&a ', '*a', '<<: *a', '!!binary ', '!!js/function ', '? ', '|', '>-', '"', "'", '\t', '---\n', '...\n', '%YAML 1.1\n', '{', '}', '[', ']', ',', '#',
	'__proto__', 'constructor', '{{value}}', '{{', 'NaN', '.inf', '-.inf', '1e309', '-0', '0x10', '1_000', 'null', '~', 'true', 'yes', 'no',
	'1e-400 A', '5 mA', '25 °C', '-300 degC', '1 kV', '10 %', '0 ohm', '∞', 'µA', '\u001b[2J', '\u202e', '\u0000', '\ufeff', '\r', '\r\n', '\\u0000',
	'a'.repeat(300), '('.repeat(200), 'not '.repeat(100), '1 + '.repeat(100),
];

/** A random value for a JSON/YAML edit. */
function randomValue(random: Random, depth = 0): unknown {
	switch (random.int(depth > 2 ? 8 : 10)) {
		case 0: return null;
		case 1: return random.pick([0, -1, 1e308, -1e-308, 0.1, 2 ** 53 + 1, 1.5]);
		case 2: return random.pick([true, false]);
		case 3: return random.pick(tokens);
		case 4: return `${random.int(1000)} ${random.pick(['mA', 'V', 'W', 'ohm', 'ms', 'K', 'degC', 'nm', 'mW', 'x', ''])}`;
		case 5: return '';
		case 6: return random.pick(['2026-13-45', '2026-02-30', '9999-12-31T23:59:59Z', '1970-01-01', 'yesterday']);
		case 7: return 'x'.repeat(random.int(5000));
		case 8: return Array.from({length: random.int(4)}, () => randomValue(random, depth + 1));
		default: return Object.fromEntries(Array.from({length: random.int(4)}, () => [random.pick(['id', 'value', 'kind', '__proto__', 'format', 'x', 'step']), randomValue(random, depth + 1)]));
	}
}

type Container = Record<string, unknown> | unknown[];

/** Every map and list in data, with the keys it holds. */
function containers(data: unknown, found: Container[] = []): Container[] {
	if (data !== null && typeof data === 'object') {
		found.push(data as Container);
		for (const value of Object.values(data)) containers(value, found);
	}
	return found;
}

/** One random edit of parsed data: a value replaced, a key removed, or a key added. */
export function editData(data: unknown, random: Random): unknown {
	const copy = structuredClone(data);
	const all = containers(copy);
	if (all.length === 0) return randomValue(random);
	for (let edits = 1 + random.int(3); edits > 0; edits -= 1) {
		const target = random.pick(all);
		const keys = Object.keys(target);
		const action = random.int(3);
		if (Array.isArray(target)) {
			if (action === 0 && keys.length > 0) target.splice(random.int(keys.length), 1);
			else if (action === 1 && keys.length > 0) target.push(structuredClone(target[random.int(keys.length)]));
			else target[random.int(keys.length + 1)] = randomValue(random);
		} else if (action === 0 && keys.length > 0) {
			delete target[random.pick(keys)];
		} else if (action === 1 || keys.length === 0) {
			Object.defineProperty(target, random.pick([...keys, 'extra', '__proto__', 'constructor']), {value: randomValue(random), enumerable: true, writable: true, configurable: true});
		} else {
			target[random.pick(keys)] = randomValue(random);
		}
	}
	return copy;
}

/** The names of the mutations, for reporting which kinds were run. */
export const mutations = ['flip', 'truncate', 'duplicate-lines', 'drop-lines', 'splice', 'edit-data', 'random-bytes', 'random-text'] as const;
export type Mutation = (typeof mutations)[number];

/** A mutated copy of a valid file (as bytes), and what was done to it. */
export function mutate(valid: string, format: 'yaml' | 'json', random: Random): {bytes: Buffer; mutation: Mutation} {
	const mutation = random.pick(mutations);
	const bytes = Buffer.from(valid, 'utf8');
	const lines = valid.split('\n');
	switch (mutation) {
		case 'flip': {
			const out = Buffer.from(bytes);
			for (let count = 1 + random.int(8); count > 0; count -= 1) out[random.int(out.length)] = random.int(256);
			return {bytes: out, mutation};
		}
		case 'truncate':
			return {bytes: bytes.subarray(0, random.int(bytes.length)), mutation};
		case 'duplicate-lines': {
			const start = random.int(lines.length);
			const block = lines.slice(start, start + 1 + random.int(6));
			const at = random.int(lines.length + 1);
			return {bytes: Buffer.from([...lines.slice(0, at), ...Array.from({length: 1 + random.int(3)}, () => block).flat(), ...lines.slice(at)].join('\n')), mutation};
		}
		case 'drop-lines': {
			const start = random.int(lines.length);
			return {bytes: Buffer.from([...lines.slice(0, start), ...lines.slice(start + 1 + random.int(6))].join('\n')), mutation};
		}
		case 'splice': {
			let text = valid;
			for (let count = 1 + random.int(3); count > 0; count -= 1) {
				const at = random.int(text.length + 1);
				text = text.slice(0, at) + random.pick(tokens) + text.slice(at + random.int(4));
			}
			return {bytes: Buffer.from(text), mutation};
		}
		case 'edit-data': {
			const data = format === 'json' ? JSON.parse(valid) : parseDocument(valid).toJS();
			const edited = editData(data, random);
			return {bytes: Buffer.from(format === 'json' ? `${JSON.stringify(edited, null, 2)}\n` : stringify(edited)), mutation};
		}
		case 'random-bytes':
			return {bytes: Buffer.from(Array.from({length: random.int(2000)}, () => random.int(256))), mutation};
		default:
			return {bytes: Buffer.from(Array.from({length: random.int(400)}, () => random.pick(tokens)).join(random.pick(['', ' ', '\n', '\n  ']))), mutation};
	}
}
