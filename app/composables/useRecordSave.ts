/**
 * Saves a record of a list from its form: a new one is POSTed to the list (`path`), an
 * existing one (`id` given) is sent with `editMethod` to `path/id`; answers the record's id.
 */
export function useRecordSave(path: string, editMethod: 'PATCH' | 'PUT') {
  const api = useApiFetch()
  return async (id: string | undefined, body: Record<string, unknown>): Promise<string> => {
    const saved = await api<{ id: string }>(id ? `${path}/${id}` : path, { method: id ? editMethod : 'POST', body })
    return saved.id
  }
}
