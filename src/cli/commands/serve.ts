import { parseArgs } from 'node:util'
import { type CliCommand, numberOption, UsageError } from '../command.ts'

const help = `dryhours serve: the HTTP API and the web page

Usage:
  dryhours serve [--host <address>] [--port <n>]

Defaults: 127.0.0.1:8787 (or HOST and PORT from the environment). Requests that take a file run on
DRYHOURS_WORKERS worker threads (default: one per core) with up to DRYHOURS_QUEUE waiting (default 8 per
thread; beyond it 503 with Retry-After). Stops cleanly on Ctrl-C (SIGINT) or SIGTERM.`

export const serveCommand: CliCommand = {
  name: 'serve',
  summary: 'serve the HTTP API and the web page (default 127.0.0.1:8787)',
  help,
  async run(args, io) {
    let values: { host?: string; port?: string }
    try {
      values = parseArgs({ args, options: { host: { type: 'string' }, port: { type: 'string' } } }).values
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const port = numberOption('port', values.port)
    if (port !== undefined && !(Number.isInteger(port) && port >= 0 && port <= 65535)) {
      throw new UsageError(`--port must be an integer from 0 to 65535, got ${values.port}`)
    }
    if (io.startServer === undefined) {
      throw new UsageError('serve runs from the Node command (npx dryhours serve, or npm start)')
    }
    const running = await io.startServer({ host: values.host, port, log: (line) => io.stdout(`${line}\n`) })
    io.stdout(`dryhours listening on ${running.url} (API docs at ${running.url}/docs)\n`)
    await new Promise<void>((resolve) => {
      const stop = (signal: string) => {
        io.stdout(`dryhours: ${signal} received, shutting down\n`)
        void running.close().then(resolve)
      }
      process.once('SIGINT', () => stop('SIGINT'))
      process.once('SIGTERM', () => stop('SIGTERM'))
    })
    return 0
  },
}
