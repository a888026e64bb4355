import { describe, expect, it } from 'vitest'
import { describeChanges, setEditColumns, UpdateSetSchema } from '../../../../shared/schemas/setEdit'

describe('UpdateSetSchema', () => {
  it('takes any one field, the buyer\'s parts alone, and null to clear the due date', () => {
    expect(UpdateSetSchema.parse({ buyer: { name: ' Robin Ashdown ' } })).toEqual({ buyer: { name: 'Robin Ashdown' } })
    expect(UpdateSetSchema.parse({ dueOn: null })).toEqual({ dueOn: null })
    expect(UpdateSetSchema.parse({ buyer: { email: 'Robin@Example.TEST' } }).buyer?.email).toBe('robin@example.test')
  })

  it('refuses an empty change, unknown fields and a badly written date', () => {
    expect(UpdateSetSchema.safeParse({}).success).toBe(false)
    expect(UpdateSetSchema.safeParse({ buyer: {} }).success).toBe(false)
    expect(UpdateSetSchema.safeParse({ referenceHz: 442 }).success).toBe(false)
    expect(UpdateSetSchema.safeParse({ dueOn: '01/02/2027' }).success).toBe(false)
  })
})

describe('setEditColumns and describeChanges', () => {
  it('maps the request onto the set\'s columns, leaving out what was not sent', () => {
    expect(setEditColumns({ buyer: { organisation: '' }, dueOn: null })).toEqual({ buyerOrganisation: '', dueOn: null })
  })

  it('writes an empty value as (none)', () => {
    expect(describeChanges([{ field: 'due date', from: '2027-01-15', to: null }, { field: 'notes', from: '', to: 'Soft mallets' }]))
      .toBe('due date: 2027-01-15 → (none); notes: (none) → Soft mallets')
  })
})
