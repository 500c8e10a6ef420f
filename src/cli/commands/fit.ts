import { parseArgs } from 'node:util'
import { productById } from '../../product/catalogue.ts'
import { fitWeighings, profileFromFit, type WeighingsFit } from '../../product/fit-weighings.ts'
import type { ProductProfile, Shape } from '../../product/profile.ts'
import { type MoistureReference, parseWeighingsCsv } from '../../product/weighings.ts'
import { fitJson } from '../../report/fit-json.ts'
import { type CliCommand, numberOption, UsageError } from '../command.ts'

const help = `dryhours fit: calibrate drying kinetics from your own tray weighings

Usage:
  dryhours fit <weighings.csv> (--dry-mass <g> | --initial-wb <%> | --final-wb <%>)
               [--thickness <mm>] [--shape slab|cylinder|sphere] [--target-wb <%>]
               [--product <id>] [--save <profile.json> [--id <new-id>]] [--json]

The CSV (comma, semicolon or tab separated) needs a header naming a time column and a mass column
as people write them, with the unit if any: elapsed_h, time (min), t (h), Hours, or ISO 8601
date-times in a time/date column; mass_g, Weight (kg), lb; also Spanish, French, German, Portuguese
and Italian words (tiempo, temps, Zeit, tempo; peso, poids, masse, Gewicht, massa). Air temperature
(air_c, temp (°F)) and relative humidity (rh_pct, HR (%)) are optional. The output says which
columns it read. Lines starting with # are comments. An empty mass cell is a missed weighing.
Fits Lewis, Page and Fick diffusion by Levenberg–Marquardt and picks the best by AICc. A weighing
far off the curve (tray off the rack) is left out and reported. --save writes a product profile
based on --product (required with --save) with the fitted kinetics; an existing file is replaced only
with --force.`

function fmt(x: number, d = 4): string {
  return Number.isFinite(x) ? x.toPrecision(d) : String(x)
}

function report(f: WeighingsFit): string {
  const lines: string[] = []
  if (f.columnsRead) lines.push(f.columnsRead)
  lines.push(
    `dry mass ${f.dryMassG.toFixed(1)} g; moisture ${f.initialMoistureWbPct.toFixed(1)} → ${f.lastMoistureWbPct.toFixed(1)} % wb over ${f.readingsUsed} weighings used`,
  )
  lines.push(`best model by ${f.criterion}: ${f.best.model}`)
  for (const m of f.models) {
    const ps = Object.keys(m.params)
      .map((k) => `${k} = ${fmt(m.params[k])} ± ${fmt(m.standardErrors[k], 2)}`)
      .join(', ')
    lines.push(
      `  ${m.model.padEnd(9)} ${ps}; R² ${m.r2.toFixed(5)}, RMSE ${fmt(m.rmseDb, 3)} kg/kg db, AICc ${m.aicc.toFixed(1)}`,
    )
  }
  if (f.effectiveDiffusivityM2PerS) {
    const d = f.effectiveDiffusivityM2PerS
    lines.push(
      `effective diffusivity ${fmt(d.value, 3)} ± ${fmt(d.standardError, 2)} m²/s (${f.shape}, ${f.thicknessMm} mm)`,
    )
  }
  lines.push(`fitted equilibrium moisture ${f.equilibriumMoistureWbPct.toFixed(1)} % wb`)
  const c = f.periods.constantRate
  lines.push(
    c
      ? `constant-rate period 0–${c.endH.toFixed(2)} h at ${fmt(c.rateDbPerH, 3)} kg/(kg dm·h); critical moisture ${fmt(c.criticalMoistureDb, 3)} kg/kg db; falling rate after`
      : 'no constant-rate period seen: falling rate from the first weighing',
  )
  if (f.target) {
    lines.push(
      f.target.timeH === null
        ? `time to ${f.target.moistureWbPct} % wb: ${f.target.note}`
        : `time to ${f.target.moistureWbPct} % wb: ${f.target.timeH.toFixed(1)} h (${f.target.note})`,
    )
  }
  if (f.meanAirTempC !== null)
    lines.push(
      `mean air ${f.meanAirTempC.toFixed(1)} °C${f.meanRhPct !== null ? `, ${f.meanRhPct.toFixed(0)} % RH` : ''}`,
    )
  for (const w of f.warnings) lines.push(`warning: ${w}`)
  return `${lines.join('\n')}\n`
}

const fitOptions = {
  'dry-mass': { type: 'string' },
  'initial-wb': { type: 'string' },
  'final-wb': { type: 'string' },
  thickness: { type: 'string' },
  shape: { type: 'string' },
  'target-wb': { type: 'string' },
  product: { type: 'string' },
  save: { type: 'string' },
  id: { type: 'string' },
  json: { type: 'boolean' },
  force: { type: 'boolean' },
} as const

export const fitCommand: CliCommand = {
  name: 'fit',
  summary: 'fit drying kinetics to tray weighings (Lewis, Page, diffusion; AICc)',
  help,
  async run(args, io) {
    const parsed = (() => {
      try {
        return parseArgs({ args, options: fitOptions, allowPositionals: true })
      } catch (e) {
        throw new UsageError((e as Error).message)
      }
    })()
    const { values, positionals } = parsed
    if (positionals.length !== 1) throw new UsageError('give exactly one weighings CSV file')
    const refs = (['dry-mass', 'initial-wb', 'final-wb'] as const).filter((k) => values[k] !== undefined)
    if (refs.length !== 1)
      throw new UsageError('give exactly one of --dry-mass <g>, --initial-wb <%> or --final-wb <%>')
    const refValue = numberOption(refs[0], values[refs[0]]) as number
    const reference: MoistureReference =
      refs[0] === 'dry-mass'
        ? { dryMassG: refValue }
        : refs[0] === 'initial-wb'
          ? { initialWbPct: refValue }
          : { finalWbPct: refValue }
    const thicknessMm = numberOption('thickness', values.thickness)
    const targetWbPct = numberOption('target-wb', values['target-wb'])
    if (values.shape !== undefined && !['slab', 'cylinder', 'sphere'].includes(values.shape)) {
      throw new UsageError(`--shape must be slab, cylinder or sphere, got '${values.shape}'`)
    }
    if (values.save !== undefined && values.product === undefined) {
      throw new UsageError(
        '--save needs --product <id>: the catalogue product whose isotherm and limits the saved profile keeps',
      )
    }
    let base: ProductProfile | undefined
    try {
      if (values.product !== undefined) base = productById(values.product)
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(e.message)
      throw e
    }
    try {
      const shape = (values.shape as Shape | undefined) ?? base?.kinetics.shape ?? 'slab'
      const text = new TextDecoder().decode(await io.readFile(positionals[0]))
      const weighings = parseWeighingsCsv(text)
      const fit = fitWeighings(weighings, { reference, thicknessMm, shape, targetWbPct })
      let saved: string | null = null
      if (values.save !== undefined && base) {
        const id = values.id ?? `${base.id}-calibrated`
        const profile = profileFromFit(fit, base, id, targetWbPct)
        await io.writeFile(values.save, `${JSON.stringify(profile, null, 2)}\n`, {
          overwrite: values.force === true,
        })
        saved = values.save
      }
      if (values.json) {
        io.stdout(`${JSON.stringify({ ...fitJson(fit), savedProfile: saved })}\n`)
      } else {
        io.stdout(report(fit) + (saved ? `profile saved to ${saved}\n` : ''))
      }
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(`${positionals[0]}: ${e.message}`)
      throw e
    }
    return 0
  },
}
