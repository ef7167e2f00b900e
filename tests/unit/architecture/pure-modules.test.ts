// lib/trade and lib/sync run on the phone and on the server alike, so they may import nothing
// from a framework, the database or the browser store (STYLE.md).
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..', '..');
const PURE_FOLDERS = ['src/lib/trade', 'src/lib/sync'];
const ALLOWED_PACKAGES = new Set(['zod']);

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx|js|mjs)$/.test(name) ? [path] : [];
  });
}

function importsOf(source: string): string[] {
  const found = [...source.matchAll(/(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)];
  return found.map((m) => m[1] ?? m[2]!).filter(Boolean);
}

describe('pure modules', () => {
  for (const folder of PURE_FOLDERS) {
    it(`${folder} imports only relative modules and ${[...ALLOWED_PACKAGES].join(', ')}`, () => {
      const offenders: string[] = [];
      for (const file of sourceFiles(join(root, folder))) {
        for (const spec of importsOf(readFileSync(file, 'utf8'))) {
          const relativeInside = spec.startsWith('./') || spec.startsWith('../');
          const leavesFolder = relativeInside && !join(file, '..', spec).startsWith(join(root, folder));
          if ((!relativeInside && !ALLOWED_PACKAGES.has(spec)) || leavesFolder) {
            offenders.push(`${relative(root, file)} imports ${spec}`);
          }
        }
      }
      expect(offenders).toEqual([]);
    });
  }

  it('the check itself notices a framework import', () => {
    expect(importsOf("import { useState } from 'react';\nimport x from './y';")).toEqual(['react', './y']);
  });
});
