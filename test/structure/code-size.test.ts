/**
 * Size limits of DEVELOPERS.md: no function in src/ over {@link MAX_FUNCTION_LINES} lines, no file over
 * {@link MAX_FILE_LINES} (physical lines, measured by `code-size.ts`; `npx tsx test/structure/code-size.ts`
 * lists what is over). Split by concept, not by line count. A function or file still over the limit while
 * another branch tidies it is listed in {@link PENDING} with its current size as a ceiling and who is
 * on it; an entry that is no longer over the limit fails the test, so the list only shrinks.
 */
import { describe, expect, it } from 'vitest'
import { MAX_FILE_LINES, MAX_FUNCTION_LINES, measureText, measureTree } from './code-size.ts'

/** `file` or `file › function name` (as code-size.ts names it), the lines it may not exceed, and why it waits. */
const PENDING: { where: string; upTo: number; why: string }[] = []

describe('code size (DEVELOPERS.md: one concept per file, short functions)', () => {
  const { files, functions } = measureTree('src')
  const over = [
    ...files.filter((f) => f.lines > MAX_FILE_LINES).map((f) => ({ where: f.file, lines: f.lines })),
    ...functions
      .filter((f) => f.lines > MAX_FUNCTION_LINES)
      .map((f) => ({ where: `${f.file} › ${f.name}`, lines: f.lines })),
  ]

  it('measures the tree', () => {
    expect(files.length).toBeGreaterThan(200)
    expect(functions.length).toBeGreaterThan(1000)
  })

  it(`no function over ${MAX_FUNCTION_LINES} lines and no file over ${MAX_FILE_LINES} lines in src/`, () => {
    const pending = new Map(PENDING.map((p) => [p.where, p.upTo]))
    const offending = over
      .filter((o) => !(pending.has(o.where) && o.lines <= pending.get(o.where)!))
      .map((o) => `${o.where}: ${o.lines} lines`)
    expect(offending).toEqual([])
  })

  it('every pending entry is still over its limit (remove the entry once it is not)', () => {
    const stillOver = new Set(over.map((o) => o.where))
    expect(PENDING.filter((p) => !stillOver.has(p.where)).map((p) => p.where)).toEqual([])
  })

  it('counts physical lines, template literals and nested functions included', () => {
    const body = Array.from({ length: 5 }, (_, k) => `  x += ${k}`).join('\n')
    const text = `export function outer(x: number) {\n${body}\n  const s = \`\n\n\n\`\n  const inner = () => {\n    return 1\n  }\n  return s + inner()\n}\n`
    const m = measureText('a.ts', text)
    expect(m.file.lines).toBe(text.split('\n').length - 1)
    const outer = m.functions.find((f) => f.name === 'outer')
    expect(outer?.lines).toBe(text.split('\n').length - 1)
    expect(m.functions.find((f) => f.name === 'outer › inner')?.lines).toBe(3)
  })
})
