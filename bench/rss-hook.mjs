// Loaded with `node --import` into a timed child: at exit, writes the child's peak resident
// memory (process.resourceUsage().maxRSS, kilobytes) to the file named by BENCH_RSS_FILE.
import {writeFileSync} from 'node:fs';

process.on('exit', () => {
	const file = process.env.BENCH_RSS_FILE;
	if (file) writeFileSync(file, String(process.resourceUsage().maxRSS));
});
