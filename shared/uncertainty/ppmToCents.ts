/** A relative frequency error in parts per million as cents: 1200·log2(1 + ppm·10⁻⁶) (definition of the cent). */
export function ppmToCents(offsetPpm: number): number {
  if (!(Number.isFinite(offsetPpm) && offsetPpm > -1e6)) throw new RangeError('ppmToCents needs a finite offset above −10⁶ ppm')
  return 1200 * Math.log2(1 + offsetPpm * 1e-6)
}
