/**
 * @module weather/site-overrides
 * What the user's options change of what the file itself states about its site (an EPW header's
 * location, a data service's coordinates, a layout's clock). The user's options win (read-weather.ts),
 * but never silently: each replaced statement is listed with both values and a warning names both, so a
 * comparison of several files can refuse an option meant for one file that would move another.
 */
import { optionSpec } from './option-spec.ts'
import type { WeatherReadOptions } from './options.ts'

/** One stated value the user's option replaced. */
export interface SiteOverride {
  /** The reader key of the option (`latitudeDeg`, `elevationM`, `utcOffsetHours`, `siteTimeZone`). */
  option: 'latitudeDeg' | 'longitudeDeg' | 'elevationM' | 'utcOffsetHours' | 'siteTimeZone'
  /** The value given by the option, as text with its unit. */
  given: string
  /** The option's value as given (number or zone). */
  value: number | string
  /** The value the file states, as text with its unit. */
  stated: string
}

/** What the file states, in the options' terms (absent = not stated). */
export interface StatedSite {
  latitudeDeg?: number | null
  longitudeDeg?: number | null
  elevationM?: number | null
  /** The offset of the file's timestamps from UTC [h]. */
  utcOffsetHours?: number | null
  siteTimeZone?: string | null
}

const WORDS: Record<SiteOverride['option'], string> = {
  latitudeDeg: 'latitude',
  longitudeDeg: 'longitude',
  elevationM: 'elevation',
  utcOffsetHours: "time stamps' UTC offset",
  siteTimeZone: "site's time zone",
}

function degrees(x: number, pos: string, neg: string): string {
  return `${Math.abs(x)}° ${x >= 0 ? pos : neg}`
}

function text(option: SiteOverride['option'], v: number | string): string {
  if (typeof v === 'string') return v
  if (option === 'latitudeDeg') return degrees(v, 'N', 'S')
  if (option === 'longitudeDeg') return degrees(v, 'E', 'W')
  if (option === 'elevationM') return `${v} m`
  return `UTC${v >= 0 ? '+' : ''}${v} h`
}

/**
 * The options that replace a different value the file states. Equal values are not overrides;
 * coordinates within 0.005° and elevations within 0.5 m count as equal (the rounding of the files' own
 * headers, our choice).
 */
export function siteOverrides(opts: WeatherReadOptions, stated: StatedSite): SiteOverride[] {
  const out: SiteOverride[] = []
  const numeric = (option: 'latitudeDeg' | 'longitudeDeg' | 'elevationM' | 'utcOffsetHours', tol: number) => {
    const given = opts[option]
    const said = stated[option]
    if (given === undefined || said === undefined || said === null) return
    if (Math.abs(given - said) > tol)
      out.push({ option, given: text(option, given), value: given, stated: text(option, said) })
  }
  numeric('latitudeDeg', 0.005)
  numeric('longitudeDeg', 0.005)
  numeric('elevationM', 0.5)
  numeric('utcOffsetHours', 1e-9)
  const zone = opts.siteTimeZone
  if (zone !== undefined && stated.siteTimeZone && stated.siteTimeZone !== zone)
    out.push({ option: 'siteTimeZone', given: zone, value: zone, stated: stated.siteTimeZone })
  return out
}

/** The warning of an override, naming the option (as a CLI flag; other surfaces rename it) and both values. */
export function overrideWarning(o: SiteOverride): string {
  const flag = optionSpec(o.option)?.flag ?? o.option
  return `--${flag} ${o.value} replaces the ${WORDS[o.option]} the file states (${o.stated})`
}
