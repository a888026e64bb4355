import type { BlankThreshold } from '#shared/barModel/blankThresholds'
import type { BlankRank } from '#shared/barModel/gradeFromThresholds'

export interface ChartBlank { id: string, specificModulus: number, lossFactor: number | null, rank: BlankRank }

/** The plot's frame in SVG units: the axes' box, and the strip under it for blanks without a decay. */
export const BLANK_CHART = { width: 560, height: 320, left: 64, right: 16, top: 16, bottom: 256, strip: 286 } as const

function span(values: number[], pad: number): [number, number] {
  const lo = Math.min(...values)
  const hi = Math.max(...values)
  const room = (hi - lo || Math.abs(hi) || 1) * pad
  return [Math.max(0, lo - room), hi + room]
}

function ticks([lo, hi]: [number, number], count = 5): number[] {
  const raw = (hi - lo) / count
  const step = 10 ** Math.floor(Math.log10(raw))
  const nice = [1, 2, 5, 10].map(m => m * step).find(s => s >= raw) ?? raw
  const out: number[] = []
  for (let v = Math.ceil(lo / nice) * nice; v <= hi + 1e-12; v += nice) out.push(Number(v.toPrecision(6)))
  return out
}

/**
 * Where each blank sits on the E/ρ (across) and η (up) plot, with the species' limits as lines;
 * the ranges take in every blank and every limit so the lines are always on the plot.
 */
export function useBlankChart(blanks: MaybeRefOrGetter<ChartBlank[]>, thresholds: MaybeRefOrGetter<BlankThreshold>) {
  return computed(() => {
    const list = toValue(blanks)
    const t = toValue(thresholds)
    const c = BLANK_CHART
    const xRange = span([...list.map(b => b.specificModulus), t.specificModulus.select, t.specificModulus.usable], 0.12)
    const losses = list.flatMap(b => (b.lossFactor === null ? [] : [b.lossFactor]))
    const yRange: [number, number] = [0, span([...losses, t.lossFactor.select, t.lossFactor.usable], 0.15)[1]]
    const x = (v: number) => c.left + ((v - xRange[0]) / (xRange[1] - xRange[0])) * (c.width - c.left - c.right)
    const y = (v: number) => c.bottom - (v / yRange[1]) * (c.bottom - c.top)
    return {
      points: list.map(b => ({ ...b, cx: x(b.specificModulus), cy: b.lossFactor === null ? c.strip : y(b.lossFactor) })),
      xTicks: ticks(xRange).filter(v => v >= xRange[0]).map(v => ({ v, at: x(v) })),
      yTicks: ticks(yRange, 4).map(v => ({ v, at: y(v) })),
      limits: {
        select: { x: x(t.specificModulus.select), y: y(t.lossFactor.select) },
        usable: { x: x(t.specificModulus.usable), y: y(t.lossFactor.usable) },
      },
      anyWithoutDecay: list.some(b => b.lossFactor === null),
    }
  })
}
