/**
 * Comove's editor-independent core. Pure: no protocol types, no file system, no globals.
 * Text and numbers in, plain data out.
 */
export * from './cosmology/index.js';
export * from './reader/index.js';
export * from './claims/index.js';
export * from './check/index.js';
