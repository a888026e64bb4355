import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { conflictOnDuplicate, fail, isUniqueViolation, validateInput } from '../../../../server/utils/http-errors'

// How node-postgres reports a unique violation, wrapped by Drizzle in `cause`.
// source: PostgreSQL documentation, Appendix A "PostgreSQL Error Codes": 23505 unique_violation
const uniqueViolation = (constraint: string) => Object.assign(new Error('Failed query'), { cause: { code: '23505', constraint_name: constraint } })

function thrown(work: () => unknown): { statusCode?: number, statusMessage?: string, message?: string } {
  try {
    work()
  }
  catch (error) {
    return error as { statusCode?: number, statusMessage?: string, message?: string }
  }
  throw new Error('nothing was thrown')
}

describe('fail', () => {
  it('throws the status with its reason phrase and the plain sentence', () => {
    // source: RFC 9110 §15.5.10 (409 Conflict)
    expect(thrown(() => fail(409, 'That serial is taken.'))).toMatchObject({ statusCode: 409, statusMessage: 'Conflict', message: 'That serial is taken.' })
  })
})

describe('validateInput', () => {
  const Schema = z.object({ count: z.number({ invalid_type_error: 'Give the count as a number.' }) })
  it('answers the parsed data for good input and 400 with the schema’s sentence for bad', () => {
    expect(validateInput(Schema, { count: 3 })).toEqual({ count: 3 })
    const error = thrown(() => validateInput(Schema, { count: 'three' }))
    expect(error.statusCode).toBe(400)
    expect(error.message).toContain('Give the count as a number.')
  })
})

describe('isUniqueViolation and conflictOnDuplicate', () => {
  it('recognises 23505 under Drizzle’s wrapper, of the named constraint only', () => {
    expect(isUniqueViolation(uniqueViolation('sets_workshop_serial_key'))).toBe(true)
    expect(isUniqueViolation(uniqueViolation('sets_workshop_serial_key'), 'sets_workshop_serial_key')).toBe(true)
    expect(isUniqueViolation(uniqueViolation('lots_workshop_code_key'), 'sets_workshop_serial_key')).toBe(false)
    // source: PostgreSQL Appendix A: 23503 foreign_key_violation is not a duplicate
    expect(isUniqueViolation({ code: '23503' })).toBe(false)
    expect(isUniqueViolation(new Error('plain'))).toBe(false)
  })

  it('turns the race’s loser into 409 with the caller’s sentence and lets other errors through', async () => {
    await expect(conflictOnDuplicate(async () => 'saved', 'Taken.')).resolves.toBe('saved')
    await expect(conflictOnDuplicate(async () => {
      throw uniqueViolation('sets_workshop_serial_key')
    }, 'That serial is taken.', 'sets_workshop_serial_key')).rejects.toMatchObject({ statusCode: 409, message: 'That serial is taken.' })
    await expect(conflictOnDuplicate(async () => {
      throw new Error('connection lost')
    }, 'Taken.')).rejects.toThrow('connection lost')
  })
})
