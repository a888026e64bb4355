import { z } from 'zod'
import { BuyerSchema, CreateSetSchema } from './records'

/** The fields of a set the office may change after the order was entered. */
export const SET_EDIT_FIELDS = ['buyerName', 'buyerOrganisation', 'buyerEmail', 'serial', 'model', 'dueOn', 'notes'] as const
export type SetEditField = (typeof SET_EDIT_FIELDS)[number]

/** What each editable field is called in an audit line or a re-issue's summary. */
export const SET_FIELD_WORDS: Record<SetEditField, string> = {
  buyerName: 'buyer',
  buyerOrganisation: 'buyer organisation',
  buyerEmail: 'buyer e-mail',
  serial: 'serial',
  model: 'model',
  dueOn: 'due date',
  notes: 'notes',
}

/** PATCH /api/sets/{id}: every field optional, at least one; the buyer's parts may be sent alone. */
export const UpdateSetSchema = z.object({
  buyer: BuyerSchema.partial().strict().optional(),
  serial: CreateSetSchema.shape.serial.optional(),
  model: CreateSetSchema.shape.model.optional(),
  dueOn: CreateSetSchema.shape.dueOn,
  notes: z.string().trim().max(2000, 'Notes are at most 2000 characters').optional(),
}).strict().refine(
  b => b.serial !== undefined || b.model !== undefined || b.dueOn !== undefined || b.notes !== undefined
    || (b.buyer !== undefined && Object.values(b.buyer).some(v => v !== undefined)),
  'Change at least one of buyer, serial, model, due date or notes',
)
export type UpdateSetInput = z.infer<typeof UpdateSetSchema>

/** The set's columns an edit would write, from the request (undefined: unchanged; null due date: cleared). */
export function setEditColumns(input: UpdateSetInput): Partial<Record<SetEditField, string | null>> {
  const columns: Partial<Record<SetEditField, string | null>> = {
    buyerName: input.buyer?.name, buyerOrganisation: input.buyer?.organisation, buyerEmail: input.buyer?.email,
    serial: input.serial, model: input.model, dueOn: input.dueOn, notes: input.notes,
  }
  return Object.fromEntries(Object.entries(columns).filter(([, v]) => v !== undefined))
}

/** One changed field: before and after. */
export interface FieldChange { field: string, from: string | null, to: string | null }

/** Plain words for a list of changes: `buyer: A → B; due date: (none) → 2026-12-01`. */
export function describeChanges(changes: FieldChange[]): string {
  const shown = (v: string | null) => (v === null || v === '' ? '(none)' : v)
  return changes.map(c => `${c.field}: ${shown(c.from)} → ${shown(c.to)}`).join('; ')
}
