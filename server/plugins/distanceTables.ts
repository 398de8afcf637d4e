// Starts the distance-table worker in this server process (NUXT_TABLE_WORKER=off keeps a web-only
// process from building; it still enqueues). Like the outbox, start-up does not wait for the
// database: if the queue cannot start yet, it tries again. pg-boss itself is stopped by the outbox plugin.
export default defineNitroPlugin((nitroApp) => {
  let retry: ReturnType<typeof setTimeout> | undefined
  let closed = false
  const start = () => startTableWorker().catch((error) => {
    console.error('[tables] worker did not start; trying again in 30 s:', error.message)
    if (!closed) retry = setTimeout(start, 30_000)
  })
  if (useRuntimeConfig().tableWorker !== 'off') start()
  nitroApp.hooks.hook('close', () => {
    closed = true
    if (retry) clearTimeout(retry)
  })
})
