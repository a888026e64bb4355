/** The message of an API error, as a plain sentence for the screen. */
export function apiErrorMessage(error: unknown): string {
  const e = error as { data?: { message?: string }, message?: string, statusCode?: number }
  return e?.data?.message ?? (e?.statusCode ? `The request failed (${e.statusCode}).` : 'The server could not be reached. Check the connection and try again.')
}

/** $fetch with the session token attached (the auth cookie is also sent). */
export function useApiFetch() {
  const { token } = useAuth()
  return $fetch.create({
    onRequest({ options }) {
      if (token.value) {
        const headers = new Headers(options.headers as HeadersInit | undefined)
        headers.set('Authorization', token.value)
        options.headers = headers
      }
    },
  })
}
