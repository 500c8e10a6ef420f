/**
 * Benchmark runner: `npm run bench` (tsx bench/run.ts [section-id …]).
 * Runs every section listed in {@link sections} (or only the ids given on the command line), prints
 * one table per section and writes every figure, with a description of the machine, to
 * bench/latest.json (with ids given, the other sections' figures of the previous run are kept). Timings are not tests: they depend on the machine and its load.
 *
 * To add a section: write `bench/sections/<id>.ts` exporting `section: BenchSection` (see
 * bench/section.ts) and add one line to the array below.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs'
import { cpus, platform, release, totalmem, type } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { BenchFigure, BenchSection } from './section.ts'

/** Every section, in run order. Each entry loads its module lazily. */
const sections: Array<() => Promise<{ section: BenchSection }>> = [
  () => import('./sections/moist-air.ts'),
  () => import('./sections/ingest.ts'),
  () => import('./sections/ingest-10min.ts'),
  () => import('./sections/engine.ts'),
  () => import('./sections/hostile.ts'),
  () => import('./sections/bins.ts'),
  () => import('./sections/energy-detection.ts'),
]

function formatValue(f: BenchFigure): string {
  const v = f.value
  if (!Number.isFinite(v)) return String(v)
  const a = Math.abs(v)
  if (a !== 0 && (a < 1e-3 || a >= 1e7)) return v.toExponential(3)
  if (Number.isInteger(v)) return v.toLocaleString('en-US')
  return v.toPrecision(4)
}

function printTable(section: BenchSection, figures: BenchFigure[], seconds: number): void {
  const rows = figures.map((f) => [f.name, formatValue(f), f.unit, f.note ?? ''])
  const widths = [0, 1, 2].map((c) => Math.max(...rows.map((r) => r[c].length)))
  console.log(`\n${section.id}: ${section.title} (${seconds.toFixed(1)} s)`)
  for (const r of rows) {
    console.log(`  ${r[0].padEnd(widths[0])}  ${r[1].padStart(widths[1])} ${r[2].padEnd(widths[2])}  ${r[3]}`)
  }
}

function machine() {
  const list = cpus()
  return {
    os: `${type()} ${release()} (${platform()})`,
    cpuModel: list[0]?.model ?? 'unknown',
    cores: list.length,
    memoryGb: Math.round(totalmem() / 2 ** 30),
    node: process.version,
  }
}

