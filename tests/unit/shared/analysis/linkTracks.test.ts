import { describe, expect, it } from 'vitest'
import { linkTracks } from '../../../../shared/analysis/linkTracks'
import type { SpectrumFrame } from '../../../../shared/analysis/shortTimePeaks'

const settings = { maxJumpCents: 10, minJumpHz: 2, maxGapFrames: 2, minFrames: 3 }
const hopS = 0.01

/** Frames at `hopS` whose peaks are at the given frequencies (−20 dB over a −100 dB floor). */
function frames(...frequencies: number[][]): SpectrumFrame[] {
  return frequencies.map((list, f) => ({
    timeS: f * hopS,
    peaks: list.map(frequencyHz => ({ frequencyHz, amplitudeDb: -20, noiseFloorDb: -100, phaseRad: 0 })),
  }))
}

describe('linkTracks', () => {
  it('follows two steady partials and a slow glide, each in its own track', () => {
    // 440 Hz gliding 2 ¢ a frame (within 10 ¢); 1000 Hz steady.
    const glide = (f: number) => 440 * 2 ** ((2 * f) / 1200)
    const tracks = linkTracks(frames(...Array.from({ length: 6 }, (_, f) => [glide(f), 1000])), settings)
    expect(tracks).toHaveLength(2)
    const byStart = tracks.sort((a, b) => a[0]!.frequencyHz - b[0]!.frequencyHz)
    expect(byStart[0]!.map(p => p.frequencyHz)).toEqual(Array.from({ length: 6 }, (_, f) => glide(f)))
    expect(byStart[1]!.map(p => p.frame)).toEqual([0, 1, 2, 3, 4, 5])
    expect(byStart[1]![3]!.timeS).toBeCloseTo(0.03, 12)
  })

  it('does not follow a jump over the continuity limit, and holds low partials to at least minJumpHz', () => {
    // source: definition of the cent; 2^(10/1200) − 1 ≈ 0.58 %: 1000 → 1005 Hz is 8.6 ¢, 1000 → 1007 Hz is 12 ¢
    expect(linkTracks(frames([1000], [1005], [1010]), settings)).toHaveLength(1)
    expect(linkTracks(frames([1000], [1007], [1014], [1021]), { ...settings, minFrames: 1 })).toHaveLength(4)
    // At 100 Hz, 10 ¢ is 0.58 Hz, but the floor lets 1.5 Hz steps through.
    expect(linkTracks(frames([100], [101.5], [103]), settings)).toHaveLength(1)
  })

  it('bridges a gap of up to maxGapFrames and drops tracks that are too short', () => {
    expect(linkTracks(frames([500], [], [], [500], [500]), settings).map(t => t.length)).toEqual([3])
    expect(linkTracks(frames([500], [], [], [], [500], [500]), settings)).toEqual([])
    // A noise peak in one frame is no track.
    expect(linkTracks(frames([500], [500, 777], [500]), settings).map(t => t[0]!.frequencyHz)).toEqual([500])
  })

  it('gives each peak to the nearest track, one peak per track', () => {
    const tracks = linkTracks(frames([600, 601.5], [601.4, 600.1], [600.2, 601.3]), { ...settings, minFrames: 3 })
    const sorted = tracks.sort((a, b) => a[0]!.frequencyHz - b[0]!.frequencyHz)
    expect(sorted.map(t => t.map(p => p.frequencyHz))).toEqual([[600, 600.1, 600.2], [601.5, 601.4, 601.3]])
  })

  it('links a frame whose peaks are not in frequency order the same way', () => {
    // source: constructed example — the order of peaks within a frame carries no meaning
    const inOrder = frames([220, 440, 1000], [220.1, 440.2, 1097], [220.2, 440.4, 1194])
    const shuffled = inOrder.map(frame => ({ ...frame, peaks: [...frame.peaks].reverse() }))
    const firsts = (f: SpectrumFrame[]) => linkTracks(f, settings).map(t => t.map(p => p.frequencyHz)).sort((a, b) => a[0]! - b[0]!)
    expect(firsts(shuffled)).toEqual(firsts(inOrder))
    expect(firsts(inOrder)).toHaveLength(2)
  })
})
