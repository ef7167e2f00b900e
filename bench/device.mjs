// `npm run bench:device`: the phone app in headless Chromium at 390 x 844 with the CPU slowed
// down, against a freshly built server with its own database (tickover_bench_device). Prints
// cold start offline, tap-to-durable and tick latency, each beside a baseline from the same run.
// Options by environment: BENCH_COLD_RUNS (5), BENCH_TAPS (200), BENCH_CPU_SLOWDOWN (4);
// --no-build reuses dist/ as it is. Never fails on a figure; exits non-zero only when broken.
import { runBench } from './lib/bench-server.mjs';

process.exit(await runBench({ database: 'tickover_bench_device', script: 'bench/device-run.ts', browser: true }));
