/** The certificate actions the screens share: sign or re-issue, send, revoke, retry a failed e-mail. */
export function useCertificateActions() {
  const api = useApiFetch()
  const busy = ref(false)
  const problem = ref<string | null>(null)
  const notice = ref<string | null>(null)

  async function run<T>(work: () => Promise<T>, done: (result: T) => string): Promise<T | null> {
    busy.value = true
    problem.value = null
    notice.value = null
    try {
      const result = await work()
      notice.value = done(result)
      return result
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
      return null
    }
    finally {
      busy.value = false
    }
  }

  return {
    busy, problem, notice,
    sign: (setId: string) => run(
      () => api<{ id: string, number: string, code: string }>(`/api/sets/${setId}/certificates`, { method: 'POST' }),
      r => `Certificate ${r.number} signed.`),
    reissue: (id: string, reason: string) => run(
      () => api<{ id: string, number: string }>(`/api/certificates/${id}/reissue`, { method: 'POST', body: { reason } }),
      r => `Certificate ${r.number} issued; it supersedes the earlier one.`),
    send: (id: string, to?: string) => run(
      () => api<{ to: string }>(`/api/certificates/${id}/send`, { method: 'POST', body: to ? { to } : {} }),
      r => `Queued for ${r.to}; the status below shows when it is sent.`),
    revoke: (id: string, reason: string) => run(
      () => api<{ number: string }>(`/api/certificates/${id}/revoke`, { method: 'POST', body: { reason } }),
      r => `Certificate ${r.number} revoked.`),
    retry: (messageId: string) => run(
      () => api<{ id: string, status: string }>(`/api/mail/${messageId}/retry` as string, { method: 'POST' }),
      () => 'Put back in the queue.'),
  }
}
