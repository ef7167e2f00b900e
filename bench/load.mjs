// `npm run bench:load`: the end of a working day, when every technician's phone finds signal and
// syncs at once: BENCH_LOAD_DEVICES (50) simulated phones push and pull against a freshly built
// server on loopback with its own database (tickover_bench_load), for BENCH_LOAD_SECONDS (30).
// Prints throughput, latency (p50, p99) and errors beside two baselines from the same run, then
// checks that the database holds every operation the server acknowledged (exit 1 if not).
// --no-build reuses dist/ as it is.
import { runBench } from './lib/bench-server.mjs';

process.exit(await runBench({ database: 'tickover_bench_load', script: 'bench/load-run.ts' }));
