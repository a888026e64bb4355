import bcrypt from 'bcryptjs'

const COST = 10

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST)
}

// A hash of a random string, compared against when the e-mail is unknown, so both
// answers take the same time.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password-tonewright', COST)

export async function checkPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH)
  return ok && Boolean(hash)
}
