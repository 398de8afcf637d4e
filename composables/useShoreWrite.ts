/** A write to the API that refreshes one cached key afterwards and keeps the server's message when it fails. */
export function useShoreWrite(key: MaybeRefOrGetter<string>) {
  const busy = ref(false)
  const error = ref<string | null>(null)
  async function write<T>(url: string, method: 'POST' | 'PUT' | 'DELETE', body?: unknown): Promise<T | null> {
    busy.value = true
    error.value = null
    try {
      // The URL is built at run time, so the typed-route inference has nothing to work with.
      const result = await ($fetch as (url: string, opts: object) => Promise<unknown>)(url, { method, body })
      await refreshNuxtData(toValue(key))
      return result as T
    }
    catch (e: any) {
      error.value = e?.data?.message || e?.statusMessage || e?.message || 'The change was not saved'
      return null
    }
    finally { busy.value = false }
  }
  return { busy: readonly(busy), error, write }
}
