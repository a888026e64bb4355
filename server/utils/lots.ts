import { and, asc, count, countDistinct, desc, eq, inArray } from 'drizzle-orm'
import { lots, pieces, sets } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { LotInput, LotPatch } from '../../shared/schemas/records'
import { permitProblem } from '../../shared/records/listedTimber'
import { audit } from './audit'
import { conflictOnDuplicate, fail } from './http-errors'

const duplicateSentence = (code: string) => `A lot with code ${code} already exists.`

/** The workshop's lots, newest first, each with how many pieces and sets use it. */
export async function listLots(db: Executor, workshopId: string) {
  const rows = await db.select().from(lots).where(eq(lots.workshopId, workshopId)).orderBy(desc(lots.createdAt))
  const uses = await db.select({ lotId: pieces.lotId, pieceCount: count(), setCount: countDistinct(pieces.setId) }).from(pieces)
    .where(eq(pieces.workshopId, workshopId)).groupBy(pieces.lotId)
  const byLot = new Map(uses.map(u => [u.lotId, u]))
  return rows.map(l => ({ ...l, pieceCount: byLot.get(l.id)?.pieceCount ?? 0, setCount: byLot.get(l.id)?.setCount ?? 0 }))
}

async function findLot(db: Executor, workshopId: string, id: string) {
  const [lot] = await db.select().from(lots).where(and(eq(lots.id, id), eq(lots.workshopId, workshopId)))
  if (!lot) fail(404, 'No such lot in this workshop.')
  return lot
}

/** A lot with the pieces made from it (in set order) and the sets they belong to. */
export async function getLot(db: Executor, workshopId: string, id: string) {
  const lot = await findLot(db, workshopId, id)
  const used = await db.select({
    id: pieces.id, note: pieces.note, position: pieces.position, stage: pieces.stage,
    setId: sets.id, setName: sets.name, serial: sets.serial,
  }).from(pieces).innerJoin(sets, eq(sets.id, pieces.setId))
    .where(and(eq(pieces.lotId, id), eq(pieces.workshopId, workshopId)))
    .orderBy(asc(sets.serial), asc(pieces.position))
  const setsById = new Map<string, { id: string, name: string, serial: string, pieceCount: number }>()
  for (const p of used) {
    const s = setsById.get(p.setId) ?? { id: p.setId, name: p.setName, serial: p.serial, pieceCount: 0 }
    s.pieceCount++
    setsById.set(p.setId, s)
  }
  return { ...lot, pieces: used, sets: [...setsById.values()] }
}

export function createLot(db: Database, workshopId: string, actorId: string, input: LotInput) {
  // The check gives the usual answer; the unique index decides when two requests race.
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const [dup] = await tx.select({ id: lots.id }).from(lots).where(and(eq(lots.workshopId, workshopId), eq(lots.code, input.code)))
    if (dup) fail(409, duplicateSentence(input.code))
    const [lot] = await tx.insert(lots).values({ ...input, workshopId, receivedOn: input.receivedOn ?? null, moisturePct: input.moisturePct ?? null }).returning()
    await audit(tx, { workshopId, actorId, action: 'lot.create', subjectType: 'lot', subjectId: lot!.id })
    return lot!
  }), duplicateSentence(input.code), 'lots_workshop_code_key')
}

/** Edits the named fields of a lot under its row lock; the permit rule holds for the lot as edited. */
export function updateLot(db: Database, workshopId: string, actorId: string, id: string, patch: LotPatch) {
  const sentence = duplicateSentence(patch.code ?? '')
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const [lot] = await tx.select().from(lots).where(and(eq(lots.id, id), eq(lots.workshopId, workshopId))).for('update')
    if (!lot) fail(404, 'No such lot in this workshop.')
    const merged = { ...lot, ...patch }
    const problem = permitProblem(merged.species, merged.permitNumber)
    if (problem) fail(400, problem)
    if (patch.code && patch.code !== lot.code) {
      const [dup] = await tx.select({ id: lots.id }).from(lots).where(and(eq(lots.workshopId, workshopId), eq(lots.code, patch.code)))
      if (dup) fail(409, sentence)
    }
    const changed = Object.keys(patch).filter(k => patch[k as keyof LotPatch] !== lot[k as keyof LotPatch])
    const [updated] = await tx.update(lots).set(patch).where(eq(lots.id, id)).returning()
    await audit(tx, { workshopId, actorId, action: 'lot.update', subjectType: 'lot', subjectId: id, details: { changed } })
    return updated!
  }), sentence, 'lots_workshop_code_key')
}

/** Records that these pieces are made from the lot (all of this workshop, in one transaction). */
export async function assignLot(db: Database, workshopId: string, actorId: string, id: string, pieceIds: string[]) {
  return db.transaction(async (tx) => {
    await findLot(tx, workshopId, id)
    const unique = [...new Set(pieceIds)]
    const found = await tx.select({ id: pieces.id }).from(pieces).where(and(inArray(pieces.id, unique), eq(pieces.workshopId, workshopId))).for('update')
    if (found.length !== unique.length) fail(404, 'A piece in the list is not in this workshop.')
    await tx.update(pieces).set({ lotId: id, updatedAt: new Date() }).where(and(inArray(pieces.id, unique), eq(pieces.workshopId, workshopId)))
    await audit(tx, { workshopId, actorId, action: 'lot.assign', subjectType: 'lot', subjectId: id, details: { pieces: unique.length } })
    return { lotId: id, pieceCount: unique.length }
  })
}
