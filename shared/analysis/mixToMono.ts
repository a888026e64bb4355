/** Mix channels to mono by averaging them (equal weight: a stereo pair of one mic is not panned). */
export function mixToMono(channels: readonly ArrayLike<number>[]): Float64Array {
  if (channels.length === 0) throw new RangeError('mixToMono needs at least one channel')
  const length = channels[0]!.length
  const mono = new Float64Array(length)
  for (const channel of channels) {
    if (channel.length !== length) throw new RangeError('all channels must have the same length')
    for (let i = 0; i < length; i++) mono[i]! += channel[i]!
  }
  if (channels.length > 1) {
    const scale = 1 / channels.length
    for (let i = 0; i < length; i++) mono[i]! *= scale
  }
  return mono
}
