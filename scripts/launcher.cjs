// The launcher of dist/prelase.js (see scripts/build.mjs). The program itself is the comment at
// the end of this file. Node 20 has no compile cache of its own, and compiling the 1.2 MB program
// is about a quarter of a start, so the launcher compiles it with V8's code cache: the first run
// of each command writes the cache, later runs read it (and V8 refuses a cache made by another
// Node, V8 version, flags or text). The cache is a speed-up only: any problem with it (missing,
// damaged, unwritable folder) means the program is compiled as usual, never a different program.
// PRELASE_CODE_CACHE names the folder (default: $XDG_CACHE_HOME/prelase, else ~/.cache/prelase);
// PRELASE_CODE_CACHE=off turns it off.
// This level is not strict on purpose: `arguments.callee` is the function Node made of this file,
// and its text holds the program, so the file is not read twice.
(function launch(file) {
	'use strict';
	const fs = require('node:fs');
	const path = require('node:path');
	const {Script} = require('node:vm');
	const {createHash} = require('node:crypto');
	const {pathToFileURL} = require('node:url');
	const programKey = '__PROGRAM_KEY__';
	// Where the program's text holds "*/" (which would end the comment) the build wrote "* /"; these are the spaces to take out.
	const starSlash = [__STAR_SLASH__];

	const opening = '\n/' + '*prelase-program\n';
	const start = file.indexOf(opening) + opening.length;
	const end = file.lastIndexOf('\n*' + '/');
	let program = '';
	let from = start;
	for (const offset of starSlash) {
		program += file.slice(from, start + offset);
		from = start + offset + 1;
	}
	program += file.slice(from, end);
	const source = '(function (exports, require, module, __filename, __dirname, __prelaseUrl) {' + program + '\n})';

	const cacheFolder = folder();
	const cacheFile = cacheFolder && path.join(cacheFolder, `code-${programKey}-${process.version}-${process.arch}.bin`);
	const cached = cacheFile ? readCache(cacheFile) : undefined;
	const script = new Script(source, {filename: __filename, ...(cached ? {cachedData: cached.data} : {})});
	if (cacheFile && require('node:worker_threads').isMainThread) {
		const command = commandName(process.argv.slice(2));
		const commands = cached && !script.cachedDataRejected ? cached.commands : [];
		// Written once a command: the code compiled by this run joins what the cache held.
		if (!commands.includes(command) && commands.length < 24) process.once('exit', () => writeCache(cacheFolder, cacheFile, script, [...commands, command]));
	}
	script.runInThisContext().call(module.exports, module.exports, require, module, __filename, __dirname, pathToFileURL(__filename).href);

	function folder() {
		const named = process.env.PRELASE_CODE_CACHE;
		if (named === 'off') return undefined;
		if (named) return path.resolve(named);
		const base = process.env.XDG_CACHE_HOME || path.join(require('node:os').homedir(), '.cache');
		return path.join(base, 'prelase');
	}

	function commandName(args) {
		if (args.length === 0) return 'screens';
		const word = args.find((arg) => !arg.startsWith('-'));
		return word !== undefined && /^[a-z][a-z-]{0,19}$/.test(word) ? word : 'other';
	}

	/** The cache: one line of JSON (the SHA-256 of the data, the commands that wrote it), then V8's data. */
	function readCache(name) {
		try {
			const bytes = fs.readFileSync(name);
			const line = bytes.indexOf(10);
			if (line < 0 || line > 4096) return undefined;
			const head = JSON.parse(bytes.latin1Slice(0, line));
			const data = bytes.subarray(line + 1);
			if (typeof head.sha256 !== 'string' || !Array.isArray(head.commands)) return undefined;
			if (createHash('sha256').update(data).digest('hex') !== head.sha256) return undefined;
			return {data, commands: head.commands.filter((item) => typeof item === 'string')};
		} catch {
			return undefined;
		}
	}

	function writeCache(folderName, name, compiled, commands) {
		const temporary = `${name}.${process.pid}.tmp`;
		try {
			const data = compiled.createCachedData();
			fs.mkdirSync(folderName, {recursive: true, mode: 0o700});
			const head = JSON.stringify({sha256: createHash('sha256').update(data).digest('hex'), commands});
			fs.writeFileSync(temporary, Buffer.concat([Buffer.from(`${head}\n`, 'latin1'), data]), {mode: 0o600});
			fs.renameSync(temporary, name);
		} catch {
			try {
				fs.rmSync(temporary, {force: true});
			} catch {}
		}
	}
})(arguments.callee.toString());
