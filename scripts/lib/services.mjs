// Local stand-ins for hosted services, started on loopback by our scripts. Each entry adds the
// environment variables the app reads to find its service. (Filled in as services arrive.)

/** Starts the local fakes unless the environment already points at real services. */
export async function ensureLocalServices(_root, _options = {}) {
  return {};
}
