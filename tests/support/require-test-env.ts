// Integration tests run against the server and database `npm test` prepares; say so plainly
// instead of failing with a connection error when they are started some other way.
if (!process.env.TEST_BASE_URL || !process.env.DATABASE_URL) {
  throw new Error('Integration tests need the test server and database: run them with `npm test`.');
}
