// Which JavaScript and CSS a page makes the browser load: the scripts, islands and stylesheets
// named in its HTML, followed through their static imports. Dynamic imports are listed apart,
// as they load only when a screen asks for them.

const ASSET = /\/_astro\/[^"'()\s]+?\.(?:js|css)/g;

export function assetsInHtml(html) {
  return [...new Set(html.match(ASSET) ?? [])];
}

const STATIC_IMPORT = /(?:import|export)\s*(?:[\w*{}\s,$]+from\s*)?["'](\.{1,2}\/[^"']+\.js)["']/g;
const DYNAMIC_IMPORT = /import\(\s*["'](\.{1,2}\/[^"']+\.js)["']\s*\)/g;

export function importsInJs(code) {
  const statics = [...code.matchAll(STATIC_IMPORT)].map((m) => m[1]);
  const dynamics = [...code.matchAll(DYNAMIC_IMPORT)].map((m) => m[1]);
  return { statics, dynamics };
}

function resolve(from, spec) {
  return new URL(spec, `http://x${from}`).pathname;
}

/**
 * Walks the static import graph from the page's entry assets.
 * `read(path)` returns the file's text; returns { eager: Set<path>, lazy: Set<path> }.
 */
export async function pageGraph(entries, read) {
  const eager = new Set();
  const lazy = new Set();
  const queue = [...entries];
  while (queue.length) {
    const path = queue.shift();
    if (eager.has(path)) continue;
    eager.add(path);
    if (!path.endsWith('.js')) continue;
    const { statics, dynamics } = importsInJs(await read(path));
    for (const spec of statics) queue.push(resolve(path, spec));
    for (const spec of dynamics) lazy.add(resolve(path, spec));
  }
  for (const path of eager) lazy.delete(path);
  return { eager, lazy };
}
