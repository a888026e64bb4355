import { describe, expect, it } from 'vitest'
import { linkTracks } from '../../../../shared/analysis/linkTracks'
import type { SpectrumFrame } from '../../../../shared/analysis/shortTimePeaks'

const peak = (frequencyHz: number, amplitudeDb = -20) => ({ frequencyHz, amplitudeDb, noiseFloorDb: -100, phaseRad: 0 })
const settings = { maxJumpCents: 10, minJumpHz: 1, maxGapFrames: 1, minFrames: 3 }

/** Three partials (a harmonic series on 220 Hz, gliding down 1 ¢ per frame) and one noise peak per frame. */
function frames(shuffle: boolean): SpectrumFrame[] {
  return Array.from({ length: 6 }, (_, f) => {
    const glide = 2 ** (-f / 1200)
    const peaks = [peak(220 * glide), peak(440 * glide), peak(660 * glide), peak(1000 + 97 * f)]
    return { timeS: f * 0.01, peaks: shuffle ? [peaks[3]!, peaks[1]!, peaks[0]!, peaks[2]!] : peaks }
  })
}

describe('linkTracks', () => {
  it('follows each partial across frames within the jump limit and drops the noise peaks that never continue', () => {
    const tracks = linkTracks(frames(false), settings)
    // source: constructed example — 220, 440 and 660 Hz move 1 ¢ a frame (under the 10 ¢ limit); the noise peak jumps 97 Hz (≈ 160 ¢)
    expect(tracks.map(t => t.length)).toEqual([6, 6, 6])
    expect(tracks.map(t => Math.round(t[0]!.frequencyHz))).toEqual([220, 440, 660])
    for (const t of tracks) expect(t.map(p => p.frame)).toEqual([0, 1, 2, 3, 4, 5])
  })

  it('links a frame whose peaks are not in frequency order the same way', () => {
    const sorted = linkTracks(frames(false), settings).map(t => t.map(p => p.frequencyHz))
    const shuffled = linkTracks(frames(true), settings).map(t => t.map(p => p.frequencyHz))
    // source: constructed example — the order of peaks within a frame carries no meaning
    expect([...shuffled].sort((a, b) => a[0]! - b[0]!)).toEqual(sorted)
  })

  it('gives the nearest peak to a track when two fall within its limit, and opens a new track for the other', () => {
    const two: SpectrumFrame[] = [0, 1, 2].map(f => ({ timeS: f, peaks: f === 0 ? [peak(500)] : [peak(499.9), peak(500.2)] }))
    const tracks = linkTracks(two, { ...settings, minFrames: 1 })
    // source: constructed example — 0.1 Hz is nearer than 0.2 Hz, both within the 1 Hz floor
    expect(tracks.find(t => t.length === 3)!.map(p => p.frequencyHz)).toEqual([500, 499.9, 499.9])
  })
})
