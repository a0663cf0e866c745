/**
 * The layers of source/, top to bottom. A file may import its own layer and any layer below
 * it, never one above: see DEVELOPERS.md ("Where things live") and docs/decisions.md.
 * Layers on one row are siblings and may not import each other.
 */
const rows = [['main'], ['cli'], ['ui'], ['render', 'services'], ['audit'], ['interlock'], ['records'], ['rules'], ['calculations'], ['quantities'], ['shared']];
const path = (layer) => (layer === 'main' ? '^source/main\\.ts$' : `^source/${layer}/`);

const forbidden = [];
rows.forEach((row, index) => {
	const above = rows.slice(0, index).flat();
	const siblings = (layer) => row.filter((other) => other !== layer);
	for (const layer of row) {
		const targets = [...above, ...siblings(layer)];
		if (targets.length === 0) continue;
		forbidden.push({
			name: `${layer}-imports-only-down`,
			comment: `source/${layer} may import only the layers below it (${rows.slice(index + 1).flat().join(', ')}); not ${targets.join(', ')}`,
			severity: 'error',
			from: {path: path(layer)},
			to: {path: targets.map(path).join('|')},
		});
	}
});
// Inside rules/: load.ts reads a file (file/) and compiles it (compile/); evaluate/ and inspect/
// (rules show, diff, init) work on compiled rules. The same rule: only down, siblings apart.
const ruleRows = [['load'], ['evaluate', 'inspect'], ['compile'], ['file']];
const rulePath = (part) => (part === 'load' ? '^source/rules/load\\.ts$' : `^source/rules/${part}/`);
ruleRows.forEach((row, index) => {
	const above = ruleRows.slice(0, index).flat();
	for (const part of row) {
		const targets = [...above, ...row.filter((other) => other !== part)];
		if (targets.length === 0) continue;
		forbidden.push({
			name: `rules-${part}-imports-only-down`,
			comment: `source/rules/${part} may import only the parts of rules/ below it (${ruleRows.slice(index + 1).flat().join(', ')}); not ${targets.join(', ')}`,
			severity: 'error',
			from: {path: rulePath(part)},
			to: {path: targets.map(rulePath).join('|')},
		});
	}
});
forbidden.push(
	{name: 'no-import-loops', comment: 'files of source/ may not import each other in a loop', severity: 'error', from: {path: '^source/'}, to: {circular: true}},
	{name: 'no-unknown-layer', comment: 'every file of source/ lives in a known layer folder', severity: 'error', from: {path: '^source/', pathNot: `^source/(main\\.ts$|(${rows.flat().filter((layer) => layer !== 'main').join('|')})/)`}, to: {}},
	{name: 'no-unknown-rules-part', comment: 'every file of source/rules/ is load.ts or lives in file/, compile/, evaluate/ or inspect/', severity: 'error', from: {path: '^source/rules/', pathNot: `^source/rules/(load\\.ts$|(${ruleRows.flat().filter((part) => part !== 'load').join('|')})/)`}, to: {}},
	{name: 'no-test-imports', comment: 'source/ never imports from tests/', severity: 'error', from: {path: '^source/'}, to: {path: '^tests/'}},
);

module.exports = {
	forbidden,
	options: {
		doNotFollow: {path: 'node_modules'},
		includeOnly: '^source/',
		tsPreCompilationDeps: true,
		tsConfig: {fileName: 'tsconfig.json'},
		enhancedResolveOptions: {extensions: ['.ts', '.tsx', '.js']},
	},
};
