/** Dispatches `comove <command> …` and turns errors into messages and exit codes. */

import { PRESETS } from '../../shared/src/index.js';
import { CALC_HELP, runCalc } from './calcCommand.js';
import { CHECK_HELP, runCheck } from './checkCommand.js';
import { MIGRATE_HELP, runMigrate } from './migrateCommand.js';
import { EXTRACT_HELP, runExtract } from './extractCommand.js';
import { alignColumns } from './format.js';
import { EXIT, UsageError, type CliIo } from './io.js';

export const VERSION = '0.1.0';

const HELP = `comove ${VERSION}: recomputes the cosmology-dependent numbers of a manuscript.

Usage: comove <command> [options]

Commands:
  check     recompute the cosmology-dependent numbers of manuscripts and judge them (comove check --help)
  migrate   rewrite a manuscript for another parameter set (comove migrate --help)
  calc      quantities of a parameter set at given redshifts (comove calc --help)
  extract   the declarations and claims Comove reads in manuscripts (comove extract --help)
  presets   list the published parameter sets known by name

  --help, --version
`;

const COMMAND_HELP: Readonly<Record<string, string>> = { calc: CALC_HELP, extract: EXTRACT_HELP, check: CHECK_HELP, migrate: MIGRATE_HELP };

/** Runs the command line; returns the exit code (0 ok, 1 inconsistencies, 2 usage or input error). */
export function runCli(argv: string[], io: CliIo): number {
  const [command, ...rest] = argv;
  try {
    switch (command) {
      case undefined:
      case '--help':
      case '-h':
      case 'help':
        io.stdout(HELP);
        return command === undefined ? EXIT.usage : EXIT.ok;
      case '--version':
        io.stdout(`${VERSION}\n`);
        return EXIT.ok;
      case 'calc':
        return runCalc(rest, io);
      case 'extract':
        return runExtract(rest, io);
      case 'check':
        return runCheck(rest, io, VERSION);
      case 'migrate':
        return runMigrate(rest, io);
      case 'presets':
        io.stdout(alignColumns(PRESETS.map((p) => [p.name, p.title, p.source + (p.fromMemory ? ' (values quoted from memory)' : '')])).join('\n') + '\n');
        return EXIT.ok;
      default:
        throw new UsageError(`unknown command '${command}'\n\n${HELP}`);
    }
  } catch (e) {
    if (e instanceof UsageError) {
      io.stderr(`comove: ${e.message}\n`);
      return EXIT.usage;
    }
    // parseArgs reports unknown or malformed options with a TypeError carrying a code.
    const code = (e as { code?: string }).code;
    if (typeof code === 'string' && code.startsWith('ERR_PARSE_ARGS')) {
      const help = COMMAND_HELP[command] ?? '';
      io.stderr(`comove: ${(e as Error).message}\n${help ? `\n${help}` : ''}`);
      return EXIT.usage;
    }
    throw e;
  }
}
