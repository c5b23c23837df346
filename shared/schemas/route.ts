/**
 * The route document's schema is the engine's input, so it lives with the
 * engine (shared/engine/document.ts); payload schemas import it from here.
 * The dependency runs one way: schemas → engine, never back.
 */
export * from '../engine/document';
