/** How each channel enters the mono mix: +1 as it is, −1 inverted, 0 left out. */
export type ChannelSign = -1 | 0 | 1

/** A channel this far under the loudest one (energy, dB) is a dead input: it only adds noise and halves the level. */
const DEAD_CHANNEL_DB = 40

/**
 * The sign of each channel in the mono mix. The loudest channel (by energy about its mean)
 * is the reference; a channel whose correlation with it is negative is inverted, because a
 * second microphone or a cable wired with the opposite polarity would otherwise cancel the
 * strike in the average (the sign that maximises the energy of the sum of two channels is the
 * sign of their correlation); a channel 40 dB or more under the reference is left out.
 */
export function channelSigns(channels: readonly ArrayLike<number>[]): ChannelSign[] {
  return signedChannels(channels).signs
}

/** channelSigns' signs and the loudest channel they refer to. */
export function signedChannels(channels: readonly ArrayLike<number>[]): { signs: ChannelSign[], reference: number } {
  if (channels.length === 0) throw new RangeError('channelSigns needs at least one channel')
  const length = channels[0]!.length
  const { means, energies } = centredEnergies(channels)
  const reference = loudestChannel(energies)
  const ref = channels[reference]!
  const deadBelow = energies[reference]! * 10 ** (-DEAD_CHANNEL_DB / 10)
  const signs = channels.map((c, k): ChannelSign => {
    if (k === reference) return 1
    if (!(energies[k]! > deadBelow)) return 0
    let product = 0
    for (let i = 0; i < length; i++) product += (c[i]! - means[k]!) * (ref[i]! - means[reference]!)
    return product < 0 ? -1 : 1
  })
  return { signs, reference }
}

/** Index of the loudest channel, given each channel's energy about its mean (the first of equals). */
function loudestChannel(energies: readonly number[]): number {
  let reference = 0
  for (let k = 1; k < energies.length; k++) if (energies[k]! > energies[reference]!) reference = k
  return reference
}

/** Each channel's mean and its energy about that mean. */
function centredEnergies(channels: readonly ArrayLike<number>[]): { means: number[], energies: number[] } {
  const length = channels[0]?.length ?? 0
  const means = channels.map((c) => {
    let s = 0
    for (let i = 0; i < length; i++) s += c[i]!
    return length > 0 ? s / length : 0
  })
  const energies = channels.map((c, k) => {
    let e = 0
    for (let i = 0; i < length; i++) e += (c[i]! - means[k]!) ** 2
    return e
  })
  return { means, energies }
}
