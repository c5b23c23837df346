/**
 * Version of the route engine, stored with every revision's and draft's results and in a
 * revision's signed content hash. Raised whenever the engine's answers change
 * (tests/unit/route/engine-version.test.ts pins a fingerprint of them to it). A module of its
 * own so that the client can compare stored figures with it without loading the engine.
 */
export const ENGINE_VERSION = '1.17.0';
