// Starts the outbox worker in this server process (runtimeConfig.outboxWorker = 'off' keeps a
// web-only process from sending; it still enqueues). Startup is not held up by the database:
// if pg-boss cannot start yet, it tries again.
export default defineNitroPlugin((nitroApp) => {
  let retry: ReturnType<typeof setTimeout> | undefined
  let closed = false
  const start = () => startOutboxWorker().catch((error) => {
    console.error('[outbox] worker did not start; trying again in 30 s:', error.message)
    if (!closed) retry = setTimeout(start, 30_000)
  })
  if (useRuntimeConfig().outboxWorker !== 'off') start()
  nitroApp.hooks.hook('close', async () => {
    closed = true
    if (retry) clearTimeout(retry)
    await stopOutbox()
  })
})
