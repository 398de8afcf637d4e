// Runs scripts/bench-engine.ts bundled by esbuild into one module, as Vite bundles the engine for the
// browser and the server: calls between engine files are then plain calls, not module-loader getters.
import { build } from 'esbuild'

const out = await build({
  entryPoints: [new URL('./bench-engine.ts', import.meta.url).pathname],
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  write: false,
  logLevel: 'warning',
})
await import(`data:text/javascript;base64,${Buffer.from(out.outputFiles[0].text).toString('base64')}`)
