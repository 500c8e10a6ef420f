import { readFileSync } from 'node:fs'
import { basename } from 'node:path'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'

// Every curl line of the README's "HTTP API" section, run against the app (no server) so the README stays true.
const readme = readFileSync('README.md', 'utf8')
const section = readme.slice(readme.indexOf('## HTTP API'))
const lines = section.split('\n').filter((l) => l.startsWith('curl '))

/** Split a command line into words, honouring single quotes (all the README uses). */
function words(line: string): string[] {
  const out: string[] = []
  let cur = ''
  let quoted = false
  let inWord = false
  for (const ch of line) {
    if (ch === "'") {
      quoted = !quoted
      inWord = true
    } else if (ch === ' ' && !quoted) {
      if (inWord) out.push(cur)
      cur = ''
      inWord = false
    } else {
      cur += ch
      inWord = true
    }
  }
  if (inWord) out.push(cur)
  return out
}

function toRequest(line: string): { url: string; init: RequestInit } {
  const w = words(line).slice(1)
  let method = 'GET'
  let url = ''
  const headers: Record<string, string> = {}
  let body: BodyInit | undefined
  let form: FormData | undefined
  for (let i = 0; i < w.length; i++) {
    const a = w[i]
    if (a === '-s') continue
    if (a === '-X') method = w[++i]
    else if (a === '-H') {
      const [k, v] = w[++i].split(/:\s*/, 2)
      headers[k.toLowerCase()] = v
    } else if (a === '--data-binary') body = readFileSync(w[++i].replace(/^@/, ''))
    else if (a === '-F') {
      form ??= new FormData()
      const spec = w[++i]
      const eq = spec.indexOf('=')
      const name = spec.slice(0, eq)
      const value = spec.slice(eq + 1)
      if (value.startsWith('@'))
        form.append(name, new Blob([readFileSync(value.slice(1))]), basename(value.slice(1)))
      else form.append(name, value)
      method = 'POST'
    } else if (a === '-o') i++
    else if (a.startsWith('http')) url = a.replace('http://127.0.0.1:8787', '')
    else throw new Error(`README curl line uses an option this test does not know: ${a}`)
  }
  return { url, init: { method, headers, body: form ?? body } }
}

const app = createApp()

describe('README curl examples', () => {
  it('the README shows an example for every public route', () => {
    for (const path of [
      '/healthz',
      '/v1/air',
      '/v1/products',
      '/v1/equilibrium',
      '/v1/inspect',
      '/v1/fit',
      '/v1/assess',
      '/v1/compare',
      '/v1/energy-chart',
    ]) {
      expect(
        lines.some((l) => l.includes(`8787${path}`)),
        path,
      ).toBe(true)
    }
  })
  it.each(lines.map((l) => [l.slice(0, 110), l]))('%s', async (_name, line) => {
    const { url, init } = toRequest(line)
    const res = await app.request(url, init)
    const text = await res.text()
    expect(res.status, text.slice(0, 300)).toBe(200)
    expect(text.length).toBeGreaterThan(10)
  })
})
