/**
 * Every server test file makes its own database with all migrations (tests/server/helpers/db.ts): about a second on
 * a quiet machine, several on a loaded two-core one. Jest's 5 s default then fails a setup hook for no fault of the
 * code under test, so tests and hooks here get 30 s. This is a ceiling against false failures, not a speed target
 * (speed is measured in bench/, never by timed tests).
 */
jest.setTimeout(30_000);
