import type { ProfileStation } from './types'

/**
 * Node positions of the finite-element mesh: `elements` equal steps along the bar with
 * every profile station added, so that no element straddles a kink of the profile
 * (each element's thickness is then exactly linear). Nodes closer than a tenth of a
 * step to a station are moved onto it rather than doubled, and nodes closer together than
 * a thousandth of a step are merged: a sliver element (two stations a few µm apart, as a
 * cut station beside a profile station gives) would make the stiffness matrix ill-conditioned.
 */
export function meshNodesMm(lengthMm: number, profile: readonly ProfileStation[], elements: number): Float64Array {
  if (!(lengthMm > 0) || !Number.isInteger(elements) || elements < 1) throw new RangeError('mesh needs a positive length and element count')
  const step = lengthMm / elements
  const nodes: number[] = []
  for (let i = 0; i <= elements; i++) nodes.push(i * step)
  const moved = new Set<number>()
  for (const s of profile) {
    if (s.xMm <= 0 || s.xMm >= lengthMm) continue
    const nearest = Math.round(s.xMm / step)
    const movable = nearest > 0 && nearest < elements && !moved.has(nearest)
    if (movable && Math.abs(nodes[nearest]! - s.xMm) < step / 10) {
      nodes[nearest] = s.xMm
      moved.add(nearest)
    }
    else nodes.push(s.xMm)
  }
  nodes.sort((a, b) => a - b)
  const out: number[] = []
  const merge = step / 1000
  for (const x of nodes) if (out.length === 0 || x - out[out.length - 1]! > merge) out.push(x)
  // The right end stays the bar's end.
  out[out.length - 1] = Math.max(out[out.length - 1]!, lengthMm)
  return Float64Array.from(out)
}
