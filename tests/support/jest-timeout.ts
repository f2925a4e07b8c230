// Server and engine tests hash passwords (argon2) and solve eigenproblems: on a
// shared 2-core machine the 5 s default is too tight, so give each test 30 s.
jest.setTimeout(30_000);
