import { basebandDtft } from './basebandDtft'
import { cachedBlackmanHarris } from './cachedBlackmanHarris'
import type { Baseband } from './decimateBand'
import { dtftAt, type Complex } from './dtftAt'
import { finishGoertzel } from './finishGoertzel'
import { fitLine } from './fitLine'
import { DB_PER_NEPER } from './units'

/** Envelopes of two close partials, separated. */
export interface SeparatedPair {
  /** Decay rates in dB/s, lower partial first. */
  decayDbPerS: [number, number]
  r2: [number, number]
  /** Peak amplitudes at the onset (linear, full scale = 1). */
  amplitude: [number, number]
}

const mul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re })
const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im })
const div = (a: Complex, b: Complex): Complex => {
  const d = b.re * b.re + b.im * b.im
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d }
}

/** Solve [[a, b], [c, d]] · [u, v] = [p, q] over the complex numbers (Cramer's rule). */
function solve2(a: Complex, b: Complex, c: Complex, d: Complex, p: Complex, q: Complex): [Complex, Complex] {
  const det = sub(mul(a, d), mul(b, c))
  return [div(sub(mul(p, d), mul(b, q)), det), div(sub(mul(a, q), mul(c, p)), det)]
}

/**
 * Separate the envelopes of two partials of known frequencies `f1Hz` < `f2Hz` that are
 * too close for a short window: in each frame the two DTFT values X(f1), X(f2) are a
 * linear mixture of the two complex amplitudes through the window's transform W(±Δf),
 * so a 2 × 2 linear solve (least squares with as many equations as unknowns) gives
 * each amplitude. Frames are 2.5 / Δf long (W(Δf) then lies well down the main lobe),
 * hop a quarter of that. Each dB envelope gets its own least-squares decay line; the
 * onset amplitudes come from the same solve on the long window over the whole span,
 * with each partial's window gain Σ w[n]·e^{−α(t_n − t_onset)}.
 * All of it runs on a band of the signal mixed down and decimated (`band`, at its own
 * rate; `spanStart`, `spanEnd` and `onsetIndex` count its samples, the onset possibly
 * between two of them). Frames shorter than `minFrameLength` band samples, or a span of
 * fewer than three frames, give null.
 */
export function separatePair(
  band: Baseband,
  spanStart: number,
  spanEnd: number,
  onsetIndex: number,
  f1Hz: number,
  f2Hz: number,
  minFrameLength = 16,
): SeparatedPair | null {
  const sampleRate = band.sampleRateHz
  const deltaHz = f2Hz - f1Hz
  const frameLength = Math.min(Math.round((2.5 / deltaHz) * sampleRate), Math.floor((spanEnd - spanStart) / 1.5))
  const hop = Math.max(1, Math.round(frameLength / 4))
  if (!(frameLength >= minFrameLength)) return null
  const w = cachedBlackmanHarris(frameLength)
  let w0 = 0
  for (let i = 0; i < frameLength; i++) w0 += w[i]!
  const wUp = dtftAt(w, f1Hz - f2Hz, sampleRate) // W(ω1 − ω2): leakage of partial 2 into X(f1)
  const wDown = { re: wUp.re, im: -wUp.im } // W(ω2 − ω1) = conj, the window is real
  const real = (x: number): Complex => ({ re: x, im: 0 })
  const frame: Baseband = { re: new Float64Array(frameLength), im: new Float64Array(frameLength), sampleRateHz: sampleRate, centerHz: band.centerHz, real: band.real }
  const times: number[] = []
  const levels: [number[], number[]] = [[], []]
  for (let start = spanStart; start + frameLength <= spanEnd; start += hop) {
    for (let i = 0; i < frameLength; i++) {
      frame.re[i] = band.re[start + i]! * w[i]!
      frame.im[i] = band.im[start + i]! * w[i]!
    }
    const [x1, x2] = basebandDtft(frame, [f1Hz, f2Hz]) as [Complex, Complex]
    const [c1, c2] = solve2(real(w0), wUp, wDown, real(w0), x1, x2)
    times.push((start + frameLength / 2) / sampleRate)
    levels[0].push(20 * Math.log10(Math.max(Math.hypot(c1.re, c1.im), 1e-12)))
    levels[1].push(20 * Math.log10(Math.max(Math.hypot(c2.re, c2.im), 1e-12)))
  }
  if (times.length < 3) return null
  const fits = [fitLine(times, levels[0]), fitLine(times, levels[1])] as const
  const decayDbPerS: [number, number] = [-fits[0].slope, -fits[1].slope]

  // Long window over the span, with each partial's own decaying window gain.
  const length = spanEnd - spanStart
  const long = cachedBlackmanHarris(length)
  // Σ gₖ[n] and the DTFT of each gain sequence gₖ[n] = w[n]·e^{−αₖ(t_n − t_onset)} at the
  // other partial's offset, in one pass without storing the sequences (Goertzel 1958).
  const alpha = decayDbPerS.map(d => d / DB_PER_NEPER)
  let envelope0 = Math.exp((-alpha[0]! * (spanStart - onsetIndex)) / sampleRate)
  let envelope1 = Math.exp((-alpha[1]! * (spanStart - onsetIndex)) / sampleRate)
  const perSample0 = Math.exp(-alpha[0]! / sampleRate)
  const perSample1 = Math.exp(-alpha[1]! / sampleRate)
  const omegaUp = (2 * Math.PI * (f1Hz - f2Hz)) / sampleRate
  const omegaDown = (2 * Math.PI * (f2Hz - f1Hz)) / sampleRate
  const coeffUp = 2 * Math.cos(omegaUp)
  const coeffDown = 2 * Math.cos(omegaDown)
  let g1 = 0
  let g2 = 0
  let up1 = 0
  let up2 = 0
  let down1 = 0
  let down2 = 0
  for (let n = 0; n < length; n++) {
    const gain0 = long[n]! * envelope0
    const gain1 = long[n]! * envelope1
    envelope0 *= perSample0
    envelope1 *= perSample1
    g1 += gain0
    g2 += gain1
    const up0 = gain1 + coeffUp * up1 - up2 // DTFT of g₂ at f1 − f2
    up2 = up1
    up1 = up0
    const down0 = gain0 + coeffDown * down1 - down2 // DTFT of g₁ at f2 − f1
    down2 = down1
    down1 = down0
  }
  const windowed: Baseband = { re: new Float64Array(length), im: new Float64Array(length), sampleRateHz: sampleRate, centerHz: band.centerHz, real: band.real }
  for (let n = 0; n < length; n++) {
    windowed.re[n] = band.re[spanStart + n]! * long[n]!
    windowed.im[n] = band.im[spanStart + n]! * long[n]!
  }
  const [x1, x2] = basebandDtft(windowed, [f1Hz, f2Hz]) as [Complex, Complex]
  const [a1, a2] = solve2(
    real(g1 / 2),
    scale(finishGoertzel(up1, up2, omegaUp, length), 0.5),
    scale(finishGoertzel(down1, down2, omegaDown, length), 0.5),
    real(g2 / 2),
    x1,
    x2,
  )
  return {
    decayDbPerS,
    r2: [fits[0].r2, fits[1].r2],
    amplitude: [Math.hypot(a1.re, a1.im), Math.hypot(a2.re, a2.im)],
  }
}

function scale(a: Complex, s: number): Complex {
  return { re: a.re * s, im: a.im * s }
}
