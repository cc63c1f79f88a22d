/** Manuscript readers: LaTeX, Markdown and plain text to reading text with a source map. */
export * from './documentReading.js';
export * from './sourceMap.js';
export { readLatex, siNumber, siUnit, type MacroDefinition, type LatexReadOptions } from './latexScanner.js';
export { readMarkdown, frontMatterDeclaration } from './markdownReader.js';
export { readPlainText } from './plainTextReader.js';
export * from './incrementalReading.js';
