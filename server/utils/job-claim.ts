/**
 * Hands one row to a pg-boss job exactly once across app instances: `claim` marks the row
 * (answers false when another instance was first), `send` queues the job, `record` stores the
 * job's id on the row. A failed send frees the claim again, so the next sweep retries the row.
 */
export async function sendClaimedJob(
  claim: () => Promise<boolean>,
  send: () => Promise<string | null>,
  record: (jobId: string | null) => Promise<unknown>,
): Promise<boolean> {
  if (!(await claim())) return false
  try {
    // pg-boss answers null for a job it did not create; the row stays claimed so no sweep re-sends it.
    await record((await send()) ?? 'claimed')
  }
  catch (error) {
    await record(null)
    throw error
  }
  return true
}
