// Runs a TypeScript script bundled by esbuild into one module, with the `#shared` alias the app
// uses, so scripts can import server and engine code as the server does: node scripts/bundled.mjs file.ts
import { mkdirSync, writeFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { build } from 'esbuild'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')
const entry = resolve(process.argv[2])
const shared = {
  name: 'shared-alias',
  setup(b) {
    b.onResolve({ filter: /^#shared\// }, a => ({ path: join(root, 'shared', `${a.path.slice('#shared/'.length)}.ts`) }))
  },
}
const out = await build({ entryPoints: [entry], bundle: true, platform: 'node', format: 'esm', target: 'node20', write: false, logLevel: 'warning', plugins: [shared] })
const file = join(root, '.data', 'bundled', `${entry.replace(/[^\w]+/g, '_')}.mjs`)
mkdirSync(dirname(file), { recursive: true })
writeFileSync(file, out.outputFiles[0].text)
process.argv.splice(2, 1)
await import(pathToFileURL(file).href)
