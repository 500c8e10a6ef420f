import { parseArgs } from 'node:util'
import { equilibriumHumidityAnswer, equilibriumMoistureAnswer } from '../../analysis/equilibrium-answers.ts'
import { productById } from '../../product/catalogue.ts'
import type { SorptionDirection } from '../../product/equilibrium.ts'
import type { ProductProfile } from '../../product/profile.ts'
import { parseUserProfile } from '../../product/profile-schema.ts'
import { type CliCommand, numberOption, UsageError } from '../command.ts'

const help = `dryhours equilibrium: equilibrium moisture of a product in air, or the air it is in equilibrium with

Usage:
  dryhours equilibrium (--product <id> | --profile <profile.json>) --tdb <°C> --rh <%> [--adsorption] [--json]
  dryhours equilibrium (--product <id> | --profile <profile.json>) --tdb <°C> --moisture-wb <%> [--adsorption] [--json]

With --rh: the equilibrium moisture content (wet and dry basis). With --moisture-wb: the equilibrium
relative humidity (= 100 × water activity). Desorption (drying) constants unless --adsorption.
The heat of sorption is derived from the same isotherm (Clausius–Clapeyron).`

async function loadProfile(
  values: Record<string, string | boolean | undefined>,
  io: Parameters<CliCommand['run']>[1],
): Promise<ProductProfile> {
  const id = values.product as string | undefined
  const file = values.profile as string | undefined
  if ((id === undefined) === (file === undefined))
    throw new UsageError('give exactly one of --product <id> or --profile <file.json>')
  try {
    if (id !== undefined) return productById(id)
    const bytes = await io.readFile(file as string)
    let json: unknown
    try {
      json = JSON.parse(new TextDecoder().decode(bytes))
    } catch (e) {
      throw new UsageError(`${file}: not valid JSON (${(e as Error).message})`)
    }
    return parseUserProfile(json)
  } catch (e) {
    if (e instanceof RangeError) throw new UsageError(e.message)
    throw e
  }
}

export const equilibriumCommand: CliCommand = {
  name: 'equilibrium',
  summary: 'equilibrium moisture of a product at a temperature and RH (or RH at a moisture)',
  help,
  async run(args, io) {
    let values: Record<string, string | boolean | undefined>
    try {
      values = parseArgs({
        args,
        options: {
          product: { type: 'string' },
          profile: { type: 'string' },
          tdb: { type: 'string' },
          rh: { type: 'string' },
          'moisture-wb': { type: 'string' },
          adsorption: { type: 'boolean' },
          json: { type: 'boolean' },
        },
        allowPositionals: false,
      }).values
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const str = (k: string): string | undefined => values[k] as string | undefined
    const tdb = numberOption('tdb', str('tdb'))
    if (tdb === undefined) throw new UsageError('--tdb (air temperature, °C) is required')
    const rh = numberOption('rh', str('rh'))
    const mwb = numberOption('moisture-wb', str('moisture-wb'))
    if ((rh === undefined) === (mwb === undefined))
      throw new UsageError('give exactly one of --rh <%> or --moisture-wb <%>')
    const profile = await loadProfile(values, io)
    const direction: SorptionDirection = values.adsorption ? 'adsorption' : 'desorption'
    try {
      if (rh !== undefined) {
        const out = equilibriumMoistureAnswer(profile, tdb, rh, direction)
        io.stdout(
          values.json
            ? `${JSON.stringify(out)}\n`
            : `${profile.name} at ${tdb} °C, ${rh} % RH (${direction}):\n` +
                `  equilibrium moisture ${out.equilibriumMoistureWbPct.toFixed(2)} % wb (${out.equilibriumMoistureDbPct.toFixed(2)} % db)\n` +
                `  net isosteric heat ${out.netIsostericHeatKjPerMol.toFixed(2)} kJ/mol (${out.heatOfSorptionMethod})\n` +
                `  model ${out.model} [${out.confidence}]: ${out.source}\n` +
                (out.extrapolated
                  ? '  note: outside the calibrated range of the isotherm (extrapolated)\n'
                  : ''),
        )
      } else {
        const out = equilibriumHumidityAnswer(profile, tdb, mwb as number, direction)
        io.stdout(
          values.json
            ? `${JSON.stringify(out)}\n`
            : `${profile.name} at ${tdb} °C and ${mwb} % wb (${direction}):\n` +
                `  equilibrium RH ${out.equilibriumRelativeHumidityPct.toFixed(1)} % (water activity ${out.waterActivity.toFixed(3)})\n` +
                `  model ${out.model} [${out.confidence}]: ${out.source}\n` +
                (out.extrapolated
                  ? '  note: outside the calibrated range of the isotherm (extrapolated)\n'
                  : ''),
        )
      }
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(e.message)
      throw e
    }
    return 0
  },
}
