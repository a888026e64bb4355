/**
 * Tonewright's palette, declared once: Tailwind's theme, the charts, the stage and
 * verdict looks, the e-mails and the certificate PDF read their colours from here.
 * Warm workshop paper and ink; spruce green, kiln orange and slate blue are kept for
 * the verdicts (within, sharp, flat: an orange/blue pair stays distinguishable for the
 * common colour-vision deficiencies, and shape and text carry the verdict as well);
 * brass is the accent and the mark of advice (where to remove material); madder is for errors, heather for notices,
 * signal (safety yellow, drawn with an ink edge as warning signs are) for warnings and cautions, lagoon for what is
 * finished well, lichen for a conditional verdict (the tolerance lies within the measurement's ± U), mulberry for what was sent back or withdrawn (a piece returned for rework, a revoked certificate, a set
 * booked back in for service). The chart series (walnut, olive, rose, steel) stand for no
 * meaning: they only tell one curve from another.
 */
export const PALETTE = {
  paper: { DEFAULT: '#f6f3ec', deep: '#ece6d9', line: '#d9d0bd' },
  ink: { DEFAULT: '#1f2329', soft: '#4a5059', faint: '#7b818a', mute: '#aeb2b8', raised: '#2b3038' },
  spruce: { 50: '#eaf4ef', 100: '#cfe6da', 500: '#2f7d5b', 600: '#25664a', 700: '#1c4f39' },
  kiln: { 50: '#fbeee6', 100: '#f5d3bf', 500: '#c45a1c', 600: '#a34812', 700: '#7f370c' },
  slate: { 50: '#ebf0f8', 100: '#cdd9ec', 500: '#3b62a8', 600: '#2f4f8a', 700: '#243d6b' },
  brass: { 100: '#f3e6c4', 400: '#c9a13f', 500: '#a9832a', 600: '#8c6b20', 700: '#6e5416' },
  madder: { 50: '#fbeaee', 100: '#f3c7d2', 500: '#b3294e', 600: '#93203f', 700: '#731931' },
  heather: { 50: '#f0ecf7', 100: '#dcd2ec', 500: '#6b4fa3', 700: '#463372' },
  signal: { 50: '#fdf6d3', 100: '#f5e08c', 400: '#f0c20c', 800: '#5a4700' },
  lagoon: { 50: '#e5f2f3', 100: '#c2e0e3', 400: '#3e97a0', 500: '#1f7580', 600: '#1a636b', 700: '#134a50' },
  mulberry: { 50: '#f6e9f1', 100: '#e9c9dd', 500: '#8f3a72', 600: '#7a2f61', 700: '#64264f' },
  lichen: { 50: '#f2f4e0', 100: '#dde4b0', 500: '#6f7d12', 700: '#4a540b' },
  series: { walnut: '#7a4e2d', olive: '#66761f', rose: '#b0607a', steel: '#4f6e7a' },
} as const

/** Plain white, for paper-white cards, e-mail bodies and the QR code's light modules. */
export const WHITE = '#ffffff'

export type Family = keyof typeof PALETTE
type ShadeOf<F extends Family> = Exclude<keyof (typeof PALETTE)[F], 'DEFAULT'> & (string | number)
/** A palette colour by name, as Tailwind spells it: `ink`, `ink-soft`, `spruce-500`. */
export type Tone = { [F in Family]: ('DEFAULT' extends keyof (typeof PALETTE)[F] ? F : never) | `${F}-${ShadeOf<F>}` }[Family]

/** The family of a tone: `spruce-500` → `spruce`. */
export function familyOf(tone: Tone): Family {
  return tone.split('-')[0] as Family
}

/** The hex value of a tone. */
export function hex(tone: Tone): string {
  const [family, shade = 'DEFAULT'] = tone.split('-') as [Family, string?]
  return (PALETTE[family] as Record<string, string>)[shade]!
}

/** A hex colour with an alpha channel, as CSS `rgba()`. */
export function withAlpha(colour: string, alpha: number): string {
  const [r, g, b] = [1, 3, 5].map(i => Number.parseInt(colour.slice(i, i + 2), 16))
  return `rgba(${r},${g},${b},${alpha})`
}

/**
 * Series colours for charts with several lines (decay curves), in the order they are used: the
 * neutral inks and the series family, never a verdict, stage, status or message colour, so a
 * curve never looks within, sharp or flat.
 */
export const SERIES_TONES: readonly Tone[] = ['ink', 'series-walnut', 'series-olive', 'series-rose', 'series-steel', 'ink-faint']

/**
 * Chart parts that are not verdicts: the trace, the template's targets and the measured
 * peaks on the spectrum (brass, the accent, so a peak never looks sharp or flat), and
 * the bars of a count.
 */
export const CHART_TONES = { trace: 'ink', target: 'brass-500', measured: 'brass-700', track: 'paper-deep', bar: 'brass-500' } as const satisfies Record<string, Tone>
