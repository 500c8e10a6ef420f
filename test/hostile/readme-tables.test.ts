/**
 * The README's limits table and exit-status table are true: every limit the server has is in the table with
 * its default, and every example of the exit-status table exits with its status (run as a user would).
 */
import { spawn } from 'node:child_process'
import { mkdtempSync, readFileSync, symlinkSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { describe, expect, it } from 'vitest'
import { CONFIG_VARIABLES, DEFAULT_API_CONFIG, limitsTable } from '../../src/api/config.ts'
import { NODE_TIME_BUDGET_MS, QUEUE_PER_THREAD } from '../../src/node/settings.ts'

const readme = readFileSync('README.md', 'utf8')

/** Rows of the first markdown table after `marker`, as cells. */
function tableAfter(marker: string): string[][] {
  const start = readme.indexOf(marker)
  expect(start).toBeGreaterThan(-1)
  const lines = readme.slice(start).split('\n')
  const first = lines.findIndex((l) => l.startsWith('|'))
  const rows: string[][] = []
  for (const line of lines.slice(first + 2)) {
    if (!line.startsWith('|')) break
    rows.push(
      line
        .slice(1, -1)
        .split(' | ')
        .map((c) => c.trim()),
    )
  }
  return rows
}

describe('README limits table', () => {
  const rows = tableAfter('### Limits')
  const byVariable = new Map(rows.map((r) => [/`(DRYHOURS_[A-Z_]+)`/.exec(r[0])?.[1] ?? '', r]))

  it('lists every setting of the server, and no other', () => {
    const variables = [
      ...Object.values(CONFIG_VARIABLES),
      ...limitsTable({ ...DEFAULT_API_CONFIG, pool: { threads: 1, queue: 1, heapMb: 1 } }).map(
        (l) => l.variable,
      ),
    ]
    expect([...byVariable.keys()].sort()).toEqual([...new Set(variables)].sort())
  })

  it('gives the defaults the code uses', () => {
    const d = DEFAULT_API_CONFIG
    const n = (x: number) => x.toLocaleString('en')
    expect(byVariable.get('DRYHOURS_MAX_BODY_BYTES')?.[1]).toBe(`${d.maxBodyBytes / 1024 / 1024} MiB`)
    expect(byVariable.get('DRYHOURS_MAX_ROWS')?.[1]).toBe(n(d.maxRows))
    expect(byVariable.get('DRYHOURS_MAX_COLUMNS')?.[1]).toBe(n(d.maxColumns))
    expect(byVariable.get('DRYHOURS_MAX_LOG_ROWS')?.[1]).toBe(n(d.maxLogRows))
    expect(byVariable.get('DRYHOURS_MAX_WEIGHINGS')?.[1]).toBe(n(d.maxWeighings))
    expect(byVariable.get('DRYHOURS_MAX_SITES')?.[1]).toBe(n(d.maxSites))
    expect(byVariable.get('DRYHOURS_MAX_BATCH_HOURS')?.[1]).toBe(n(d.maxBatchHours))
    expect(byVariable.get('DRYHOURS_TIME_BUDGET_MS')?.[1]).toBe(n(NODE_TIME_BUDGET_MS))
    expect(byVariable.get('DRYHOURS_WORKERS')?.[1]).toBe('one per core')
    expect(byVariable.get('DRYHOURS_QUEUE')?.[1]).toBe(`${QUEUE_PER_THREAD} per thread`)
    expect(byVariable.get('DRYHOURS_WORKER_HEAP_MB')?.[1]).toBe(
      "the JavaScript engine's default for the machine",
    )
  })

  it('gives the status the server answers above each limit', () => {
    for (const l of limitsTable({ ...DEFAULT_API_CONFIG, pool: { threads: 1, queue: 1, heapMb: 1 } })) {
      const status = /^\d{3}/.exec(l.answer)?.[0]
      if (status) expect(byVariable.get(l.variable)?.[2]).toMatch(new RegExp(`^${status}`))
    }
  })
})

function run(command: string, cwd: string): Promise<{ code: number | null; err: string }> {
  const args = command.replace(/^dryhours /, '').split(' ')
  return new Promise((resolve) => {
    const child = spawn('node', [`${process.cwd()}/bin/dryhours.mjs`, ...args], {
      cwd,
      stdio: ['ignore', 'ignore', 'pipe'],
    })
    let err = ''
    child.stderr.on('data', (d) => {
      err += String(d)
    })
    child.on('exit', (code) => resolve({ code, err }))
  })
}

describe('README exit-status table', () => {
  const rows = tableAfter('Every command has `--help`. Exit status:')

  it('has the statuses 0, 2 and 1', () => {
    expect(rows.map((r) => r[0])).toEqual(['0', '2', '1'])
  })

  it('every example exits with its status; a status 2 prints one line', async () => {
    // run from a copy of the paths the examples name, so `no-such-folder` really is missing
    const cwd = mkdtempSync(`${tmpdir()}/dryhours-readme-`)
    symlinkSync(`${process.cwd()}/climate-demo`, `${cwd}/climate-demo`)
    let examples = 0
    for (const [status, , example] of rows) {
      for (const m of example.matchAll(/`(dryhours [^`]+)`/g)) {
        const r = await run(m[1], cwd)
        expect(r.code, m[1]).toBe(Number(status))
        if (status === '2') expect(r.err.trimEnd().split('\n'), m[1]).toHaveLength(1)
        examples++
      }
    }
    expect(examples).toBeGreaterThanOrEqual(4)
  })
})
