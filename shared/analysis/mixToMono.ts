import type { ChannelSign } from './channelSigns'

/**
 * Mix channels to mono by averaging them (equal weight: a stereo pair of one mic is not
 * panned). `signs` (channelSigns) inverts a channel (−1) or leaves it out (0); all +1 by default.
 * `lags` (alignChannels) takes channel k's sample i + lags[k] for output sample i (0 outside it).
 */
export function mixToMono(channels: readonly ArrayLike<number>[], signs?: readonly ChannelSign[], lags?: readonly number[]): Float64Array {
  if (channels.length === 0) throw new RangeError('mixToMono needs at least one channel')
  if (signs && signs.length !== channels.length) throw new RangeError('one sign per channel')
  if (lags && (lags.length !== channels.length || !lags.every(Number.isInteger))) throw new RangeError('one whole lag per channel')
  const length = channels[0]!.length
  const mono = new Float64Array(length)
  let used = 0
  channels.forEach((channel, k) => {
    if (channel.length !== length) throw new RangeError('all channels must have the same length')
    const sign = signs ? signs[k]! : 1
    if (sign === 0) return
    used++
    const lag = lags?.[k] ?? 0
    for (let i = Math.max(0, -lag); i < Math.min(length, length - lag); i++) mono[i]! += sign * channel[i + lag]!
  })
  if (used > 1) {
    const scale = 1 / used
    for (let i = 0; i < length; i++) mono[i]! *= scale
  }
  return mono
}
