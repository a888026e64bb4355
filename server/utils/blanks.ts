import { and, count, desc, eq, lt, ne } from 'drizzle-orm'
import { blanks, lots, pieces, templateVersions } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { defaultBarGeometry, isModelledFamily } from '../../shared/barModel/defaultBarGeometry'
import type { BarMaterial } from '../../shared/records/barMaterials'
import type { BlankListQuery, BlankRecordInput } from '../../shared/schemas/blankRecord'
import type { Member } from './auth'
import { audit } from './audit'
import { gradeBlankOffThread } from './bar-model'
import { workshopBlankThresholds } from './blank-thresholds'
import { conflictOnDuplicate, fail } from './http-errors'

/** Blanks listed at once (the chart of a species reads these). */
const LISTED_BLANKS = 200

/** Where a blank stands against the workshop's earlier blanks of its species: how many, and how many are less stiff per density. */
async function standingOf(db: Executor, workshopId: string, species: BarMaterial, blankId: string, specificModulus: number) {
  const same = and(eq(blanks.workshopId, workshopId), eq(blanks.species, species), ne(blanks.id, blankId))
  const [[all], [below]] = await Promise.all([
    db.select({ n: count() }).from(blanks).where(same),
    db.select({ n: count() }).from(blanks).where(and(same, lt(blanks.specificModulus, specificModulus))),
  ])
  const earlier = all?.n ?? 0
  return { earlier, lessStiff: below?.n ?? 0, percentile: earlier === 0 ? null : Math.round((100 * (below?.n ?? 0)) / earlier) }
}

/** Grades a blank in the bar-model worker and records it (against its lot, which must be this workshop's). */
export async function recordBlank(db: Database, member: Member, input: BlankRecordInput) {
  if (input.lotId) {
    const [lot] = await db.select({ id: lots.id }).from(lots).where(and(eq(lots.id, input.lotId), eq(lots.workshopId, member.workshopId)))
    if (!lot) fail(404, 'No such lot in this workshop.')
  }
  const graded = await gradeBlankOffThread(input, await workshopBlankThresholds(db, member.workshopId))
  const grade = graded.grade!
  const [row] = await db.insert(blanks).values({
    workshopId: member.workshopId, lotId: input.lotId ?? null, species: input.species,
    lengthMm: input.lengthMm, widthMm: input.widthMm, thicknessMm: input.thicknessMm, massG: input.massG,
    f1Hz: input.f1Hz, decayDbPerS: input.decayDbPerS ?? null,
    densityKgM3: graded.densityKgM3, youngsModulusGPa: graded.youngsModulusGPa, youngsModulusTimoshenkoGPa: graded.youngsModulusTimoshenkoGPa,
    specificModulus: graded.specificModulus, lossFactor: graded.lossFactor, rank: grade.rank, grade, createdBy: member.userId,
  }).returning()
  return { ...row!, standing: await standingOf(db, member.workshopId, input.species, row!.id, graded.specificModulus) }
}

/** The workshop's blanks, newest first, of one species and one lot when given. */
export function listBlanks(db: Executor, workshopId: string, filter: BlankListQuery = {}) {
  const where = and(
    eq(blanks.workshopId, workshopId),
    filter.species ? eq(blanks.species, filter.species) : undefined,
    filter.lotId ? eq(blanks.lotId, filter.lotId) : undefined,
  )
  return db.select().from(blanks).where(where).orderBy(desc(blanks.createdAt)).limit(LISTED_BLANKS)
}

/** The register's shape for the piece's note in the blank's measured material; a note out of the model's reach is a 422. */
function geometryOf(family: Parameters<typeof defaultBarGeometry>[0], targetHz: number, blank: { species: BarMaterial, densityKgM3: number, youngsModulusGPa: number }) {
  try {
    return defaultBarGeometry(family, targetHz, blank.species, blank)
  }
  catch (error) {
    if (error instanceof RangeError) fail(422, error.message)
    throw error
  }
}

/**
 * A blank becomes a piece: the piece takes the blank's lot, species and a geometry of the
 * register's shape in the blank's measured density and stiffness. One blank per piece and one
 * piece per blank (409 otherwise); all or nothing.
 */
export function makePieceFromBlank(db: Database, member: Member, blankId: string, pieceId: string) {
  const taken = 'That piece is already made from another blank.'
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const [blank] = await tx.select().from(blanks).where(and(eq(blanks.id, blankId), eq(blanks.workshopId, member.workshopId))).for('update')
    if (!blank) fail(404, 'No such blank in this workshop.')
    if (blank.pieceId) fail(409, blank.pieceId === pieceId ? 'This blank is already that piece.' : 'This blank is already another piece.')
    const [piece] = await tx.select({ id: pieces.id, targetHz: pieces.targetHz, lotId: pieces.lotId, family: templateVersions.family })
      .from(pieces).innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
      .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, member.workshopId))).for('update', { of: pieces })
    if (!piece) fail(404, 'No such piece in this workshop.')
    if (!isModelledFamily(piece.family)) fail(422, `A blank becomes a bar or a plate; this piece's template is for a ${piece.family}.`)
    const geometry = geometryOf(piece.family, piece.targetHz, blank)
    await tx.update(blanks).set({ pieceId }).where(eq(blanks.id, blankId))
    await tx.update(pieces).set({ lotId: blank.lotId ?? piece.lotId, material: blank.species, geometry, updatedAt: new Date() }).where(eq(pieces.id, pieceId))
    await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'blank.piece', subjectType: 'blank', subjectId: blankId, details: { pieceId } })
    return { blankId, pieceId, lotId: blank.lotId ?? piece.lotId, material: blank.species, geometry }
  }), taken, 'blanks_piece_key')
}
