/**
 * Verifies one certificate the way the public page does (recomputes the SHA-256 of
 * its frozen content) against the database in NUXT_DATABASE_URL; used by
 * scripts/backup-restore-check.sh before and after a restore.
 *
 *   npx tsx scripts/certificate-check.ts CODE
 *
 * Prints one JSON line {number, status, hash, hashMatches}; exits 0 when the
 * certificate exists and its hash matches, 1 otherwise.
 */
import { createDatabase } from '../server/database/client'
import { verifyCertificate } from '../server/utils/certificate-verify'

const code = process.argv[2]
const url = process.env.NUXT_DATABASE_URL
if (!code || !url) {
  console.error('usage: NUXT_DATABASE_URL=… npx tsx scripts/certificate-check.ts CODE')
  process.exit(2)
}
const { db, client } = createDatabase(url, { max: 1 })
try {
  const found = await verifyCertificate(db, code)
  console.log(JSON.stringify(found ? { number: found.number, status: found.status, hash: found.hash, hashMatches: found.hashMatches } : null))
  process.exitCode = found?.hashMatches ? 0 : 1
}
finally {
  await client.end()
}
