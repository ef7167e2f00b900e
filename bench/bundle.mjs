// `npm run bench:bundle`: builds the app, serves it against the local database, signs in as a
// demo technician and reports, per technician page, the JavaScript and CSS the browser loads,
// gzip and brotli compressed, against the budget; and the largest chunks.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliCompressSync, gzipSync, constants } from 'node:zlib';
import { setup, root } from '../scripts/setup.mjs';
import { migrate } from '../scripts/lib/migrate.mjs';
import { runOrThrow } from '../scripts/lib/run.mjs';
import { startServer, waitForServer } from '../scripts/lib/server-process.mjs';
import { assetsInHtml, pageGraph } from './lib/page-assets.mjs';
import { freePort } from './lib/bench-server.mjs';

// The visit page must stay within this much compressed JavaScript, framework included (issue budget).
const VISIT_PAGE_BUDGET_BYTES = 150 * 1024;
// A free port unless told: several checkouts on one machine must not meet on a fixed one.
const port = process.env.BENCH_PORT ?? String(await freePort());
const base = `http://127.0.0.1:${port}`;

const { databaseUrl, env } = await setup();
await migrate(root, databaseUrl);
const appEnv = { ...env, DATABASE_URL: databaseUrl, HOST: '127.0.0.1', PORT: port };
runOrThrow('npx', ['tsx', 'scripts/seed.ts'], { cwd: root, env: { ...process.env, ...appEnv } });
if (!process.argv.includes('--no-build')) runOrThrow('npx', ['astro', 'build'], { cwd: root, env: { ...process.env, ...appEnv }, stdio: 'ignore' });
const server = startServer(root, appEnv, { stdio: 'ignore' });

try {
  await waitForServer(base, server);
  const signIn = await fetch(`${base}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email: 'tom@fenwright.example', password: 'servicing-demo' }),
  });
  const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const pages = technicianPages();
  const sizes = new Map();
  const read = (path) => readFileSync(join(root, 'dist', 'client', path), 'utf8');
  const measure = (path) => {
    if (!sizes.has(path)) {
      const bytes = readFileSync(join(root, 'dist', 'client', path));
      sizes.set(path, {
        raw: bytes.length,
        gzip: gzipSync(bytes, { level: 9 }).length,
        brotli: brotliCompressSync(bytes, { params: { [constants.BROTLI_PARAM_QUALITY]: 11 } }).length,
      });
    }
    return sizes.get(path);
  };
  const rows = [];
  let visitPageGzip = null;
  for (const page of pages) {
    // The sign-in page is for people not signed in yet (signed in, it redirects away).
    const response = await fetch(`${base}${page.path}`, { headers: page.anonymous ? {} : { cookie }, redirect: 'manual' });
    if (response.status !== 200) {
      console.log(`${page.label}: ${page.path} answered ${response.status}; not measured`);
      if (page.isVisitPage) process.exitCode = 1;
      continue;
    }
    const html = await response.text();
    const { eager, lazy } = await pageGraph(assetsInHtml(html), read);
    const sum = (paths, ext) =>
      [...paths].filter((p) => p.endsWith(ext)).reduce((t, p) => {
        const s = measure(p);
        return { raw: t.raw + s.raw, gzip: t.gzip + s.gzip, brotli: t.brotli + s.brotli };
      }, { raw: 0, gzip: 0, brotli: 0 });
    const js = sum(eager, '.js');
    const css = sum(eager, '.css');
    const lazyJs = sum(lazy, '.js');
    rows.push({ page: page.label, js, css, lazyJs, chunks: [...eager].filter((p) => p.endsWith('.js')) });
    if (page.isVisitPage) visitPageGzip = js.gzip;
  }

  const kb = (n) => (n / 1024).toFixed(1).padStart(7);
  console.log('\nJavaScript and CSS loaded per technician page (KB; gzip -9 and brotli -11)\n');
  console.log('page                 JS raw  JS gzip  JS br   CSS gzip  lazy JS gzip');
  for (const r of rows) {
    console.log(`${r.page.padEnd(18)} ${kb(r.js.raw)} ${kb(r.js.gzip)} ${kb(r.js.brotli)} ${kb(r.css.gzip)}   ${kb(r.lazyJs.gzip)}`);
  }
  const largest = [...sizes.entries()].filter(([p]) => p.endsWith('.js')).sort((a, b) => b[1].gzip - a[1].gzip).slice(0, 8);
  console.log('\nLargest chunks (gzip KB):');
  for (const [path, s] of largest) console.log(`  ${kb(s.gzip)}  ${path}`);
  if (visitPageGzip === null) {
    console.log('\nVisit page budget: the visit page was not measured');
  } else {
    const within = visitPageGzip <= VISIT_PAGE_BUDGET_BYTES;
    console.log(`\nVisit page budget: ${kb(visitPageGzip)} KB of ${kb(VISIT_PAGE_BUDGET_BYTES)} KB gzip JS — ${within ? 'within budget' : 'OVER BUDGET'}`);
    process.exitCode = within ? 0 : 1;
  }
} finally {
  server.kill('SIGTERM');
}

/** The technician's pages; one prerendered shell serves every visit. */
function technicianPages() {
  const pages = [
    { label: 'sign-in', path: '/sign-in', anonymous: true },
    { label: 'round', path: '/round' },
    { label: 'calculators', path: '/calculators' },
    { label: 'van (load list)', path: '/van' },
  ];
  // The visit page is one prerendered shell, /visit?id=<visit> (src/pages/visit/index.astro).
  const visitPath = process.env.BENCH_VISIT_PATH ?? '/visit';
  pages.push({ label: 'visit', path: visitPath, isVisitPage: true });
  return pages;
}
