/**
 * @module bench/sections/hostile
 * Hostile text that once made patterns backtrack, read end to end, against a 1,000-row ordinary
 * file read in the same run: a timestamp cell padded with 4,000 spaces (once about 13 s), a header
 * of 1,000 cells of 100 '(' (once about 12 s), 10 such lines under a title whose commas make the
 * reader try every delimiter, a 20,000-line body without delimiters, and a
 * 100,000-character number cell. Figures are medians of five runs; the tests in
 * test/hostile/linear-time.test.ts assert what these inputs are answered.
 */
import { readWeather } from '../../src/weather/read-weather.ts'
import { type BenchFigure, type BenchSection, median } from '../section.ts'

const REPEATS = 5

function ordinary(rows: number): string {
  const lines = ['timestamp,temp_c,rh_pct']
  for (let h = 0; h < rows; h++)
    lines.push(
      `${new Date(Date.UTC(2021, 6, 1, h)).toISOString().slice(0, 16)},${(20 + Math.sin(h)).toFixed(1)},${50 + (h % 7)}`,
    )
  return `${lines.join('\n')}\n`
}

const CASES: [string, string][] = [
  [
    'timestamp cell padded with 4,000 spaces',
    `timestamp,temp_c,rh_pct\n2021-07-01 00:00${' '.repeat(4000)}x,20,50\n2021-07-01 01:00,20.5,50\n2021-07-01 02:00,21,48\n`,
  ],
  [
    'header of 1,000 cells of 100 "("',
    `${Array.from({ length: 1000 }, () => '('.repeat(100)).join(',')}\n1,2,3\n`,
  ],
  [
    'a title with commas above 10 lines of 1,000 semicolon cells of 100 "(" (every delimiter tried)',
    `Title, a, b\n${Array.from({ length: 10 }, () => Array.from({ length: 1000 }, () => '('.repeat(100)).join(';')).join('\n')}\n1;2;3\n`,
  ],
  [
    '20,000 lines without a delimiter',
    `timestamp,temp_c,rh_pct\n${Array.from({ length: 20_000 }, (_, h) => new Date(Date.UTC(2021, 0, 1, h)).toISOString()).join('\n')}\n`,
  ],
  [
    'number cell of 100,000 characters',
    `timestamp,temp_c,rh_pct\n2021-07-01 00:00,1${' '.repeat(100_000)}x,50\n2021-07-01 01:00,20.5,50\n2021-07-01 02:00,21,48\n`,
  ],
]

function timeMs(text: string): { wall: number; cpu: number } {
  const wall: number[] = []
  const cpu: number[] = []
  for (let k = 0; k < REPEATS; k++) {
    const c0 = process.cpuUsage()
    const t0 = performance.now()
    try {
      readWeather(text, { utcOffsetHours: 0 })
    } catch {
      // refused with a message: that is the answer measured
    }
    wall.push(performance.now() - t0)
    const c = process.cpuUsage(c0)
    cpu.push((c.user + c.system) / 1000)
  }
  return { wall: median(wall), cpu: median(cpu) }
}

export const section: BenchSection = {
  id: 'hostile',
  title: 'hostile weather text read end to end vs a 1,000-row ordinary file (all must stay far below 1 s)',
  run() {
    const reference = timeMs(ordinary(1000))
    const figures: BenchFigure[] = [
      {
        name: 'ordinary 1,000-row file',
        value: reference.wall,
        unit: 'ms',
        note: `CPU ${reference.cpu.toFixed(1)} ms; median of ${REPEATS}`,
      },
    ]
    for (const [name, text] of CASES) {
      const t = timeMs(text)
      figures.push({
        name,
        value: t.wall,
        unit: 'ms',
        note: `CPU ${t.cpu.toFixed(1)} ms; ${(t.wall / reference.wall).toFixed(1)} × the ordinary file; ${(text.length / 1000).toFixed(0)} kB`,
      })
    }
    return figures
  },
}
