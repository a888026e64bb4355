/**
 * Peak-to-trough depth, in dB, of the sinusoidal component at `rateHz` of a dB envelope's
 * residual (envelope minus its decay line), sampled at arbitrary times: twice the amplitude
 * 2·|Σ r_i e^{−2πi f t_i}| / n of that component (a least-squares sinusoid for evenly
 * spread times).
 */
export function envelopeDepthDb(timesS: ArrayLike<number>, residualsDb: ArrayLike<number>, rateHz: number): number {
  const n = timesS.length
  if (n === 0 || timesS.length !== residualsDb.length) throw new RangeError('envelopeDepthDb needs one residual per time')
  let re = 0
  let im = 0
  for (let i = 0; i < n; i++) {
    const angle = 2 * Math.PI * rateHz * (timesS[i]! - timesS[0]!)
    re += residualsDb[i]! * Math.cos(angle)
    im -= residualsDb[i]! * Math.sin(angle)
  }
  return (4 * Math.hypot(re, im)) / n
}
