declare const PRELASE_SHIPPED_RULES: string | undefined;

type Shipped = {sha256: string; data: unknown; validated?: unknown};
let shipped: Shipped | null | undefined;

/**
 * The shipped policy as data, parsed when the bundle was built, when the text about to be
 * loaded is byte for byte that file (same SHA-256). Saves parsing its YAML at every start;
 * any other text, or an edited default.yaml, is parsed as usual.
 */
export function shippedRulesData(sha256: string): unknown {
	if (shipped === undefined) shipped = typeof PRELASE_SHIPPED_RULES === 'string' ? (JSON.parse(PRELASE_SHIPPED_RULES) as Shipped) : null;
	return shipped && shipped.sha256 === sha256 ? structuredClone(shipped.data) : undefined;
}

/**
 * The shipped policy as the rule-file schema reads it, checked by that schema when the bundle was
 * built, when the text about to be loaded is byte for byte that file; undefined otherwise (or
 * when the build could not keep it), and the text is checked as usual.
 */
export function shippedValidatedRules(sha256: string): unknown {
	if (shipped === undefined) shipped = typeof PRELASE_SHIPPED_RULES === 'string' ? (JSON.parse(PRELASE_SHIPPED_RULES) as Shipped) : null;
	return shipped && shipped.sha256 === sha256 && shipped.validated !== undefined ? structuredClone(shipped.validated) : undefined;
}
