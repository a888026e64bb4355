import { and, asc, count, desc, eq, isNull, sql } from 'drizzle-orm'
import { pieces, ratioTemplates, serviceRecords, sets, templateVersions, type TemplateVersion } from '../database/schema'
import type { Database, Executor, Transactor } from '../database/client'
import type { CreateSetInput } from '../../shared/schemas/records'
import { noteToFrequencyHz } from '../../shared/analysis/noteToFrequencyHz'
import { expandNoteRange, noteToMidi } from '../../shared/records/noteRange'
import { FINISHED_STAGES } from '../../shared/records/stages'
import { approvalPending } from './approval-window'
import { audit } from './audit'
import { conflictOnDuplicate, fail } from './http-errors'
import { currentVersionOf } from './templates'

/** The target fundamental of a note in a set: equal temperament from the set's A4, plus any per-note offset. */
export function targetFor(note: string, referenceHz: number, offsets: Record<string, number>): number {
  return noteToFrequencyHz(note, referenceHz) * 2 ** ((offsets[note] ?? 0) / 1200)
}

/** Creates a set and all its pieces, from the note range, in one transaction. */
export async function createSet(db: Transactor, workshopId: string, actorId: string, input: CreateSetInput) {
  let notes: string[]
  try {
    notes = expandNoteRange(input.fromNote, input.toNote, input.chromatic)
  }
  catch (error) {
    fail(400, (error as Error).message)
  }
  if (notes.length === 0) fail(400, 'The range holds no notes.')
  const duplicate = `A set with serial number ${input.serial} already exists.`
  // The check gives the usual answer; the unique index decides when two requests race.
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const [dup] = await tx.select({ id: sets.id }).from(sets).where(and(eq(sets.workshopId, workshopId), eq(sets.serial, input.serial)))
    if (dup) fail(409, duplicate)
    const defaultVersion = await currentVersionOf(tx, workshopId, input.templateId)
    const registerVersions: { from: number, to: number, version: TemplateVersion }[] = []
    for (const r of input.registers) {
      registerVersions.push({ from: noteToMidi(r.fromNote), to: noteToMidi(r.toNote), version: await currentVersionOf(tx, workshopId, r.templateId) })
    }
    const [set] = await tx.insert(sets).values({
      workshopId, name: input.name, model: input.model, serial: input.serial,
      buyerName: input.buyer.name, buyerOrganisation: input.buyer.organisation, buyerEmail: input.buyer.email,
      referenceHz: input.referenceHz, temperament: input.temperament, noteOffsetsCents: input.noteOffsetsCents,
      fromNote: input.fromNote, toNote: input.toNote, chromatic: input.chromatic, templateId: input.templateId,
      registers: input.registers, dueOn: input.dueOn ?? null,
    }).returning()
    const rows = notes.map((note, i) => {
      const midi = noteToMidi(note)
      const register = registerVersions.find(r => midi >= r.from && midi <= r.to)
      return {
        workshopId, setId: set!.id, position: i + 1, note, midi,
        targetHz: targetFor(note, input.referenceHz, input.noteOffsetsCents),
        templateVersionId: (register?.version ?? defaultVersion).id,
      }
    })
    await tx.insert(pieces).values(rows)
    await audit(tx, { workshopId, actorId, action: 'set.create', subjectType: 'set', subjectId: set!.id, details: { pieces: rows.length } })
    return { ...set!, pieceCount: rows.length }
  }), duplicate, 'sets_workshop_serial_key')
}

