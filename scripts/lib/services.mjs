// Local stand-ins for hosted services, started on loopback by our scripts. Each module in FAKES
// has `ensure(root, { appUrl })`, starts (or reuses) its fake unless the environment already
// points at the real service, and returns the environment variables the app reads to find it.
import * as s3 from './fakes/s3.mjs';
import * as smtp from './fakes/smtp.mjs';
import * as stripe from './fakes/stripe.mjs';

const FAKES = [s3, smtp, stripe];

/** Starts the local fakes unless the environment already points at real services. */
export async function ensureLocalServices(root, options = {}) {
  const env = {};
  for (const fake of FAKES) Object.assign(env, await fake.ensure(root, options));
  return env;
}
