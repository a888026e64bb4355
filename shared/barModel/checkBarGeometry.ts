import type { BarGeometry } from './types'

/** Throws a RangeError with a plain sentence when a bar cannot be modelled. */
export function checkBarGeometry(bar: BarGeometry): void {
  const positive = (v: number) => Number.isFinite(v) && v > 0
  if (!positive(bar.lengthMm)) throw new RangeError('The length must be a positive number of millimetres.')
  if (!positive(bar.widthMm)) throw new RangeError('The width must be a positive number of millimetres.')
  if (!positive(bar.densityKgM3)) throw new RangeError('The density must be a positive number.')
  if (!positive(bar.youngsModulusGPa)) throw new RangeError('Young\'s modulus must be a positive number.')
  const p = bar.profile
  if (p.length < 2) throw new RangeError('The profile needs at least two stations.')
  if (Math.abs(p[0]!.xMm) > 1e-9 || Math.abs(p[p.length - 1]!.xMm - bar.lengthMm) > 1e-9) {
    throw new RangeError('The profile must start at 0 mm and end at the bar\'s length.')
  }
  for (let i = 0; i < p.length; i++) {
    if (!positive(p[i]!.thicknessMm)) throw new RangeError('Every thickness in the profile must be positive.')
    if (i > 0 && !(p[i]!.xMm > p[i - 1]!.xMm)) throw new RangeError('Profile stations must go from left to right without repeats.')
  }
}
