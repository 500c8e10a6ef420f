import { type ChildProcess, spawn } from 'node:child_process'
import { describe, expect, it } from 'vitest'

// The server started as a user would (`npm start`, `dryhours serve`), a real HTTP request over loopback,
// and a clean shutdown on SIGTERM.
function startAndWaitForUrl(
  cmd: string,
  args: string[],
): Promise<{ child: ChildProcess; url: string; output: () => string }> {
  const child = spawn(cmd, args, {
    env: { ...process.env, PORT: '0', HOST: '127.0.0.1' },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  })
  let out = ''
  child.stdout?.on('data', (d) => {
    out += String(d)
  })
  child.stderr?.on('data', (d) => {
    out += String(d)
  })
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start: ${out}`)), 20_000)
    const check = setInterval(() => {
      const m = out.match(/listening on (http:\/\/127\.0\.0\.1:\d+)/)
      if (m) {
        clearTimeout(timer)
        clearInterval(check)
        resolve({ child, url: m[1], output: () => out })
      }
    }, 50)
  })
}

function exited(child: ChildProcess): Promise<number | null> {
  return new Promise((resolve) => {
    if (child.exitCode !== null) resolve(child.exitCode)
    else child.once('exit', (code) => resolve(code))
  })
}

describe('Node server', () => {
  it('npm start serves the API on loopback, logs each request and stops on SIGTERM', async () => {
    const { child, url, output } = await startAndWaitForUrl('npm', ['start', '--silent'])
    try {
      const res = await fetch(`${url}/v1/air?tdb=40&twb=20`)
      expect(res.status).toBe(200)
      const body = (await res.json()) as { relativeHumidityPct: number }
      expect(Math.abs(body.relativeHumidityPct - 14)).toBeLessThan(0.5)
      await new Promise((r) => setTimeout(r, 100))
      expect(output()).toMatch(/GET \/v1\/air 200/)
    } finally {
      // Signal the whole process group: npm runs tsx, which runs the server.
      process.kill(-(child.pid as number), 'SIGTERM')
    }
    await exited(child)
    expect(output()).toMatch(/SIGTERM received, shutting down/)
  })

  it('dryhours serve does the same', async () => {
    const { child, url, output } = await startAndWaitForUrl('node', [
      'bin/dryhours.mjs',
      'serve',
      '--port',
      '0',
    ])
    const res = await fetch(`${url}/healthz`)
    expect(res.status).toBe(200)
    process.kill(child.pid as number, 'SIGINT')
    const code = await exited(child)
    expect(code).toBe(0)
    expect(output()).toMatch(/SIGINT received/)
  })
})
