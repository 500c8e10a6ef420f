import { parseArgs } from 'node:util'
import { type AirState, airState } from '../../physics/air-state.ts'
import { airStateJson } from '../../report/air-json.ts'
import { type CliCommand, numberOption, UsageError } from '../command.ts'

export { airStateJson }

const help = `dryhours air: the full moist-air state from dry bulb and one humidity variable

Usage:
  dryhours air --tdb <°C> (--rh <%> | --twb <°C> | --tdp <°C> | --w <g/kg>)
               [--elevation <m> | --pressure <kPa>] [--json]

Relative humidity is over liquid water (as weather stations report it). Sea level (101.325 kPa)
when neither elevation nor pressure is given.`

function table(s: AirState): string {
  const rows: [string, string, string][] = [
    ['dry bulb', s.dryBulbC.toFixed(2), '°C'],
    ['wet bulb', s.wetBulbC.toFixed(2), '°C'],
    ['dew point (over water)', s.dewPointC.toFixed(2), '°C'],
  ]
  if (s.frostPointC !== null) rows.push(['frost point (over ice)', s.frostPointC.toFixed(2), '°C'])
  rows.push(
    ['relative humidity (over water)', s.relativeHumidityPct.toFixed(1), '%'],
    ['humidity ratio', s.humidityRatioGPerKg.toFixed(3), 'g/kg dry air'],
    ['enthalpy', s.enthalpyKjPerKg.toFixed(2), 'kJ/kg dry air'],
    ['specific volume', s.specificVolumeM3PerKg.toFixed(4), 'm³/kg dry air'],
    ['density', s.densityKgPerM3.toFixed(4), 'kg/m³'],
    ['vapour pressure', s.vaporPressureKpa.toFixed(4), 'kPa'],
    ['saturation vapour pressure', s.saturationVaporPressureKpa.toFixed(4), 'kPa'],
    ['pressure', s.pressureKpa.toFixed(3), 'kPa'],
  )
  const width = Math.max(...rows.map((r) => r[0].length))
  const valueWidth = Math.max(...rows.map((r) => r[1].length))
  return `${rows.map(([k, v, u]) => `${k.padEnd(width)}  ${v.padStart(valueWidth)} ${u}`).join('\n')}\n`
}

export const airCommand: CliCommand = {
  name: 'air',
  summary: 'moist-air state from dry bulb and one humidity variable',
  help,
  async run(args, io) {
    let values: Record<string, string | boolean | undefined>
    try {
      values = parseArgs({
        args,
        options: {
          tdb: { type: 'string' },
          rh: { type: 'string' },
          twb: { type: 'string' },
          tdp: { type: 'string' },
          w: { type: 'string' },
          elevation: { type: 'string' },
          pressure: { type: 'string' },
          json: { type: 'boolean' },
        },
        allowPositionals: false,
      }).values
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const str = (k: string): string | undefined => values[k] as string | undefined
    const dryBulbC = numberOption('tdb', str('tdb'))
    if (dryBulbC === undefined) throw new UsageError('--tdb (dry bulb, °C) is required')
    const humidity = ['rh', 'twb', 'tdp', 'w'].filter((k) => values[k] !== undefined)
    if (humidity.length !== 1) {
      throw new UsageError('give exactly one of --rh <%>, --twb <°C>, --tdp <°C> or --w <g/kg>')
    }
    if (values.elevation !== undefined && values.pressure !== undefined) {
      throw new UsageError('give either --elevation or --pressure, not both')
    }
    let state: AirState
    try {
      state = airState({
        dryBulbC,
        relativeHumidityPct: numberOption('rh', str('rh')),
        wetBulbC: numberOption('twb', str('twb')),
        dewPointC: numberOption('tdp', str('tdp')),
        humidityRatioGPerKg: numberOption('w', str('w')),
        elevationM: numberOption('elevation', str('elevation')),
        pressureKpa: numberOption('pressure', str('pressure')),
      })
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(e.message)
      throw e
    }
    io.stdout(values.json ? `${JSON.stringify(airStateJson(state))}\n` : table(state))
    return 0
  },
}
