// Installs Debian packages the project needs (PostgreSQL, Chromium) when they are absent.
import { existsSync } from 'node:fs';
import { capture, isRoot, log, runOrThrow } from './run.mjs';

let updated = false;

export function aptInstall(packages, why) {
  const sudo = isRoot ? [] : ['sudo', '-n'];
  if (!isRoot && capture('sudo', ['-n', 'true']).status !== 0) {
    throw new Error(
      `${why} needs the Debian package(s) ${packages.join(', ')}, and installing them needs root. ` +
        `Run: sudo apt-get install -y ${packages.join(' ')}`,
    );
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const [cmd, ...rest] = [...sudo, 'apt-get'];
  if (!updated) {
    log(`apt-get update (for ${packages.join(', ')})`);
    runOrThrow(cmd, [...rest, 'update', '-qq'], { env });
    updated = true;
  }
  log(`apt-get install ${packages.join(' ')}`);
  runOrThrow(cmd, [...rest, 'install', '-y', '-qq', '--no-install-recommends', ...packages], { env });
}

export function ensureChromium() {
  const path = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (existsSync(path)) return path;
  aptInstall(['chromium', 'fonts-dejavu-core'], 'The end-to-end tests');
  if (!existsSync(path)) throw new Error(`chromium was installed but ${path} does not exist`);
  return path;
}
