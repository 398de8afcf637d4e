// Faults: PostgreSQL going away under a running server, and many planners saving at once.
import { connect, createServer, type Server, type Socket } from 'node:net'
import { afterAll, describe, expect, it } from 'vitest'
import { loginAs, startServer } from '../support/server'

/** A TCP relay in front of PostgreSQL that the test can cut and restore, as if the database stopped. */
function databaseRelay(target: URL) {
  const sockets = new Set<Socket>()
  let server: Server | undefined
  const port = 20000 + Math.floor(Math.random() * 20000)
  const start = () => new Promise<void>((resolve) => {
    server = createServer((client) => {
      const pg = connect(Number(target.port), target.hostname)
      for (const s of [client, pg]) { sockets.add(s); s.on('close', () => sockets.delete(s)); s.on('error', () => s.destroy()) }
      client.pipe(pg).pipe(client)
    })
    server.listen(port, '127.0.0.1', () => resolve())
  })
  const stop = () => new Promise<void>((resolve) => {
    for (const s of sockets) s.destroy()
    server?.close(() => resolve())
  })
  const url = new URL(target.href)
  url.port = String(port)
  return { start, stop, url: url.href }
}

const relay = databaseRelay(new URL(process.env.NUXT_DATABASE_URL!))
await relay.start()
await startServer({ NUXT_DATABASE_URL: relay.url })
afterAll(() => relay.stop())

describe('database stopped during use', () => {
  it('answers 503 with a clear message, stays up, and recovers by itself', async () => {
    const planner = await loginAs('planner')
    expect((await planner.request('/api/plans')).status).toBe(200)

    await relay.stop()
    const during = await planner.request('/api/plans')
    expect(during.status).toBe(503)
    expect(during.body.message).toMatch(/database/i)
    const health = await planner.request('/api/health')
    expect(health.status).toBe(503)
    expect(health.body.database).toBe('down')

    await relay.start()
    await expect.poll(async () => (await planner.request('/api/plans')).status, { timeout: 30_000, interval: 500 }).toBe(200)
    expect((await planner.request('/api/health')).body.database).toBe('up')
  })
})
