/**
 * @module cli/registry
 * Every subcommand of `dryhours`. Add a command by writing `src/cli/commands/<name>.ts` and listing it here.
 */
import type { CliCommand } from './command.ts'
import { airCommand } from './commands/air.ts'
import { assessCommand } from './commands/assess.ts'
import { compareCommand } from './commands/compare.ts'
import { energyChartCommand } from './commands/energy-chart.ts'
import { equilibriumCommand } from './commands/equilibrium.ts'
import { fitCommand } from './commands/fit.ts'
import { inspectCommand } from './commands/inspect.ts'
import { productsCommand } from './commands/products.ts'
import { serveCommand } from './commands/serve.ts'

export const commands: CliCommand[] = [
  airCommand,
  serveCommand,
  inspectCommand,
  productsCommand,
  equilibriumCommand,
  fitCommand,
  assessCommand,
  compareCommand,
  energyChartCommand,
]
