import type {Dimension} from '../../quantities/dimensions.js';
import type {Tolerance} from '../../quantities/range-entry.js';
import type {CompiledFormula} from './formula.js';
import type {NameTable} from './names.js';
import type {Provenance} from '../file/provenance.js';
import type {Check, Confirmation, Derived, Input, RuleFile, Step, Table} from '../file/schema.js';

/** A quantity held as an SI number with its dimension. */
export type SiValue = {si: number; dimension: Dimension};

/** An input with its step and compiled condition; quantity inputs carry their range in SI. */
export type CompiledInput = {input: Input; step: Step; when?: CompiledFormula; range?: {min: number; max: number}; defaultValue?: SiValue; /** The rules' default tolerance: a single value entered becomes a range this wide each way. */ tolerance?: Tolerance};

/** A confirmation with its step and compiled condition. */
export type CompiledConfirmation = {confirmation: Confirmation; step: Step; when?: CompiledFormula};

/** A derived value with its compiled formula. */
export type CompiledDerived = {derived: Derived; formula: CompiledFormula};

/** A check with its compiled formulas. `relation` says which way the value must sit against its limit. */
export type CompiledCheck = {
	check: Check;
	when?: CompiledFormula;
	holds?: CompiledFormula;
	value?: CompiledFormula;
	limit?: CompiledFormula;
	relation?: 'at_most' | 'at_least';
};

/** Rules ready to evaluate: validated, linted and compiled once. */
export type CompiledRules = {
	file: string;
	text: string;
	sha256: string;
	rules: RuleFile;
	names: NameTable;
	policy: ReadonlyMap<string, SiValue>;
	/** Policy values that list options of a choice input (`options_of`), tested with one_of(). */
	optionLists: ReadonlyMap<string, readonly string[]>;
	tables: ReadonlyMap<string, Table>;
	inputs: ReadonlyMap<string, CompiledInput>;
	confirmations: ReadonlyMap<string, CompiledConfirmation>;
	/** In dependency order: each derived value comes after those it uses. */
	derived: readonly CompiledDerived[];
	/** The checks that are evaluated, in the order of the file. */
	checks: readonly CompiledCheck[];
	/** Checks a site file switched off (each with `check.switched_off`, the reason): kept, never evaluated. */
	switchedOff: readonly CompiledCheck[];
	/** Which file each policy value, step, input, confirmation and check came from. */
	provenance: Provenance;
};
