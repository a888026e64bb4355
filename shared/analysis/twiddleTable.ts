/** The largest table made so far; smaller power-of-two sizes read every (N / size)-th entry of it. */
let master: { size: number, table: Float64Array } | null = null

/**
 * The twiddle factors of a radix-2/4 FFT of `size` (a power of two), interleaved as fft.js
 * lays them out: [cos(πi/size), −sin(πi/size)] for even i < 2·size. The smaller sizes of an
 * analysis are strides of the largest one's table, bit for bit the same numbers (i·s·π / (s·size)
 * differs from i·π / size only by powers of two, which scale exactly), so the costly cosines are
 * taken once. The result may be a view into a shared table: read only.
 */
export function twiddleTable(size: number): Float64Array {
  if (!(Number.isInteger(size) && size >= 2 && (size & (size - 1)) === 0)) throw new RangeError('twiddleTable needs a power-of-two size ≥ 2')
  if (!master || master.size < size) {
    const table = new Float64Array(2 * size)
    for (let i = 0; i < table.length; i += 2) {
      const angle = (Math.PI * i) / size
      table[i] = Math.cos(angle)
      table[i + 1] = -Math.sin(angle)
    }
    master = { size, table }
  }
  if (master.size === size) return master.table
  const stride = master.size / size
  const source = master.table
  const table = new Float64Array(2 * size)
  for (let i = 0; i < table.length; i += 2) {
    table[i] = source[i * stride]!
    table[i + 1] = source[i * stride + 1]!
  }
  return table
}
