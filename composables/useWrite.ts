type RefreshKeys = MaybeRefOrGetter<string | string[] | undefined>

export interface WriteOptions {
  /** The `useFetch` / `useAsyncData` keys a successful write changes: refreshed before `run` resolves. */
  refresh?: RefreshKeys
  /** Shown when the server sends no message of its own. */
  fallback?: string
}

/** What went wrong with a request, in words a person can act on: the server's message (server/error.ts), else `fallback`. */
export function errorMessage(e: unknown, fallback = 'The request failed'): string {
  const err = e as { data?: { message?: unknown, statusMessage?: unknown }, statusMessage?: unknown, message?: unknown } | null | undefined
  for (const text of [err?.data?.message, err?.data?.statusMessage, err?.statusMessage, err?.message])
    if (typeof text === 'string' && text) return text
  return fallback
}

/**
 * The one way the client writes: busy state, the server's message on failure, then a refresh of
 * what the write changed. `run` resolves to the result, or `null` when the write failed (`error`
 * holds the message, `failure` the raw error for status codes and details).
 */
export function useWrite(options: WriteOptions = {}) {
  const busy = ref(false)
  /** Which write is running, for a button that says so. */
  const pending = ref<string | null>(null)
  const error = ref<string | null>(null)
  const failure = shallowRef<any>(null)

  async function run<T>(write: () => Promise<T>, opts: WriteOptions & { label?: string } = {}): Promise<T | null> {
    busy.value = true
    pending.value = opts.label ?? 'write'
    error.value = null
    failure.value = null
    try {
      const result = await write()
      const keys = toValue(opts.refresh ?? options.refresh)
      if (keys?.length) await refreshNuxtData(keys)
      return result
    }
    catch (e) {
      failure.value = e
      error.value = errorMessage(e, opts.fallback ?? options.fallback)
      return null
    }
    finally {
      busy.value = false
      pending.value = null
    }
  }

  /** `run` for a URL built at run time (typed-route inference has nothing to work with there). */
  function write<T>(url: string, method: 'POST' | 'PUT' | 'DELETE', body?: unknown, opts?: WriteOptions & { label?: string }) {
    return run(() => ($fetch as (url: string, o: object) => Promise<T>)(url, { method, body }), opts)
  }

  return { busy: readonly(busy), pending: readonly(pending), error, failure, run, write }
}
