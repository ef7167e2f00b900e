// Local stand-ins for hosted services, started on loopback by our scripts. Each is a small module
// with `name`, `ensure(root)` (start it unless it already runs; resolve to the environment
// variables the app reads to find it; return {} when the environment already points at a real
// service) and `stop(root)`. Add a service by adding its module to SERVICES.
import { s3Store } from './fakes/s3.mjs';

export const SERVICES = [s3Store];

/** Starts the local fakes unless the environment already points at real services. */
export async function ensureLocalServices(root, _options = {}) {
  const env = {};
  for (const service of SERVICES) Object.assign(env, await service.ensure(root));
  return env;
}

export function stopLocalServices(root) {
  for (const service of SERVICES) service.stop(root);
}
