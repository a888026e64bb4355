import { and, asc, desc, eq } from 'drizzle-orm'
import { ratioTemplates, templateVersions, type TemplateVersion } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { STARTER_TEMPLATES } from '../data/starter-templates'
import type { TemplateInput } from '../../shared/schemas/records'
import { audit } from './audit'
import { fail } from './http-errors'

async function insertVersion(tx: Executor, workshopId: string, templateId: string, version: number, actorId: string | null, input: TemplateInput) {
  const [row] = await tx.insert(templateVersions).values({
    workshopId, templateId, version, name: input.name, family: input.family, partials: input.partials,
    searchWindowCents: input.searchWindowCents, referenceTemperatureC: input.referenceTemperatureC,
    temperatureCoefficientCentsPerC: input.temperatureCoefficientCentsPerC, decisionRule: input.decisionRule, notes: input.notes, source: input.source,
    createdBy: actorId,
  }).returning()
  return row!
}

export async function createTemplateIn(tx: Executor, workshopId: string, actorId: string | null, input: TemplateInput) {
  const [template] = await tx.insert(ratioTemplates).values({ workshopId, family: input.family, name: input.name, currentVersion: 1 }).returning()
  const version = await insertVersion(tx, workshopId, template!.id, 1, actorId, input)
  await audit(tx, { workshopId, actorId, action: 'template.create', subjectType: 'template', subjectId: template!.id, toState: 'v1' })
  return { ...template!, current: version }
}

export function createTemplate(db: Database, workshopId: string, actorId: string, input: TemplateInput) {
  return db.transaction(tx => createTemplateIn(tx, workshopId, actorId, input))
}

/** Editing makes a new version; pieces keep pointing at the version they were measured against. */
export async function updateTemplate(db: Database, workshopId: string, actorId: string, templateId: string, input: TemplateInput) {
  return db.transaction(async (tx) => {
    const [template] = await tx.select().from(ratioTemplates)
      .where(and(eq(ratioTemplates.id, templateId), eq(ratioTemplates.workshopId, workshopId))).for('update')
    if (!template) fail(404, 'No such template in this workshop.')
    const next = template.currentVersion + 1
    const version = await insertVersion(tx, workshopId, templateId, next, actorId, input)
    const [updated] = await tx.update(ratioTemplates).set({ currentVersion: next, name: input.name, family: input.family })
      .where(eq(ratioTemplates.id, templateId)).returning()
    await audit(tx, { workshopId, actorId, action: 'template.version', subjectType: 'template', subjectId: templateId, fromState: `v${template.currentVersion}`, toState: `v${next}` })
    return { ...updated!, current: version }
  })
}

/** Templates with their current version. */
export async function listTemplates(db: Executor, workshopId: string) {
  const rows = await db.select({ template: ratioTemplates, current: templateVersions })
    .from(ratioTemplates)
    .innerJoin(templateVersions, and(eq(templateVersions.templateId, ratioTemplates.id), eq(templateVersions.version, ratioTemplates.currentVersion)))
    .where(and(eq(ratioTemplates.workshopId, workshopId), eq(ratioTemplates.archived, false)))
    .orderBy(asc(ratioTemplates.family), asc(ratioTemplates.name))
  return rows.map(r => ({ ...r.template, current: r.current }))
}

export async function getTemplate(db: Executor, workshopId: string, templateId: string) {
  const [template] = await db.select().from(ratioTemplates)
    .where(and(eq(ratioTemplates.id, templateId), eq(ratioTemplates.workshopId, workshopId)))
  if (!template) fail(404, 'No such template in this workshop.')
  const versions = await db.select().from(templateVersions)
    .where(eq(templateVersions.templateId, templateId)).orderBy(desc(templateVersions.version))
  return { ...template, current: versions[0]!, versions }
}

export async function currentVersionOf(db: Executor, workshopId: string, templateId: string): Promise<TemplateVersion> {
  const [row] = await db.select({ v: templateVersions }).from(ratioTemplates)
    .innerJoin(templateVersions, and(eq(templateVersions.templateId, ratioTemplates.id), eq(templateVersions.version, ratioTemplates.currentVersion)))
    .where(and(eq(ratioTemplates.id, templateId), eq(ratioTemplates.workshopId, workshopId)))
  if (!row) fail(404, 'No such template in this workshop.')
  return row.v
}

/** What every new workshop starts with: the starter ratio-template library, added in the transaction that creates it. */
export async function addStarterTemplates(tx: Executor, workshopId: string, actorId: string | null) {
  for (const t of STARTER_TEMPLATES) await createTemplateIn(tx, workshopId, actorId, { ...t, decisionRule: 'simple' })
}
