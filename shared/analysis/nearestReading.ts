/**
 * Index of the reading nearest to `frequencyHz` closer than `reachHz`, of those `eligible`
 * admits, or −1 when none is (the first of equally near ones). The bands' merge and the
 * settled-track check both ask this.
 */
export function nearestReading(
  readings: readonly { frequencyHz: number }[],
  frequencyHz: number,
  reachHz: number,
  eligible: (index: number) => boolean = () => true,
): number {
  let nearest = -1
  let nearestHz = Infinity
  for (let i = 0; i < readings.length; i++) {
    if (!eligible(i)) continue
    const d = Math.abs(readings[i]!.frequencyHz - frequencyHz)
    if (d < reachHz && d < nearestHz) {
      nearest = i
      nearestHz = d
    }
  }
  return nearest
}
