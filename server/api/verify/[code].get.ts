import { VerifyParams } from '#shared/schemas/certificates'

/** GET /api/verify/:code: public; a certificate's status and summary, the same time for a known and an unknown code. */
export default defineEventHandler(async (event) => {
  // A malformed code is answered like an unknown one (404, same time), not with a 400 that sets it apart.
  const params = getRouterParams(event)
  const parsed = VerifyParams.safeParse(params)
  const result = await withMinimumDuration(250, async () => (parsed.success ? verifyCertificate(useDatabase(), parsed.data.code) : null))
  setResponseHeader(event, 'cache-control', 'no-store')
  if (!result) fail(404, 'No such certificate.')
  return result
})