/** The headline figures of every section, gathered into one table at the end (name prefixes as printed). */
const HEADLINES: { section: string; figure: string; label: string; target: string }[] = [
  {
    section: 'moist-air',
    figure: 'ratio by CPU time',
    label: 'moist-air column form / psychrolib (CPU time)',
    target: '≥ 20 x',
  },
  {
    section: 'moist-air',
    figure: 'ratio column / psychrolib',
    label: 'moist-air column form / psychrolib (wall clock)',
    target: '≥ 20 x',
  },
  {
    section: 'ingest',
    figure: 'end-to-end / bare parse throughput',
    label: '30-year CSV ingest / bare papaparse',
    target: '≥ 1.0 x',
  },
  {
    section: 'ingest-10min',
    figure: '30-year 10-minute file read',
    label: '30-year 10-minute file read',
    target: '< 10 s',
  },
  {
    section: 'ingest-10min',
    figure: '10-minute read / bare parse throughput',
    label: '30-year 10-minute read / streaming papaparse',
    target: 'reported',
  },
  {
    section: 'ingest',
    figure: 'peak RSS after all runs',
    label: 'peak memory of the ingest runs',
    target: 'reported',
  },
  {
    section: 'engine',
    figure: '30-year assessment (',
    label: '30-year assessment with a 90-day start-date table',
    target: '< 500 ms',
  },
  {
    section: 'engine',
    figure: '30-year assessment, CPU time',
    label: '30-year assessment, CPU time',
    target: '< 500 ms',
  },
  {
    section: 'engine',
    figure: 'first assessment in this process',
    label: '30-year assessment, first in a fresh process',
    target: 'reported',
  },
  {
    section: 'engine',
    figure: 'engine / moist-air throughput',
    label: 'per-hour engine / moist-air columns',
    target: 'reported',
  },
  { section: 'engine', figure: 'per-hour engine', label: 'per-hour engine throughput', target: 'reported' },
  {
    section: 'bins',
    figure: 'ratio fast / reference by CPU time',
    label: 'bin model fast form / reference implementation (CPU time)',
    target: '≥ 20 x',
  },
  {
    section: 'bins',
    figure: 'fast model runs per second',
    label: 'bin runs per second (40 days, 20 layers, CPU time)',
    target: 'reported',
  },
  {
    section: 'bins',
    figure: 'assessment runs per second',
    label: 'bin assessment runs per second (CPU time)',
    target: 'reported',
  },
  {
    section: 'energy-detection',
    figure: '7 % step, 10 logs: answer found within 3 batches',
    label: 'energy answer: 7 % step found within 3 batches (10 logs)',
    target: '≥ 8 of 10',
  },
  {
    section: 'energy-detection',
    figure: '7 % step, 10 logs: answer false alarms before the step',
    label: 'energy answer: logs with a false alarm before the step (10 logs)',
    target: '≤ 1 of 10',
  },
  {
    section: 'energy-detection',
    figure: '7 % step, 10 logs: regression-rules found within 3 batches',
    label: 'regression chart before this change: 7 % step within 3 batches (10 logs)',
    target: 'reported',
  },
  {
    section: 'energy-detection',
    figure: '7 % step, 10 logs: regression-rules false alarms before the step',
    label: 'regression chart before this change: false alarms before the step (10 logs)',
    target: 'reported',
  },
  {
    section: 'engine',
    figure: 'resident set size after',
    label: 'memory after the assessments',
    target: 'reported',
  },
]

function printSummary(sections: Record<string, { figures: BenchFigure[] }>): void {
  const rows: string[][] = []
  for (const h of HEADLINES) {
    const f = sections[h.section]?.figures.find((x) => x.name.startsWith(h.figure))
    if (f) rows.push([h.label, `${formatValue(f)} ${f.unit}`.trim(), h.target])
  }
  if (rows.length === 0) return
  const w = [0, 1].map((c) => Math.max(...rows.map((r) => r[c].length)))
  console.log('\nsummary (each ratio against its reference measured in the same run)')
  for (const r of rows) console.log(`  ${r[0].padEnd(w[0])}  ${r[1].padStart(w[1])}   target ${r[2]}`)
}

async function main(wanted: string[]): Promise<number> {
  const result: {
    date: string
    machine: ReturnType<typeof machine>
    sections: Record<string, { title: string; date: string; seconds: number; figures: BenchFigure[] }>
  } = { date: new Date().toISOString(), machine: machine(), sections: {} }
  const out = join(dirname(fileURLToPath(import.meta.url)), 'latest.json')
  if (wanted.length > 0 && existsSync(out)) {
    // Running some sections only: keep the other sections' figures from the previous run (each
    // section carries its own date).
    try {
      result.sections = JSON.parse(readFileSync(out, 'utf8')).sections ?? {}
    } catch {
      result.sections = {}
    }
  }
  const m = result.machine
  console.log(`dryhours benchmark, ${m.os}, ${m.cpuModel} × ${m.cores}, Node ${m.node}`)
  let failures = 0
  for (const load of sections) {
    const { section } = await load()
    if (wanted.length > 0 && !wanted.includes(section.id)) continue
    const t0 = performance.now()
    try {
      const figures = await section.run()
      const seconds = (performance.now() - t0) / 1000
      printTable(section, figures, seconds)
      result.sections[section.id] = { title: section.title, date: new Date().toISOString(), seconds, figures }
    } catch (e) {
      failures++
      console.error(`\n${section.id}: failed: ${(e as Error).stack ?? String(e)}`)
    }
  }
  printSummary(result.sections)
  writeFileSync(out, `${JSON.stringify(result, null, 2)}\n`)
  console.log(`\nwrote ${out}`)
  return failures > 0 ? 1 : 0
}

process.exitCode = await main(process.argv.slice(2))
