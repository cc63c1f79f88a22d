/** Claims: stated numbers, declarations, redshifts and the cosmology-dependent claims of a document. */
export * from './numberParser.js';
export * from './claimKinds.js';
export * from './redshifts.js';
export * from './declarations.js';
export { extractClaims, type Claim, type ClaimScan, type RedshiftSource } from './claimExtractor.js';
export * from './extraction.js';
export * from './sentenceCache.js';
