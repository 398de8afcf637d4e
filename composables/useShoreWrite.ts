/** A write to the API that refreshes one cached key afterwards and keeps the server's message when it fails. */
export function useShoreWrite(key: MaybeRefOrGetter<string>) {
  const busy = ref(false)
  const error = ref<string | null>(null)
  async function write<T>(url: string, method: 'POST' | 'PUT' | 'DELETE', body?: unknown): Promise<T | null> {
    busy.value = true
    error.value = null
    try {
      const result = await $fetch<T>(url, { method, body: body as Record<string, unknown> | undefined })
      await refreshNuxtData(toValue(key))
      return result
    }
    catch (e: any) {
      error.value = e?.data?.message || e?.statusMessage || e?.message || 'The change was not saved'
      return null
    }
    finally { busy.value = false }
  }
  return { busy: readonly(busy), error, write }
}
