// Preloaded into a benchmarked child (node --import) when /usr/bin/time is not installed: at exit it
// writes the process's peak resident set size (getrusage, in KiB) to the file named by BENCH_RSS_OUT.
import { writeFileSync } from 'node:fs';

const out = process.env.BENCH_RSS_OUT;
if (out) process.on('exit', () => writeFileSync(out, String(process.resourceUsage().maxRSS)));
