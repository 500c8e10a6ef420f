/**
 * @module cli/command
 * The shape of a CLI subcommand. Commands parse their own options (node:util parseArgs), read files
 * through `io`, call the core and print. They hold no science.
 */

/** A server the entry point started (`dryhours serve`). */
export interface ServingServer {
  url: string
  close: () => Promise<void>
}

/**
 * What a command may touch: output streams, file reading and writing, and (from the Node entry point)
 * starting the HTTP server, so tests can run commands in-process and the CLI imports no entry point.
 */
export interface CliIo {
  stdout: (text: string) => void
  stderr: (text: string) => void
  readFile: (path: string) => Promise<Uint8Array>
  /**
   * Write a file. An existing file is replaced only with `overwrite` (the user's `--force`); otherwise the
   * write is refused with a usage error naming the file, so nothing is overwritten silently.
   */
  writeFile: (path: string, data: string | Uint8Array, options?: { overwrite?: boolean }) => Promise<void>
  /** Whether a file or folder exists at `path` (to refuse before writing any of several files). */
  exists?: (path: string) => Promise<boolean>
  /** Create a folder and its parents (nothing when it exists). */
  makeDir?: (path: string) => Promise<void>
  /** Start the API and the page on host:port, logging each request; absent where no server can run. */
  startServer?: (options: {
    host?: string
    port?: number
    log?: (line: string) => void
  }) => Promise<ServingServer>
}

export interface CliCommand {
  name: string
  /** One line for the command list. */
  summary: string
  /** Full `--help` text. */
  help: string
  /** Runs the command; returns the exit code (0 success). Throw {@link UsageError} for bad input. */
  run: (args: string[], io: CliIo) => Promise<number>
}

/** Bad input from the user: printed as one line on stderr, exit code 2. */
export class UsageError extends Error {
  override name = 'UsageError'
}

/** Parse a finite number option or throw a UsageError naming the option. */
export function numberOption(name: string, value: string | undefined): number | undefined {
  if (value === undefined) return undefined
  const trimmed = value.trim()
  const n = Number(trimmed)
  // Decimal notation only: Number() would also read 0x10, 0b11 and 0o17.
  if (trimmed === '' || !Number.isFinite(n) || /^[+-]?0[xbo]/i.test(trimmed)) {
    throw new UsageError(`--${name} must be a number, got '${value}'`)
  }
  return n
}
