import type {YamlSource} from '../../shared/yaml-source.js';
import type {RuleFile} from './schema.js';

type Path = ReadonlyArray<string | number>;

/** A place in a rule file. */
export type Origin = {file: string; line: number; column: number};

/** Where something of the effective rules was written: a file and a path inside it. */
export type Place = {source: YamlSource; path: Path};

/** A check whose severity a site file changed, and why. */
export type SeverityChange = {from: 'stop' | 'advise'; to: 'stop' | 'advise'; reason: string};

/**
 * Which file each part of the effective rules came from. Keys name the part:
 * `name`, `caution`, `policy.ID`, `policy.ID.value`, `table.ID`, `step.ID`, `input.ID`,
 * `confirmation.ID`, `derived.ID`, `check.ID`, `check.ID.severity`, `check.ID.switched_off`.
 * Lines are found only when asked for, so loading stays quick.
 */
export type Provenance = {
	/** The files of the chain, from the file loaded to the file with no base. */
	chain: readonly string[];
	/** Where a part was written, or undefined for a key that names nothing. */
	where(key: string): Origin | undefined;
	/** The file a part was written in (no line: nothing is parsed). */
	fileOf(key: string): string | undefined;
	/** Policy values a site file changed: the value they had in the base, and the base's file. */
	previousPolicy: ReadonlyMap<string, {value: string | number; file: string}>;
	/** Checks whose severity a site file changed. */
	severityChanges: ReadonlyMap<string, SeverityChange>;
};

/** The places of a file's parts, keyed as in `Provenance`; built by the loader and the extends resolver. */
export class PlaceBook {
	readonly places = new Map<string, Place>();

	/** Records where a part was written; a later call for the same key wins. */
	set(key: string, source: YamlSource, path: Path): void {
		this.places.set(key, {source, path});
	}

	/** The file a part was written in. */
	fileOf(key: string): string | undefined {
		return this.places.get(key)?.source.file;
	}

	/** Records every part of a whole rule file as written in one source. */
	addWholeFile(rules: RuleFile, source: YamlSource): void {
		this.set('name', source, ['name']);
		this.set('caution', source, ['caution']);
		for (const id of Object.keys(rules.policy)) {
			this.set(`policy.${id}`, source, ['policy', id]);
			this.set(`policy.${id}.value`, source, ['policy', id, 'value']);
		}
		for (const id of Object.keys(rules.tables)) this.set(`table.${id}`, source, ['tables', id]);
		rules.steps.forEach((step, index) => this.addStep(step, source, ['steps', index]));
		rules.derived.forEach((derived, index) => this.set(`derived.${derived.id}`, source, ['derived', index]));
		rules.checks.forEach((check, index) => {
			this.set(`check.${check.id}`, source, ['checks', index]);
			if (check.switched_off !== undefined) this.set(`check.${check.id}.switched_off`, source, ['checks', index, 'switched_off']);
		});
	}

	/** Records a step and its inputs and confirmations. */
	addStep(step: RuleFile['steps'][number], source: YamlSource, path: Path): void {
		this.set(`step.${step.id}`, source, path);
		step.inputs.forEach((input, index) => this.set(`input.${input.id}`, source, [...path, 'inputs', index]));
		step.confirmations.forEach((confirmation, index) => this.set(`confirmation.${confirmation.id}`, source, [...path, 'confirmations', index]));
	}

	/** The provenance view of this book. */
	provenance(chain: readonly string[], previousPolicy = new Map<string, {value: string | number; file: string}>(), severityChanges = new Map<string, SeverityChange>()): Provenance {
		const places = this.places;
		return {
			chain,
			where(key) {
				const place = places.get(key);
				return place ? {file: place.source.file, ...place.source.locate(place.path)} : undefined;
			},
			fileOf: (key) => this.fileOf(key),
			previousPolicy,
			severityChanges,
		};
	}
}

/** The provenance of a rule file with no base: everything comes from that file. */
export function wholeFileProvenance(rules: RuleFile, source: YamlSource): Provenance {
	const book = new PlaceBook();
	book.addWholeFile(rules, source);
	return book.provenance([source.file]);
}
