// Command line: re-measure a set's stored strikes with the current engine.
//   npm run reanalyze -- --set SERIAL [--workshop WORKSHOP_ID] [--reason TEXT] [--json]
// Uses NUXT_DATABASE_URL and NUXT_STORAGE_DIR like the seed script. Keeps every old
// result; pieces already approved, certified or shipped keep their signed results and
// stages, and their new results go to the history only. Prints a table of changes.
import { eq } from 'drizzle-orm'
import { sets, workshops } from '../server/database/schema'
import { requestReanalysis } from '../server/utils/reanalysis'
import { executeReanalysis } from '../server/utils/reanalysis-run'
import { storageConfigFromEnv, storageFromConfig } from '../server/utils/blob-storage'
import { changeSummary, changeTable } from '../shared/reanalysis/changeTable'
import { withScriptDatabase } from './with-database'

const USAGE = 'Usage: npm run reanalyze -- --set SERIAL [--workshop WORKSHOP_ID] [--reason TEXT] [--json]'

class UsageError extends Error {}

function parseArgs(argv: string[]) {
  const out: { set?: string, workshop?: string, reason: string, json: boolean } = { reason: 'command line', json: false }
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!
    if (arg === '--json') out.json = true
    else if (arg === '--help' || arg === '-h') throw new UsageError(USAGE)
    else if (arg === '--set' || arg === '--workshop' || arg === '--reason') {
      const value = argv[++i]
      if (value === undefined || value.startsWith('--')) throw new UsageError(`${arg} needs a value. ${USAGE}`)
      if (arg === '--set') out.set = value
      else if (arg === '--workshop') out.workshop = value
      else out.reason = value.slice(0, 500)
    }
    else throw new UsageError(`Unknown option ${arg}. ${USAGE}`)
  }
  if (!out.set) throw new UsageError(`Name the set with --set SERIAL. ${USAGE}`)
  return out
}

let args: ReturnType<typeof parseArgs>
try {
  args = parseArgs(process.argv.slice(2))
}
catch (error) {
  console.error((error as Error).message)
  process.exit(2)
}
// Service refusals carry a plain sentence; say it without a stack trace.
await withScriptDatabase({ purpose: 'whose strikes should be re-measured', missingCode: 2, failed: message => message }, async (db) => {
  const found = await db.select({ id: sets.id, name: sets.name, workshopId: sets.workshopId, workshopName: workshops.name })
    .from(sets).innerJoin(workshops, eq(workshops.id, sets.workshopId)).where(eq(sets.serial, args.set))
  const matching = args.workshop ? found.filter(s => s.workshopId === args.workshop) : found
  if (matching.length === 0) {
    throw new Error(`No set has the serial "${args.set}"${args.workshop ? ' in that workshop' : ''}; check the serial on the set's page.`)
  }
  if (matching.length > 1) {
    throw new Error(`${matching.length} workshops have a set with the serial "${args.set}"; choose one with --workshop (${matching.map(s => `${s.workshopId} for ${s.workshopName}`).join(', ')}).`)
  }
  const set = matching[0]!
  const run = await requestReanalysis(db, { workshopId: set.workshopId, userId: null }, { setId: set.id }, args.reason, { runHere: true })
  const storage = storageFromConfig(storageConfigFromEnv())
  const finished = await executeReanalysis(db, storage, run.id)
  if (!finished) throw new Error('The re-measurement was stopped by another process before it finished.')
  const result = finished.result
  if (!result) throw new Error('The re-measurement finished without a result.')
  if (args.json) console.log(JSON.stringify({ runId: finished.id, set: { serial: args.set, name: set.name }, ...result }, null, 2))
  else {
    console.log(`${set.name} (serial ${args.set}), re-measurement ${finished.id}`)
    console.log(changeTable(result))
    console.log(changeSummary(result))
  }
})
