/**
 * @module node/cli
 * Node entry of the `dryhours` command: wires the CLI to the process and the file system.
 */
import { readFile, writeFile } from 'node:fs/promises'
import { pathToFileURL } from 'node:url'
import type { CliIo } from '../cli/command.ts'
import { runCli } from '../cli/main.ts'

export const nodeIo: CliIo = {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  readFile: async (path) => {
    try {
      return new Uint8Array(await readFile(path))
    } catch (e) {
      const { UsageError } = await import('../cli/command.ts')
      throw new UsageError(
        `cannot read '${path}': ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`,
      )
    }
  },
  writeFile: async (path, data) => {
    await writeFile(path, data)
  },
  startServer: async (options) => (await import('./server.ts')).startServer(options),
}

export async function main(argv: string[]): Promise<number> {
  return runCli(argv, nodeIo)
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  process.exitCode = await main(process.argv.slice(2))
}
