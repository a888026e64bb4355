import type { SpectrumFrame } from './shortTimePeaks'

/** One peak of a track, with the frame it came from. */
export interface TrackPoint {
  frame: number
  timeS: number
  frequencyHz: number
  amplitudeDb: number
  noiseFloorDb: number
}

export interface LinkSettings {
  /** Largest frequency step between linked frames, in cents (already scaled to the hop). */
  maxJumpCents: number
  /** Floor of the step in Hz, so that low partials are not held to less than the bin resolution. */
  minJumpHz: number
  /** Frames a track may miss (a peak dipping under the threshold) before it ends. */
  maxGapFrames: number
  /** Tracks with fewer points are dropped. */
  minFrames: number
}

/**
 * Peak tracking across frames: each peak continues the nearest open track whose last
 * frequency lies within the continuity threshold (closest pairs first, one peak per
 * track), otherwise it opens a new track; tracks shorter than `minFrames` are dropped,
 * which removes the short-lived peaks of noise.
 */
export function linkTracks(frames: SpectrumFrame[], settings: LinkSettings): TrackPoint[][] {
  const done: TrackPoint[][] = []
  let open: { points: TrackPoint[], lastFrame: number }[] = []
  const jumpRatio = 2 ** (settings.maxJumpCents / 1200) - 1

  frames.forEach((frame, f) => {
    const pairs: { track: number, peak: number, distance: number }[] = []
    // Peaks come by ascending frequency (shortTimePeaks): each track looks only at those
    // within its limit, found by bisection, in the same order a full scan would meet them.
    const { peaks } = frame
    let ascending = true
    for (let p = 1; p < peaks.length && ascending; p++) ascending = peaks[p - 1]!.frequencyHz <= peaks[p]!.frequencyHz
    open.forEach((track, t) => {
      const last = track.points[track.points.length - 1]!
      const limit = Math.max(last.frequencyHz * jumpRatio, settings.minJumpHz)
      let p = ascending ? firstAtLeast(peaks, last.frequencyHz - 2 * limit) : 0
      for (; p < peaks.length; p++) {
        const distance = Math.abs(peaks[p]!.frequencyHz - last.frequencyHz)
        if (distance <= limit) pairs.push({ track: t, peak: p, distance })
        else if (ascending && peaks[p]!.frequencyHz > last.frequencyHz) break
      }
    })
    pairs.sort((a, b) => a.distance - b.distance)
    const trackTaken = new Uint8Array(open.length)
    const peakTaken = new Uint8Array(frame.peaks.length)
    for (const pair of pairs) {
      if (trackTaken[pair.track] || peakTaken[pair.peak]) continue
      trackTaken[pair.track] = 1
      peakTaken[pair.peak] = 1
      const peak = frame.peaks[pair.peak]!
      const track = open[pair.track]!
      track.points.push({ frame: f, timeS: frame.timeS, frequencyHz: peak.frequencyHz, amplitudeDb: peak.amplitudeDb, noiseFloorDb: peak.noiseFloorDb })
      track.lastFrame = f
    }
    frame.peaks.forEach((peak, p) => {
      if (peakTaken[p]) return
      open.push({
        points: [{ frame: f, timeS: frame.timeS, frequencyHz: peak.frequencyHz, amplitudeDb: peak.amplitudeDb, noiseFloorDb: peak.noiseFloorDb }],
        lastFrame: f,
      })
    })
    const stillOpen: typeof open = []
    for (const track of open) {
      if (f - track.lastFrame > settings.maxGapFrames) done.push(track.points)
      else stillOpen.push(track)
    }
    open = stillOpen
  })
  for (const track of open) done.push(track.points)
  return done.filter(points => points.length >= settings.minFrames)
}

/** Index of the first peak at or above `frequencyHz` (peaks ascending). */
function firstAtLeast(peaks: readonly { frequencyHz: number }[], frequencyHz: number): number {
  let lo = 0
  let hi = peaks.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (peaks[mid]!.frequencyHz < frequencyHz) lo = mid + 1
    else hi = mid
  }
  return lo
}
