/**
 * Entry point of the language server: `node dist/server.js --stdio`, or `--node-ipc` as VS Code
 * starts it. The transport is chosen from the command line by vscode-languageserver.
 */
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { startServer } from './server.js';

startServer(createConnection(ProposedFeatures.all));
