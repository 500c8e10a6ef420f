/**
 * @module report/palette
 * The report's visual language: colours that survive the common colour-vision deficiencies and
 * greyscale printing, always paired with a second cue (fill pattern, dash style or marker shape) so
 * that no meaning rests on hue alone.
 *
 * Colours are from Paul Tol, "Colour Schemes", SRON Technical Note SRON/EPS/TN/09-002, issue 3.2
 * (2021): the *high-contrast* scheme (designed to stay distinct in greyscale and for colour-blind
 * readers) for the main series, the *muted* scheme for sites side by side, and the sequential
 * *YlOrBr* scheme (monotonic lightness, so it reads as a grey ramp when printed) for fractions and
 * densities. Hex values checked against the khroma and ggmnmlab R packages' copies of the note.
 */

/** Tol high-contrast scheme (Tol 2021, fig. 2): blue, yellow, red, plus black and white. */
export const HIGH_CONTRAST = {
  blue: '#004488',
  yellow: '#DDAA33',
  red: '#BB5566',
  black: '#000000',
  white: '#FFFFFF',
} as const

/** Tol muted scheme (Tol 2021, fig. 4), in the note's order; pale grey '#DDDDDD' for "no data". */
export const MUTED = [
  '#332288',
  '#88CCEE',
  '#44AA99',
  '#117733',
  '#999933',
  '#DDCC77',
  '#CC6677',
  '#882255',
  '#AA4499',
] as const
export const NO_DATA_GREY = '#DDDDDD'

/**
 * Tol sequential YlOrBr, 9 colours (Tol 2021, fig. 19; identical to ColorBrewer YlOrBr-9, Brewer 2002;
 * from memory, checked against the ColorBrewer YlOrBr entries). Light (low) → dark (high).
 */
export const YL_OR_BR = [
  '#FFFFE5',
  '#FFF7BC',
  '#FEE391',
  '#FEC44F',
  '#FB9A29',
  '#EC7014',
  '#CC4C02',
  '#993404',
  '#662506',
] as const

/** Ink colours of the report (our own choice): text, axes, grid. */
export const INK = { text: '#1A1A1A', axis: '#444444', grid: '#D0D0D0', muted: '#666666' } as const

/**
 * Colour of a fraction 0–1 on the sequential scale, in 9 steps (each step a class of width 1/9).
 * NaN or null → {@link NO_DATA_GREY}.
 */
export function sequentialColour(fraction: number | null): string {
  if (fraction === null || !Number.isFinite(fraction)) return NO_DATA_GREY
  const f = Math.min(1, Math.max(0, fraction))
  return YL_OR_BR[Math.min(YL_OR_BR.length - 1, Math.floor(f * YL_OR_BR.length))]
}

/** Text colour that stays legible on a sequential cell (dark ink on the light half, white on the dark). */
export function inkOnSequential(fraction: number | null): string {
  return fraction !== null && Number.isFinite(fraction) && fraction >= 5 / 9 ? '#FFFFFF' : INK.text
}

/** A fill pattern, used together with a colour for one series (site) so greyscale prints stay distinct. */
export interface SeriesStyle {
  colour: string
  /** Id suffix of the SVG pattern (see {@link patternDefs}); 'solid' uses the plain colour. */
  pattern: 'solid' | 'diagonal' | 'dots' | 'cross' | 'horizontal' | 'vertical'
  /** stroke-dasharray for lines of this series ('' = solid). */
  dash: string
  /** Marker shape for points of this series. */
  marker: 'circle' | 'square' | 'triangle' | 'diamond' | 'cross' | 'star'
}

const PATTERNS: SeriesStyle['pattern'][] = ['solid', 'diagonal', 'dots', 'cross', 'horizontal', 'vertical']
const DASHES = ['', '6 3', '2 2', '8 3 2 3', '1 3', '10 4']
const MARKERS: SeriesStyle['marker'][] = ['circle', 'square', 'triangle', 'diamond', 'cross', 'star']
/** Site colours: the muted scheme's darker members first so that patterns stay visible on them. */
const SITE_COLOURS = [
  MUTED[0],
  MUTED[6],
  MUTED[3],
  MUTED[5],
  MUTED[7],
  MUTED[1],
  MUTED[2],
  MUTED[4],
  MUTED[8],
]

/** Style of the i-th site in a comparison: colour, pattern, dash and marker all change together. */
export function siteStyle(index: number): SeriesStyle {
  const i = ((index % SITE_COLOURS.length) + SITE_COLOURS.length) % SITE_COLOURS.length
  return {
    colour: SITE_COLOURS[i],
    pattern: PATTERNS[i % PATTERNS.length],
    dash: DASHES[i % DASHES.length],
    marker: MARKERS[i % MARKERS.length],
  }
}

/**
 * SVG `<pattern>` definitions for a style, id `${prefix}-${pattern}-${n}`. Returns '' for solid fills.
 * The pattern paints the colour as a light tint with darker strokes, so the shape reads in greyscale.
 */
export function patternDef(id: string, style: SeriesStyle): string {
  const c = style.colour
  const bg = `<rect width="8" height="8" fill="${c}" fill-opacity="0.35"/>`
  switch (style.pattern) {
    case 'solid':
      return ''
    case 'diagonal':
      return `<pattern id="${id}" patternUnits="userSpaceOnUse" width="8" height="8">${bg}<path d="M-2,2 l4,-4 M0,8 l8,-8 M6,10 l4,-4" stroke="${c}" stroke-width="2"/></pattern>`
    case 'dots':
      return `<pattern id="${id}" patternUnits="userSpaceOnUse" width="8" height="8">${bg}<circle cx="4" cy="4" r="2" fill="${c}"/></pattern>`
    case 'cross':
      return `<pattern id="${id}" patternUnits="userSpaceOnUse" width="8" height="8">${bg}<path d="M0,4 h8 M4,0 v8" stroke="${c}" stroke-width="1.6"/></pattern>`
    case 'horizontal':
      return `<pattern id="${id}" patternUnits="userSpaceOnUse" width="8" height="8">${bg}<path d="M0,2 h8 M0,6 h8" stroke="${c}" stroke-width="1.6"/></pattern>`
    case 'vertical':
      return `<pattern id="${id}" patternUnits="userSpaceOnUse" width="8" height="8">${bg}<path d="M2,0 v8 M6,0 v8" stroke="${c}" stroke-width="1.6"/></pattern>`
  }
}

/** The fill attribute value for a style: a colour, or `url(#id)` of its pattern. */
export function styleFill(id: string, style: SeriesStyle): string {
  return style.pattern === 'solid' ? style.colour : `url(#${id})`
}
