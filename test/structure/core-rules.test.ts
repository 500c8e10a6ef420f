/**
 * Rules of the core (src/ except the Node entry points in src/node/ and the CLI in src/cli/), checked on
 * the source text so that DEVELOPERS.md stays true:
 * - no `**` with an exponent other than a whole-number literal, and no Math.pow: real powers go through
 *   physics/power.ts (exp/log), so Node and Workers give the same bits;
 * - no `node:` imports.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'

function coreFiles(dir = 'src'): string[] {
  const out: string[] = []
  for (const name of readdirSync(dir)) {
    const path = join(dir, name)
    if (statSync(path).isDirectory()) {
      if (path !== join('src', 'node') && path !== join('src', 'cli')) out.push(...coreFiles(path))
    } else if (name.endsWith('.ts')) out.push(path)
  }
  return out
}

/** The code of a TypeScript file with comments, strings and template literals blanked (line breaks kept). */
function codeOnly(text: string): string {
  let out = ''
  let i = 0
  const blank = (s: string) => s.replace(/[^\n]/g, ' ')
  while (i < text.length) {
    const c = text[i]
    const next = text[i + 1]
    let end = -1
    if (c === '/' && next === '/') end = text.indexOf('\n', i) === -1 ? text.length : text.indexOf('\n', i)
    else if (c === '/' && next === '*') end = text.indexOf('*/', i + 2) + 2
    else if (c === "'" || c === '"' || c === '`') {
      let j = i + 1
      while (j < text.length && text[j] !== c) j += text[j] === '\\' ? 2 : 1
      end = j + 1
    }
    if (end > i) {
      out += blank(text.slice(i, end))
      i = end
    } else {
      out += c
      i++
    }
  }
  return out
}

describe('core rules (DEVELOPERS.md)', () => {
  const files = coreFiles()
  it('finds the core files', () => {
    expect(files.length).toBeGreaterThan(100)
    expect(files).toContain(join('src', 'physics', 'power.ts'))
  })
  it('no non-integer ** and no Math.pow in the core (use physics/power.ts)', () => {
    const found: string[] = []
    for (const f of files) {
      const lines = codeOnly(readFileSync(f, 'utf8')).split('\n')
      lines.forEach((line, k) => {
        if (/\bMath\s*\.\s*pow\b/.test(line)) found.push(`${f}:${k + 1}: Math.pow`)
        for (const m of line.matchAll(/\*\*=?\s*(\S+)/g)) {
          if (!/^\d+\b(?![.eE])/.test(m[1])) found.push(`${f}:${k + 1}: ${line.trim()}`)
        }
      })
    }
    expect(found).toEqual([])
  })
  it('the check sees through comments and strings, and catches a real power', () => {
    expect(codeOnly("const a = 2 ** 0.5 // x ** y\nconst s = 'b ** c'")).toMatch(/\*\* 0\.5/)
    expect(codeOnly("const s = 'b ** c' /* d ** e */")).not.toMatch(/\*\*/)
  })
  it('the CLI imports no entry point (src/node/): it gets the server through CliIo', () => {
    const cli = readdirSync(join('src', 'cli'), { recursive: true })
      .map(String)
      .filter((f) => f.endsWith('.ts'))
      .map((f) => join('src', 'cli', f))
    expect(cli.length).toBeGreaterThan(5)
    expect(cli.filter((f) => /from\s+['"][./]*\/node\//.test(readFileSync(f, 'utf8')))).toEqual([])
  })
  it('no node: imports in the core', () => {
    const found = files.filter((f) => /from\s+['"]node:/.test(readFileSync(f, 'utf8')))
    expect(found).toEqual([])
  })
})

/**
 * Files that still write an hour or day length of their own while another branch works on them (the
 * entry goes once they take it from physics/constants.ts; the test fails while it stays needlessly).
 */
const OWN_TIME_UNITS_PENDING: { file: string; why: string }[] = [
  { file: 'src/product/diffusion.ts', why: 'product kinetics in progress (branches engine15, calib15)' },
  { file: 'src/product/fit-weighings.ts', why: 'product kinetics in progress (branches engine15, calib15)' },
  { file: 'src/product/weighing-columns.ts', why: 'weighings in progress (branches engine15, calib15)' },
]

describe('time units have one home (physics/constants.ts)', () => {
  /** An hour or a day in seconds or milliseconds written as a number, or a local constant for one. */
  const TIME_UNIT =
    /\b(?:3_?600(?:_?000)?|1_?800_?000|86_?400(?:_?000)?)\b(?![.eE]\d)|\bconst\s+(?:MS|S)_PER_(?:HOUR|DAY|MINUTE)\b|\bconst\s+(?:HOUR|DAY)_MS\b/
  const all = (dir: string): string[] =>
    readdirSync(dir).flatMap((name) => {
      const path = join(dir, name)
      return statSync(path).isDirectory() ? all(path) : name.endsWith('.ts') ? [path] : []
    })
  const home = join('src', 'physics', 'constants.ts')
  const found = new Map<string, string[]>()
  for (const f of all('src')) {
    if (f === home) continue
    codeOnly(readFileSync(f, 'utf8'))
      .split('\n')
      .forEach((line, k) => {
        if (TIME_UNIT.test(line)) found.set(f, [...(found.get(f) ?? []), `${k + 1}: ${line.trim()}`])
      })
  }
  const pending = new Set(OWN_TIME_UNITS_PENDING.map((p) => p.file))
  it('no file but physics/constants.ts writes the length of an hour or a day', () => {
    expect(
      [...found].filter(([f]) => !pending.has(f)).map(([f, lines]) => `${f}:${lines.join(' | ')}`),
    ).toEqual([])
  })
  it('every pending entry still writes one (remove the entry once it does not)', () => {
    expect(OWN_TIME_UNITS_PENDING.filter((p) => !found.has(p.file)).map((p) => p.file)).toEqual([])
  })
  it('the pattern finds what it should and nothing else', () => {
    for (const hit of ['t + 3_600_000', 'x / 3600', 'const MS_PER_HOUR = 1', 'const HOUR_MS = 2', '86400000'])
      expect(TIME_UNIT.test(hit)).toBe(true)
    for (const miss of ['36000', '1440', '3600.5', 'MS_PER_HOUR * 2', '60_000'])
      expect(TIME_UNIT.test(miss)).toBe(false)
  })
})

describe('sources cited in src/ can be followed', () => {
  it('every .md file that a source file names is in this repository; no notes outside it are cited', () => {
    const found: string[] = []
    const all = (dir: string): string[] =>
      readdirSync(dir).flatMap((name) => {
        const path = join(dir, name)
        return statSync(path).isDirectory() ? all(path) : name.endsWith('.ts') ? [path] : []
      })
    for (const f of all('src')) {
      // comments and strings only (a property such as `this.md` is code, not a citation)
      const original = readFileSync(f, 'utf8')
      const code = codeOnly(original)
      let text = ''
      for (let i = 0; i < original.length; i++)
        text += code[i] === original[i] ? (original[i] === '\n' ? '\n' : ' ') : original[i]
      for (const m of text.matchAll(/[\w./-]*\b[\w-]+\.md\b/g)) {
        const path = m[0].replace(/^\.\.?\//, '')
        if (!existsSync(path)) found.push(`${f}: ${m[0]}`)
      }
      for (const m of text.matchAll(/shared\/references|reference §\d|references\/[\w-]+/g))
        found.push(`${f}: ${m[0]}`)
    }
    expect(found).toEqual([])
  })
})
