/** What the command line needs from the outside world; tests pass their own. */
export interface CliIo {
  readonly stdout: (text: string | Uint8Array) => void;
  readonly stderr: (text: string) => void;
  /** Reads a UTF-8 text file ('-' is standard input); throws an Error with a readable message if it cannot. */
  readonly readFile: (path: string) => string;
  /** The entries of a folder (null when the path is not a folder). */
  readonly listFolder?: (path: string) => Array<{ name: string; folder: boolean }> | null;
  /** Writes a UTF-8 text file; throws an Error with a readable message if it cannot. */
  readonly writeFile?: (path: string, text: string) => void;
  /** Whether standard error is a terminal (progress is shown only then). */
  readonly stderrIsTerminal?: boolean;
}

/** A usage or input error: printed without a stack trace, exit code 2. */
export class UsageError extends Error {}

/** Exit codes shared by every command. */
export const EXIT = { ok: 0, inconsistent: 1, usage: 2 } as const;

/** The same io, reading each file at most once (a project's files are asked for again by the include resolver). */
export function readingOnce(io: CliIo): CliIo {
  const texts = new Map<string, string>();
  return {
    ...io,
    readFile: (path) => {
      let text = texts.get(path);
      if (text === undefined) texts.set(path, (text = io.readFile(path)));
      return text;
    },
  };
}
