// Extra Passagewright server processes from the same build, for scale-out and restart tests.
import { type ChildProcess, spawn } from 'node:child_process'
import { createServer } from 'node:net'
import { rootDir } from './server'

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number }
      server.close(() => resolve(port))
    }).on('error', reject)
  })
}

export interface Instance { url: string, process: ChildProcess, stop: () => Promise<void> }

/** Starts `.output/server/index.mjs` on a free port and waits until /api/health answers. */
export async function startInstance(env: Record<string, string> = {}): Promise<Instance> {
  const port = await freePort()
  const outputDir = process.env.PW_OUTPUT_DIR || `${rootDir}.output`
  const child = spawn(process.execPath, [`${outputDir}/server/index.mjs`], {
    env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1', NITRO_PORT: String(port), ...env },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  const url = `http://127.0.0.1:${port}`
  const until = Date.now() + 60_000
  for (;;) {
    try {
      if ((await fetch(`${url}/api/health`)).ok) break
    }
    catch {}
    if (Date.now() > until || child.exitCode !== null) throw new Error(`instance on ${port} did not start`)
    await new Promise(r => setTimeout(r, 200))
  }
  const stop = () => new Promise<void>((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve()
    child.once('exit', () => resolve())
    child.kill('SIGTERM')
  })
  return { url, process: child, stop }
}
