// Server and SMTP-fake processes a test file starts and kills itself (outbox worker on, mail server
// taken away and brought back), and a poll for what they do. Every process started is killed by
// `stopAll()` in the file's afterAll.
import { type ChildProcess, spawn } from 'node:child_process'
import { createServer } from 'node:net'
import { join } from 'node:path'
import { rootDir } from './server'
import { freePort } from './instances'

const outputDir = process.env.PW_OUTPUT_DIR || `${rootDir}.output`
const children = new Set<ChildProcess>()

export async function waitFor<T>(what: string, probe: () => Promise<T | undefined | false> | T | undefined | false, timeoutMs = 60_000): Promise<T> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const value = await probe()
    if (value) return value
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`)
    await new Promise(resolve => setTimeout(resolve, 250))
  }
}

function start(command: string[], env: Record<string, string>) {
  const child = spawn(process.execPath, command, { env: { ...process.env, ...env }, stdio: ['ignore', 'ignore', 'inherit'] })
  children.add(child)
  child.on('exit', () => children.delete(child))
  return child
}

export function stop(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM') {
  return new Promise<void>((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve()
    child.once('exit', () => resolve())
    child.kill(signal)
  })
}

export const stopAll = () => Promise.all([...children].map(c => stop(c, 'SIGKILL')))

/** A second app process on its own port with the outbox worker on, sending to `smtpUrl`. */
export async function startWorker(smtpUrl: string) {
  const port = await freePort()
  const child = start([join(outputDir, 'server/index.mjs')], { PORT: String(port), HOST: '127.0.0.1', NUXT_SMTP_URL: smtpUrl, NUXT_OUTBOX_WORKER: 'on' })
  await waitFor('the worker process to answer', () => fetch(`http://127.0.0.1:${port}/api/health`).then(r => r.ok, () => false))
  return child
}

export async function startMailFake(port: number, dir: string) {
  const child = start(['scripts/mail-fake.mjs', '--port', String(port), '--dir', dir], {})
  await waitFor('the SMTP fake to listen', () => new Promise<boolean>((resolve) => {
    const socket = createServer().listen(port, '127.0.0.1', () => socket.close(() => resolve(false))).on('error', () => resolve(true))
  }))
  return child
}