/** Sets with their pieces counted by stage, and the open service visit of a set booked back in. */
export async function listSets(db: Executor, workshopId: string) {
  const rows = await db.select().from(sets).where(eq(sets.workshopId, workshopId)).orderBy(desc(sets.createdAt))
  const counts = await db.select({ setId: pieces.setId, stage: pieces.stage, n: count(), pending: sql<number>`count(*) filter (where ${approvalPending()})::int` }).from(pieces)
    .where(eq(pieces.workshopId, workshopId)).groupBy(pieces.setId, pieces.stage)
  const visits = await db.select({ setId: serviceRecords.setId, kind: serviceRecords.kind, receivedOn: serviceRecords.receivedOn }).from(serviceRecords)
    .where(and(eq(serviceRecords.workshopId, workshopId), isNull(serviceRecords.closedAt)))
  const inService = new Map(visits.map(v => [v.setId, { kind: v.kind, receivedOn: v.receivedOn }]))
  return rows.map((s) => {
    const byStage: Record<string, number> = {}
    let pending = 0
    for (const c of counts) {
      if (c.setId !== s.id) continue
      byStage[c.stage] = c.n
      pending += c.pending
    }
    return { ...s, byStage, ...progress(byStage, pending), inService: inService.get(s.id) ?? null }
  })
}

/** Progress toward certifiable: every non-scrapped piece approved (or beyond), no approval still undoable. */
export function progress(byStage: Record<string, number>, pendingApprovalCount = 0) {
  const total = Object.values(byStage).reduce((a, b) => a + b, 0)
  const scrapped = byStage.scrapped ?? 0
  const done = FINISHED_STAGES.reduce((n, stage) => n + (byStage[stage] ?? 0), 0)
  const live = total - scrapped
  return { pieceCount: total, approvedCount: done, liveCount: live, pendingApprovalCount, certifiable: live > 0 && done === live && pendingApprovalCount === 0 }
}

export async function getSet(db: Executor, workshopId: string, setId: string) {
  const [set] = await db.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, workshopId)))
  if (!set) fail(404, 'No such set in this workshop.')
  const rows = await db.select({
    id: pieces.id, position: pieces.position, note: pieces.note, targetHz: pieces.targetHz, stage: pieces.stage,
    latestVerdict: pieces.latestVerdict, latestWorstCents: pieces.latestWorstCents, strikeCount: pieces.strikeCount,
    assigneeId: pieces.assigneeId, templateVersionId: pieces.templateVersionId, templateName: templateVersions.name,
    templateVersion: templateVersions.version, lotId: pieces.lotId, approvalPending: approvalPending(),
  }).from(pieces)
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .where(and(eq(pieces.setId, setId), eq(pieces.workshopId, workshopId)))
    .orderBy(asc(pieces.position))
  const byStage: Record<string, number> = {}
  for (const p of rows) byStage[p.stage] = (byStage[p.stage] ?? 0) + 1
  const [template] = set.templateId
    ? await db.select({ name: ratioTemplates.name }).from(ratioTemplates).where(eq(ratioTemplates.id, set.templateId))
    : []
  return { ...set, templateName: template?.name ?? null, pieces: rows, byStage, ...progress(byStage, rows.filter(p => p.approvalPending).length) }
}

/** Marks a certified set shipped (office or owner), moving its certified pieces along. */
export async function shipSet(db: Database, workshopId: string, actorId: string, setId: string) {
  return db.transaction(async (tx) => {
    const [set] = await tx.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, workshopId))).for('update')
    if (!set) fail(404, 'No such set in this workshop.')
    if (set.shippedAt) fail(409, 'This set is already marked shipped.')
    const [notReady] = await tx.select({ n: count() }).from(pieces)
      .where(and(eq(pieces.setId, setId), sql`${pieces.stage} not in ('certified', 'scrapped')`))
    if ((notReady?.n ?? 0) > 0) fail(409, 'Only a certified set can be shipped: certify every piece first.')
    await tx.update(pieces).set({ stage: 'shipped', updatedAt: new Date() }).where(and(eq(pieces.setId, setId), eq(pieces.stage, 'certified')))
    const [updated] = await tx.update(sets).set({ shippedAt: new Date() }).where(eq(sets.id, setId)).returning()
    await audit(tx, { workshopId, actorId, action: 'set.ship', subjectType: 'set', subjectId: setId, fromState: 'certified', toState: 'shipped' })
    return updated!
  })
}
