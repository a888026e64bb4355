import { signedChannels, type ChannelSign } from './channelSigns'
import { slidingDotProducts } from './slidingDotProducts'

/** How each channel enters the mono mix: its sign (channelSigns) and its delay behind the loudest channel, in samples. */
export interface ChannelAlignment {
  signs: ChannelSign[]
  /** Channel k's sample i + lags[k] goes with the loudest channel's sample i. */
  lags: number[]
}

export interface AlignSettings {
  /** Largest delay looked for, s (5 ms: 1.7 m of path difference between two microphones). */
  maxLagS: number
  /** Stretch compared, from 10 ms before the loudest sample, s. */
  spanS: number
  /** Least normalised correlation at the best delay for it to be used (else: no delay, channelSigns' sign). */
  minCorrelation: number
}

const DEFAULTS: AlignSettings = { maxLagS: 0.005, spanS: 0.3, minCorrelation: 0.3 }

/**
 * Signs and delays that line the channels up before they are averaged (delay-and-sum). Two
 * microphones at different distances hear the strike at different times; the plain average of
 * a pair delayed by τ cancels every frequency (2n + 1)/(2τ) (a comb filter: 1 kHz, 3 kHz … for
 * 0.5 ms) and with it any partial there. Each live channel's delay is the lag that maximises
 * its correlation with the loudest channel (the steered response power of the pair) over
 * the attack and the first of the ring, on first differences so the broadband attack and the
 * upper partials, not a low fundamental's period, decide it; the sign is that correlation's.
 */
export function alignChannels(channels: readonly ArrayLike<number>[], sampleRate: number, settings: AlignSettings = DEFAULTS): ChannelAlignment {
  const { signs, reference } = signedChannels(channels)
  const lags = channels.map(() => 0)
  const length = channels[0]!.length
  const maxLag = Math.round(settings.maxLagS * sampleRate)
  if (maxLag < 1) return { signs, lags }
  const ref = channels[reference]!
  let peak = 0
  for (let i = 1; i < length; i++) if (Math.abs(ref[i]!) > Math.abs(ref[peak]!)) peak = i
  // Only the stretch compared is differenced (a long many-channel file is never copied whole).
  const start = Math.max(maxLag + 1, peak - Math.round(0.01 * sampleRate))
  const end = Math.min(length - maxLag, start + Math.round(settings.spanS * sampleRate))
  if (end - start < Math.round(0.02 * sampleRate)) return { signs, lags }
  const a = differenced(ref, start, end)
  const energyA = energyOf(a)
  channels.forEach((channel, k) => {
    if (k === reference || signs[k] === 0) return
    const b = differenced(channel, start - maxLag, end + maxLag)
    const products = slidingDotProducts(a, b)
    let best = maxLag
    for (let m = 0; m < products.length; m++) if (Math.abs(products[m]!) > Math.abs(products[best]!)) best = m
    const correlation = products[best]! / Math.sqrt(energyA * energyOf(b.subarray(best, best + a.length)) + Number.MIN_VALUE)
    if (Math.abs(correlation) < settings.minCorrelation) return
    lags[k] = best - maxLag
    signs[k] = correlation < 0 ? -1 : 1
  })
  return { signs, lags }
}

/** x[i] − x[i − 1] for i = from … to − 1 (from ≥ 1). */
function differenced(x: ArrayLike<number>, from: number, to: number): Float64Array {
  const d = new Float64Array(to - from)
  for (let i = from; i < to; i++) d[i - from] = x[i]! - x[i - 1]!
  return d
}

function energyOf(x: ArrayLike<number>): number {
  let e = 0
  for (let i = 0; i < x.length; i++) e += x[i]! * x[i]!
  return e
}
