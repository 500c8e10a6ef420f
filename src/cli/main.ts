/**
 * @module cli/main
 * Dispatch `dryhours <command> …`. Exit codes: 0 success, 2 bad input (one line on stderr), 1 internal error.
 */
import { ConfigError } from '../api/config.ts'
import { isRuntimeLimit, mentionsRuntimeText } from '../api/errors.ts'
import { type CliIo, UsageError } from './command.ts'
import { commands } from './registry.ts'

export function usage(): string {
  const width = Math.max(...commands.map((c) => c.name.length))
  return `dryhours: can this site's weather dry this crop?

Usage: dryhours <command> [options]   (dryhours <command> --help for details)

Commands:
${commands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`).join('\n')}
`
}

/**
 * `--tdb -5` → `--tdb=-5`: node:util parseArgs reads a value starting with '-' as an option, but negative
 * temperatures, offsets and longitudes are everyday input.
 */
export function joinNegativeNumberValues(args: string[]): string[] {
  const out: string[] = []
  for (let i = 0; i < args.length; i++) {
    const a = args[i]
    const next = args[i + 1]
    if (/^--[a-z][a-z0-9-]*$/.test(a) && next !== undefined && /^-(\d|\.\d)/.test(next)) {
      out.push(`${a}=${next}`)
      i++
    } else out.push(a)
  }
  return out
}

/**
 * The one-line message of an error that is the user's input (exit 2), or null for an internal fault
 * (exit 1): usage errors, bad settings, and inputs the engine ran out of memory or stack for.
 */
function inputFault(e: unknown): string | null {
  const tooLarge =
    'the input is too large for the engine to process (it ran out of memory or nesting depth); use a smaller file'
  if (isRuntimeLimit(e)) return tooLarge
  if (e instanceof UsageError || e instanceof ConfigError) {
    // a command that wrapped an engine error in a usage error: the engine's words stay out of the line
    return mentionsRuntimeText(e.message) ? tooLarge : e.message
  }
  return null
}

export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rawRest] = argv
  const rest = joinNegativeNumberValues(rawRest)
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    io.stdout(usage())
    return name === undefined ? 2 : 0
  }
  const command = commands.find((c) => c.name === name)
  if (!command) {
    io.stderr(`dryhours: unknown command '${name}' (try dryhours --help)\n`)
    return 2
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout(`${command.help}\n`)
    return 0
  }
  try {
    return await command.run(rest, io)
  } catch (e) {
    const line = inputFault(e)
    if (line !== null) {
      // One line: parseArgs messages carry a second line of advice that names its own syntax.
      io.stderr(`dryhours ${name}: ${line.split('\n')[0].trim()}\n`)
      return 2
    }
    // A fault of dryhours: no engine text for the user, the error's kind for the report.
    io.stderr(
      `dryhours ${name}: internal error (${(e as Error)?.name ?? 'error'}); please report it with the command you ran\n`,
    )
    return 1
  }
}
