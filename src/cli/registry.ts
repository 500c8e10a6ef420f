/**
 * @module cli/registry
 * Every subcommand of `dryhours`. Add a command by writing `src/cli/commands/<name>.ts` and listing it here.
 */
import type { CliCommand } from './command.ts'
import { airCommand } from './commands/air.ts'
import { serveCommand } from './commands/serve.ts'

export const commands: CliCommand[] = [airCommand, serveCommand]
