/** What a name in a formula refers to. */
export type NameKind =
	| {kind: 'quantity' | 'yes_no' | 'text'; source: 'input'}
	| {kind: 'choice'; source: 'input'; options: readonly string[]}
	| {kind: 'policy' | 'derived' | 'table'; source: 'policy' | 'derived' | 'table'}
	| {kind: 'option_list'; source: 'policy'; choice: string};

/** Every name a formula may use, with what it refers to. */
export type NameTable = ReadonlyMap<string, NameKind>;
