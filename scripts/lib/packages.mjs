// Installs npm packages when node_modules is missing or older than package-lock.json.
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { log, runOrThrow } from './run.mjs';

export function ensurePackages(root) {
  const lock = join(root, 'package-lock.json');
  // npm writes this file at the end of every install, so its age is the install's age.
  const marker = join(root, 'node_modules', '.package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  log('installing npm packages (npm ci)');
  runOrThrow('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
}
