import { and, eq } from 'drizzle-orm'
import { lots, pieces, templateVersions } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { defaultBarGeometry, FAMILY_MATERIAL, isModelledFamily } from '../../shared/barModel/defaultBarGeometry'
import { barMaterialIn, type BarMaterial } from '../../shared/records/barMaterials'
import type { TemplateFamily } from '../../shared/records/lists'
import type { PieceGeometry, PieceGeometryInput } from '../../shared/schemas/pieceGeometry'
import type { Member } from './auth'
import { audit } from './audit'
import { fail } from './http-errors'

/** A piece's geometry for the bar model: entered by hand, or the register's default for its note; null with the reason when there is none. */
export interface ResolvedGeometry {
  pieceId: string
  family: TemplateFamily
  material: BarMaterial | null
  source: 'piece' | 'register' | null
  geometry: PieceGeometry | null
  problem: string | null
}

/** The piece (of this workshop, else 404) with what its geometry is derived from. */
async function pieceForGeometry(db: Executor, workshopId: string, pieceId: string) {
  const [row] = await db.select({
    id: pieces.id, targetHz: pieces.targetHz, geometry: pieces.geometry, material: pieces.material,
    family: templateVersions.family, lotSpecies: lots.species, lotMaterial: lots.material,
  }).from(pieces)
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .leftJoin(lots, eq(lots.id, pieces.lotId))
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, workshopId)))
  if (!row) fail(404, 'No such piece in this workshop.')
  return row
}

/** The geometry the bar model uses for a piece: its own, else the default of its family, note and material. */
export async function resolvePieceGeometry(db: Executor, workshopId: string, pieceId: string): Promise<ResolvedGeometry> {
  const row = await pieceForGeometry(db, workshopId, pieceId)
  const base = { pieceId: row.id, family: row.family }
  if (row.geometry && row.material) return { ...base, material: row.material, source: 'piece', geometry: row.geometry, problem: null }
  if (!isModelledFamily(row.family)) {
    return { ...base, material: null, source: null, geometry: null, problem: `The bar model covers bars and plates; this piece's template is for a ${row.family}.` }
  }
  const material = row.material ?? barMaterialIn(row.lotSpecies) ?? barMaterialIn(row.lotMaterial) ?? FAMILY_MATERIAL[row.family]
  try {
    return { ...base, material, source: 'register', geometry: defaultBarGeometry(row.family, row.targetHz, material), problem: null }
  }
  catch (error) {
    if (error instanceof RangeError) return { ...base, material, source: null, geometry: null, problem: error.message }
    throw error
  }
}

/** Stores a piece's geometry and material entered by hand (audited). */
export function setPieceGeometry(db: Database, member: Member, pieceId: string, input: PieceGeometryInput) {
  return db.transaction(tx => storeGeometry(tx, member, pieceId, input))
}

async function storeGeometry(db: Executor, member: Member, pieceId: string, input: PieceGeometryInput) {
  const row = await pieceForGeometry(db, member.workshopId, pieceId)
  if (!isModelledFamily(row.family)) fail(422, `The bar model covers bars and plates; this piece's template is for a ${row.family}.`)
  await db.update(pieces).set({ geometry: input.geometry, material: input.material, updatedAt: new Date() })
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, member.workshopId)))
  await audit(db, { workshopId: member.workshopId, actorId: member.userId, action: 'piece.geometry', subjectType: 'piece', subjectId: pieceId, details: { material: input.material, lengthMm: input.geometry.lengthMm } })
  return resolvePieceGeometry(db, member.workshopId, pieceId)
}
