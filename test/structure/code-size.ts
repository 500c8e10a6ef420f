/**
 * Sizes of the source: every function (declarations, expressions, arrows, methods) and every file in src/,
 * measured in physical lines (first to last line of the function node, nested functions included; a file's
 * line count as `wc -l` gives it). Parsed with the TypeScript-aware ESTree parser that the test runner's
 * bundler ships (rolldown's `parseAst`, oxc), so the count does not depend on how a body is written (a line
 * inside a template literal counts like any other).
 *
 * `npx tsx test/structure/code-size.ts [limitFunctionLines] [limitFileLines]` prints what is over the limits;
 * `code-size.test.ts` fails on anything over them.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { parseAst } from 'rolldown/parseAst'

/** Limits of DEVELOPERS.md [lines], checked by code-size.test.ts. */
export const MAX_FUNCTION_LINES = 120
export const MAX_FILE_LINES = 400

export interface FunctionSize {
  file: string
  /** `outer › inner` for a nested function, `<arrow>` where it has no name of its own. */
  name: string
  line: number
  lines: number
}

export interface FileSize {
  file: string
  lines: number
}

export function sourceFiles(dir = 'src'): string[] {
  const out: string[] = []
  for (const name of readdirSync(dir).sort()) {
    const path = join(dir, name)
    if (statSync(path).isDirectory()) out.push(...sourceFiles(path))
    else if (name.endsWith('.ts') && !name.endsWith('.d.ts')) out.push(path)
  }
  return out
}

function lineStarts(text: string): number[] {
  const starts = [0]
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1)
  return starts
}

function lineOf(starts: number[], offset: number): number {
  let lo = 0
  let hi = starts.length - 1
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1
    if (starts[mid] <= offset) lo = mid
    else hi = mid - 1
  }
  return lo + 1
}

type Node = { type: string; start: number; end: number; [key: string]: unknown }

const isNode = (v: unknown): v is Node =>
  typeof v === 'object' && v !== null && typeof (v as Node).type === 'string'

const FUNCTION_TYPES = new Set(['FunctionDeclaration', 'FunctionExpression', 'ArrowFunctionExpression'])

function keyName(key: unknown): string | undefined {
  if (!isNode(key)) return undefined
  if (key.type === 'Identifier' || key.type === 'PrivateIdentifier') return String(key.name)
  if (key.type === 'Literal') return String(key.value)
  return undefined
}

/** The name a function is known by: its own, or that of the variable, property or method holding it. */
function functionName(node: Node, parent: Node | undefined): string {
  const own = keyName(node.id)
  if (own) return own
  if (parent?.type === 'VariableDeclarator') return keyName(parent.id) ?? '<function>'
  if (
    parent?.type === 'MethodDefinition' ||
    parent?.type === 'Property' ||
    parent?.type === 'PropertyDefinition'
  )
    return keyName(parent.key) ?? '<method>'
  if (
    parent?.type === 'AssignmentExpression' &&
    isNode(parent.left) &&
    parent.left.type === 'MemberExpression'
  )
    return keyName(parent.left.property) ?? '<function>'
  return node.type === 'ArrowFunctionExpression' ? '<arrow>' : '<function>'
}

export function measureText(file: string, text: string): { file: FileSize; functions: FunctionSize[] } {
  const starts = lineStarts(text)
  const lines = text.endsWith('\n') ? starts.length - 1 : starts.length
  const functions: FunctionSize[] = []
  const visit = (node: Node, parent: Node | undefined, path: string[]) => {
    let inner = path
    if (FUNCTION_TYPES.has(node.type)) {
      const name = [...path, functionName(node, parent)].join(' › ')
      const line = lineOf(starts, node.start)
      functions.push({
        file,
        name,
        line,
        lines: lineOf(starts, Math.max(node.start, node.end - 1)) - line + 1,
      })
      inner = [...path, functionName(node, parent)]
    }
    for (const value of Object.values(node)) {
      if (Array.isArray(value)) {
        for (const v of value) if (isNode(v)) visit(v, node, inner)
      } else if (isNode(value)) visit(value, node, inner)
    }
  }
  visit(parseAst(text, { lang: 'ts' }, file) as unknown as Node, undefined, [])
  return { file: { file, lines }, functions }
}

export function measureTree(dir = 'src'): { files: FileSize[]; functions: FunctionSize[] } {
  const files: FileSize[] = []
  const functions: FunctionSize[] = []
  for (const path of sourceFiles(dir)) {
    const m = measureText(path.split('\\').join('/'), readFileSync(path, 'utf8'))
    files.push(m.file)
    functions.push(...m.functions)
  }
  return { files, functions }
}

if (process.argv[1]?.endsWith('code-size.ts')) {
  const maxFunction = Number(process.argv[2] ?? MAX_FUNCTION_LINES)
  const maxFile = Number(process.argv[3] ?? MAX_FILE_LINES)
  const { files, functions } = measureTree()
  for (const f of files.filter((f) => f.lines > maxFile).sort((a, b) => b.lines - a.lines))
    console.log(`file      ${String(f.lines).padStart(5)}  ${f.file}`)
  for (const f of functions.filter((f) => f.lines > maxFunction).sort((a, b) => b.lines - a.lines))
    console.log(`function  ${String(f.lines).padStart(5)}  ${f.file}:${f.line}  ${f.name}`)
}
