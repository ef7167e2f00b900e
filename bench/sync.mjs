// `npm run bench:sync`: sets up its own database (tickover_bench) and a server of the freshly
// built app, then runs bench/sync-run.ts against them and prints the figures. Options by
// environment: BENCH_DEVICES (8), BENCH_VISITS per device (5), BENCH_ROUNDS (3); --no-build
// reuses dist/ as it is.
import { runBench } from './lib/bench-server.mjs';

process.exit(await runBench({ database: 'tickover_bench', script: 'bench/sync-run.ts' }));
