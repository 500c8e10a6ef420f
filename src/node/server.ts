/**
 * @module node/server
 * `npm start` / `dryhours serve`: the API (and the page) on 127.0.0.1:8787 (HOST, PORT), one log line per
 * request, clean shutdown on SIGINT/SIGTERM. Limits from the DRYHOURS_* variables (see api/config.ts).
 */

import { pathToFileURL } from 'node:url'
import { type ServerType, serve } from '@hono/node-server'
import { createApp } from '../api/app.ts'
import { type ApiConfig, configFromVariables } from '../api/config.ts'
import { climateDemoProvider } from './demo-provider.ts'

/** Node settings: the environment, plus a 60 s wall-clock budget per assessment unless set otherwise. */
export function configFromEnv(env: NodeJS.ProcessEnv): Partial<ApiConfig> {
  return {
    timeBudgetMs: 60_000,
    now: () => performance.now(),
    demo: climateDemoProvider(),
    ...configFromVariables(env),
  }
}

export interface RunningServer {
  url: string
  close: () => Promise<void>
}

export function startServer(
  options: { host?: string; port?: number; log?: (line: string) => void } = {},
): Promise<RunningServer> {
  const host = options.host ?? process.env.HOST ?? '127.0.0.1'
  const port = options.port ?? Number(process.env.PORT ?? 8787)
  const log = options.log ?? ((line: string) => process.stdout.write(`${line}\n`))
  const api = createApp(configFromEnv(process.env))
  const fetch = async (req: Request): Promise<Response> => {
    const started = performance.now()
    const res = await api.fetch(req)
    const path = new URL(req.url).pathname
    log(
      `${new Date().toISOString()} ${req.method} ${path} ${res.status} ${(performance.now() - started).toFixed(1)}ms`,
    )
    return res
  }
  return new Promise((resolve) => {
    const server: ServerType = serve({ fetch, hostname: host, port }, (info) => {
      const url = `http://${host}:${info.port}`
      resolve({
        url,
        close: () =>
          new Promise<void>((done) => {
            server.close(() => done())
            // Idle keep-alive sockets would hold the close open.
            ;(server as unknown as { closeAllConnections?: () => void }).closeAllConnections?.()
          }),
      })
    })
  })
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const running = await startServer()
  process.stdout.write(`dryhours listening on ${running.url} (API docs at ${running.url}/docs)\n`)
  const stop = async (signal: string) => {
    process.stdout.write(`dryhours: ${signal} received, shutting down\n`)
    await running.close()
    process.exit(0)
  }
  process.once('SIGINT', () => void stop('SIGINT'))
  process.once('SIGTERM', () => void stop('SIGTERM'))
}
