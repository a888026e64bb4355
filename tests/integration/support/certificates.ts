import { BASE_URL } from './http'
import { until } from './mail'

/** Waits until the certificate's PDF is stored (the route answers 200 instead of 202) and returns its bytes. */
export async function waitForPdf(token: string, id: string, query = '', timeoutMs = 60_000): Promise<Buffer> {
  return until(`the PDF of ${id}`, async () => {
    const response = await fetch(`${BASE_URL}/api/certificates/${id}/pdf${query}`, { headers: { authorization: `Bearer ${token}` } })
    if (response.status === 202) return null
    if (response.status !== 200) throw new Error(`PDF: ${response.status} ${await response.text()}`)
    return Buffer.from(await response.arrayBuffer())
  }, timeoutMs, 300)
}
