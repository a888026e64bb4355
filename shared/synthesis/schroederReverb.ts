// Synthetic strikes for demo data, tests and benchmarks (not part of the measurement).

/**
 * A room's reverberant tail added to `dry`: the Schroeder (1962) reverberator — four
 * parallel feedback combs (delays 29.7, 37.1, 41.1, 43.7 ms, feedback g = 10^(−3 d / t60)
 * so each falls 60 dB in `t60S`) into two series all-pass filters (5 ms g = 0.7,
 * 1.7 ms g = 0.7). The wet signal is scaled to `wetDb` relative to the dry one and added.
 */
export function schroederReverb(dry: Float64Array, sampleRate: number, t60S: number, wetDb: number): Float64Array {
  if (!(t60S > 0) || !(sampleRate > 0)) throw new RangeError('schroederReverb needs a positive T60 and rate')
  const n = dry.length
  const wet = new Float64Array(n)
  for (const delayS of [0.0297, 0.0371, 0.0411, 0.0437]) {
    const d = Math.round(delayS * sampleRate)
    const g = 10 ** ((-3 * delayS) / t60S)
    const line = new Float64Array(n)
    for (let i = 0; i < n; i++) {
      line[i] = dry[i]! + (i >= d ? g * line[i - d]! : 0)
      wet[i]! += line[i]! / 4
    }
  }
  let signal = wet
  for (const [delayS, g] of [[0.005, 0.7], [0.0017, 0.7]] as const) {
    const d = Math.round(delayS * sampleRate)
    const out = new Float64Array(n)
    for (let i = 0; i < n; i++) {
      const delayedIn = i >= d ? signal[i - d]! : 0
      const delayedOut = i >= d ? out[i - d]! : 0
      out[i] = -g * signal[i]! + delayedIn + g * delayedOut
    }
    signal = out
  }
  // Scale by RMS so wetDb is the tail's level against the dry strike.
  let dryPower = 0
  let wetPower = 0
  for (let i = 0; i < n; i++) {
    dryPower += dry[i]! ** 2
    wetPower += signal[i]! ** 2
  }
  const scale = wetPower > 0 ? Math.sqrt(dryPower / wetPower) * 10 ** (wetDb / 20) : 0
  const result = new Float64Array(n)
  for (let i = 0; i < n; i++) result[i] = dry[i]! + scale * signal[i]!
  return result
}
