import { notesFromBlank } from '#shared/barModel/notesFromBlank'
import { uniformBarF1Hz, type UniformBarMaterial } from '#shared/barModel/uniformBarF1Hz'
import { frequencyToNote } from '#shared/analysis/frequencyToNote'
import { noteToFrequencyHz } from '#shared/analysis/noteToFrequencyHz'
import { expandNoteRange } from '#shared/records/noteRange'

/** A range of notes to try a blank against: a set's register, or notes typed in, at a reference pitch. */
export interface NoteRangeChoice { fromNote: string, toNote: string, chromatic: boolean, referenceHz: number }

/**
 * What a blank can become: the first mode of a finished uniform bar of any length cut from it,
 * and the notes of a range whose uniform-bar length fits within the blank (with the length each needs).
 * A range that is not one gives its plain sentence instead.
 */
export function useBlankNotes(blank: MaybeRefOrGetter<UniformBarMaterial & { lengthMm: number }>, lengthMm: Ref<number | null>, range: MaybeRefOrGetter<NoteRangeChoice | null>) {
  const predicted = computed(() => {
    const l = lengthMm.value
    if (!l || !(l > 0)) return null
    const hz = uniformBarF1Hz(l, toValue(blank))
    return { hz, nearest: frequencyToNote(hz, toValue(range)?.referenceHz ?? 440) }
  })
  const notes = computed(() => {
    const r = toValue(range)
    if (!r) return { list: [], problem: null }
    try {
      const names = expandNoteRange(r.fromNote, r.toNote, r.chromatic)
      return { list: notesFromBlank(names.map(note => ({ note, targetHz: noteToFrequencyHz(note, r.referenceHz) })), toValue(blank)), problem: null }
    }
    catch (error) {
      return { list: [], problem: error instanceof Error ? error.message : 'That range cannot be read.' }
    }
  })
  return { predicted, notes }
}
