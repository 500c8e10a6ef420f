/**
 * The README is a contract: every command in its ```sh code blocks runs here, in README order, so no
 * documented command can drift. `npx dryhours …` lines run in-process through the CLI (with the Node
 * entry's file access), `curl …` lines against the app (`app.request`, no server). Files a command writes
 * (`--out`, `--out-dir`, `--export`, `--save`, curl's `-o`) go to a temporary folder, where later commands
 * also read them (the README's fit saves a profile that the next assess uses). Some commands have a
 * further check of what they print (below, by pattern). `npm` lines are npm's own (CI runs them).
 * The README's tables are checked where their subject is tested (options: test/cli/readme-weather.test.ts;
 * layouts: test/weather/readme-layouts.test.ts; limits and exit status: test/hostile/readme-tables.test.ts).
 */
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { basename, isAbsolute, join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { nodeIo } from '../../src/node/cli.ts'
import { DIALECTS } from '../../src/weather/dialects/index.ts'
import { HOURLY_EXPORT_HEADER } from '../../src/weather/export.ts'

const readme = readFileSync('README.md', 'utf8')

/** Every line of every ```sh block, with its section heading; a trailing backslash joins lines. */
function readmeCommands(text: string): { line: string; section: string }[] {
  const out: { line: string; section: string }[] = []
  let section = ''
  let inBlock = false
  let pending = ''
  for (const raw of text.split('\n')) {
    if (!inBlock && raw.startsWith('#')) section = raw.replace(/^#+\s*/, '')
    if (raw.startsWith('```')) {
      inBlock = !inBlock && raw.trim() === '```sh'
      continue
    }
    if (!inBlock || raw.trim() === '' || raw.trim().startsWith('#')) continue
    const line = pending + raw.trim()
    if (line.endsWith('\\')) pending = `${line.slice(0, -1).trim()} `
    else {
      out.push({ line, section })
      pending = ''
    }
  }
  return out
}

/** Split a command line into words, honouring single and double quotes. */
function words(line: string): string[] {
  const out: string[] = []
  let cur = ''
  let quote: string | null = null
  let inWord = false
  for (const ch of line) {
    if (quote !== null) {
      if (ch === quote) quote = null
      else cur += ch
    } else if (ch === "'" || ch === '"') {
      quote = ch
      inWord = true
    } else if (ch === ' ') {
      if (inWord) out.push(cur)
      cur = ''
      inWord = false
    } else {
      cur += ch
      inWord = true
    }
  }
  if (quote !== null) throw new Error(`unbalanced quote in README command: ${line}`)
  if (inWord) out.push(cur)
  return out
}

const commands = readmeCommands(readme)

/**
 * Commands written in the README's prose as inline code (`dryhours products figs`): those with arguments and without a
 * placeholder (`<file>`, `[…]`, `a|b`, `…`). Table rows are left to the test of their table
 * (test/hostile/readme-tables.test.ts: the exit-status examples).
 */
function inlineCommands(text: string): string[] {
  const out: string[] = []
  for (const line of text.split('\n')) {
    if (line.startsWith('|')) continue
    for (const m of line.matchAll(/`(dryhours [a-z-]+ [^`]+)`/g)) {
      if (!/[<>[\]|…]/.test(m[1])) out.push(m[1])
    }
  }
  return out
}
const inline = inlineCommands(readme)
const temp = mkdtempSync(join(tmpdir(), 'dryhours-readme-'))
afterAll(() => rmSync(temp, { recursive: true, force: true }))

/** A path as the README means it: written files live in the temporary folder, the rest in the repository. */
function place(path: string, writing: boolean): string {
  if (isAbsolute(path)) return path
  const inTemp = join(temp, path)
  return writing || existsSync(inTemp) ? inTemp : path
}

function cliIo() {
  const out: string[] = []
  const err: string[] = []
  const written: string[] = []
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: (p) => nodeIo.readFile(place(p, false)),
    writeFile: (p, d, o) => {
      written.push(p)
      return nodeIo.writeFile(place(p, true), d, o)
    },
    exists: (p) => nodeIo.exists?.(place(p, true)) ?? Promise.resolve(false),
    makeDir: (p) => nodeIo.makeDir?.(place(p, true)) ?? Promise.resolve(),
  }
  return { io, out: () => out.join(''), err: () => err.join(''), written }
}

const app = createApp()

/** A README curl line as a request to the app; `-o` names the file the answer is written to. */
function curlRequest(line: string): { url: string; init: RequestInit; outFile?: string } {
  const w = words(line).slice(1)
  let method = 'GET'
  let url = ''
  let outFile: string | undefined
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
    } else if (a === '--data-binary') body = readFileSync(place(w[++i].replace(/^@/, ''), false))
    else if (a === '-F') {
      form ??= new FormData()
      const spec = w[++i]
      const eq = spec.indexOf('=')
      const value = spec.slice(eq + 1)
      if (value.startsWith('@'))
        form.append(
          spec.slice(0, eq),
          new Blob([readFileSync(place(value.slice(1), false))]),
          basename(value.slice(1)),
        )
      else form.append(spec.slice(0, eq), value)
      method = 'POST'
    } else if (a === '-o') outFile = w[++i]
    else if (a.startsWith('http://127.0.0.1:8787')) url = a.slice('http://127.0.0.1:8787'.length)
    else throw new Error(`README curl line uses an option this test does not know: ${a}`)
  }
  return { url, init: { method, headers, body: form ?? body }, outFile }
}

type Ran = { out: string; err: string; args: string[]; written: string[] }

/** Further checks of what some commands print or write (by a pattern of the command line). */
const CHECKS: { pattern: RegExp; check: (r: Ran) => void }[] = [
  {
    pattern: / --export /,
    check: (r) => {
      const file = r.args[r.args.indexOf('--export') + 1]
      expect(readFileSync(place(file, false), 'utf8').split('\n')[0]).toBe(HOURLY_EXPORT_HEADER)
    },
  },
  {
    // the layouts' examples: the layout the command shows is named
    pattern: /^npx dryhours inspect test\/fixtures\/weather\/dialects\//,
    check: (r) => {
      const file = r.args[1]
      const id =
        DIALECTS.find((d) => file.includes(d.id))?.id ??
        DIALECTS.find((d) => file.includes(d.id.split('-')[0]))?.id
      if (id === undefined) return
      if (r.args.includes('--json')) expect(JSON.parse(r.out).dialect.id).toBe(id)
      else expect(r.out).toMatch(new RegExp(`dialect\\s+.*\\(${id}\\)`))
    },
  },
  {
    pattern: /energy-chart .*tessaby-wheat-2026\.csv/,
    check: (r) => {
      const [first, second] = r.out.split('\n')
      expect(first).toMatch(
        /^Answer: the dryer uses more energy per kg of water than expected from batch W26-029 /,
      )
      expect(first).toMatch(/on the physics-normalised view/)
      expect(second).toMatch(/monitored batches ran in weather the baseline never saw/)
    },
  },
  {
    pattern: /--method open-air,solar-cabinet,heated/,
    check: (r) => {
      expect(r.out).toMatch(
        /^Recommendation: .*\n {2}criterion: the lowest fuel cost per kg of dried product/m,
      )
      expect(r.out).toContain('Season calendar')
      expect(r.out).toContain('EUR')
    },
  },
  {
    pattern: /^npx dryhours compare --sites/,
    check: (r) => {
      expect(r.out).toMatch(/^ties: sites equal on /m)
      for (const site of ['Ardentine Ridge', 'Quillow Landing', 'Gullhaven Point', 'Tamarel Estate'])
        expect(r.out).toContain(site)
    },
  },
  {
    pattern: / --out-dir /,
    check: (r) => {
      const dir = r.args[r.args.indexOf('--out-dir') + 1]
      const index = readFileSync(place(join(dir, 'index.html'), false), 'utf8')
      for (const farm of ['ardentine-ridge', 'quillow-landing', 'gullhaven-point', 'tamarel-estate']) {
        expect(index).toContain(`href="${farm}.html"`)
        expect(existsSync(place(join(dir, `${farm}.html`), false))).toBe(true)
      }
    },
  },
  {
    pattern: / --format html --out summary\.html/,
    check: () => expect(readFileSync(place('summary.html', false), 'utf8')).toMatch(/^<!doctype html>/),
  },
]

/** npm's own commands: not run here (CI runs them; `npm test` would run this test again). */
const NOT_RUN = /^npm (ci|test|start|run [a-z:]+)$/

describe('README: every command of its code blocks runs', () => {
  it('has commands for the CLI, the API and every public route', () => {
    expect(commands.filter((c) => c.line.startsWith('npx dryhours ')).length).toBeGreaterThanOrEqual(15)
    const curls = commands.filter((c) => c.line.startsWith('curl '))
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
        curls.some((c) => c.line.includes(`8787${path}`)),
        path,
      ).toBe(true)
    }
  })

  it('knows how to run every line (nothing is skipped silently)', () => {
    for (const { line } of commands) {
      expect(
        line.startsWith('npx dryhours ') || line.startsWith('curl ') || NOT_RUN.test(line),
        `README command of an unknown kind: ${line}`,
      ).toBe(true)
    }
  })

  it('has fenced code only as sh blocks, so no command is left out of the run below', () => {
    const fences = readme.split('\n').filter((l) => l.startsWith('```') && l.trim() !== '```')
    expect(fences.filter((l) => l.trim() !== '```sh')).toEqual([])
  })

  it.each(inline.map((c) => [c]))('in the text: %s', async (line) => {
    const f = cliIo()
    expect(await runCli(words(line).slice(1), f.io), f.err()).toBe(0)
    expect(f.out().length).toBeGreaterThan(10)
  })

  // in README order, one after the other: a later command may read what an earlier one wrote
  it.each(
    commands
      .filter((c) => !NOT_RUN.test(c.line))
      .map((c) => [`${c.section}: ${c.line.slice(0, 120)}`, c.line]),
  )('%s', async (_name, line) => {
    if (line.startsWith('curl ')) {
      const { url, init, outFile } = curlRequest(line)
      const res = await app.request(url, init)
      const text = await res.text()
      expect(res.status, text.slice(0, 300)).toBe(200)
      expect(text.length).toBeGreaterThan(10)
      if (outFile) await nodeIo.writeFile(place(outFile, true), text, { overwrite: true })
      return
    }
    const args = words(line).slice(2)
    const f = cliIo()
    expect(await runCli(args, f.io), f.err()).toBe(0)
    const ran: Ran = { out: f.out(), err: f.err(), args, written: f.written }
    for (const c of CHECKS) if (c.pattern.test(line)) c.check(ran)
  })
})
