import {
	absDependencies,
	addDependencies,
	andDependencies,
	create,
	divideDependencies,
	equalDependencies,
	equalTextDependencies,
	expDependencies,
	largerDependencies,
	largerEqDependencies,
	log10Dependencies,
	logDependencies,
	maxDependencies,
	minDependencies,
	multiplyDependencies,
	notDependencies,
	orDependencies,
	parseDependencies,
	piDependencies,
	powDependencies,
	smallerDependencies,
	smallerEqDependencies,
	sqrtDependencies,
	subtractDependencies,
	toDependencies,
	unaryMinusDependencies,
	unaryPlusDependencies,
	unequalDependencies,
	unitDependencies,
	type FactoryFunctionMap,
	type MathNode,
	type Unit,
} from 'mathjs';

/**
 * The restricted, unit-aware expression instance: only arithmetic, comparison, logic,
 * a few math functions and units. Nothing in it can import, define units, evaluate text,
 * or reach files, the environment or JavaScript.
 */
const instance = create({
	absDependencies,
	addDependencies,
	andDependencies,
	divideDependencies,
	equalDependencies,
	equalTextDependencies,
	expDependencies,
	largerDependencies,
	largerEqDependencies,
	log10Dependencies,
	logDependencies,
	maxDependencies,
	minDependencies,
	multiplyDependencies,
	notDependencies,
	orDependencies,
	parseDependencies,
	piDependencies,
	powDependencies,
	smallerDependencies,
	smallerEqDependencies,
	sqrtDependencies,
	subtractDependencies,
	toDependencies,
	unaryMinusDependencies,
	unaryPlusDependencies,
	unequalDependencies,
	unitDependencies,
} as unknown as FactoryFunctionMap);

const parseFormula = instance.parse.bind(instance) as (text: string) => MathNode;
const makeUnit = instance.unit.bind(instance) as {
	(text: string): Unit;
	(value: number, unit: string): Unit;
};
const UnitClass = (instance as unknown as {Unit: {isValuelessUnit(name: string): boolean}}).Unit;

function disabled(name: string) {
	return () => {
		throw new Error(`${name} is not available in rule formulas`);
	};
}

for (const name of ['import', 'createUnit', 'evaluate', 'parse', 'compile', 'simplify', 'derivative', 'resolve', 'parser', 'reviver', 'replacer', 'config']) {
	try {
		(instance as unknown as {import(v: object, o: object): void}).import({[name]: disabled(name)}, {override: true});
	} catch {
		// Names the instance never had (simplify, derivative…) cannot be overridden; they are absent anyway.
	}
}

/** Parses text into an expression tree (the caller must check the tree before compiling it). */
export const parse = parseFormula;

/** Makes a unit value: `unit('250 mA')` or `unit(0.25, 'A')`. */
export const unit = makeUnit;

/** True when the name is a unit the instance knows (so a formula symbol with that name is a unit). */
export function isUnitName(name: string): boolean {
	return UnitClass.isValuelessUnit(name);
}

/** True for a mathjs unit value. */
export function isUnit(value: unknown): value is Unit {
	return typeof value === 'object' && value !== null && (value as {type?: string}).type === 'Unit';
}

/** Names of the math functions that rule formulas may call. */
export const mathFunctions: ReadonlySet<string> = new Set(['min', 'max', 'abs', 'sqrt', 'exp', 'log', 'log10']);

/** Constants that rule formulas may name. */
export const mathConstants: ReadonlySet<string> = new Set(['pi']);

export type {MathNode, Unit};
