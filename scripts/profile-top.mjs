// The functions that took the most CPU in a V8 profile (`node --cpu-prof`, e.g. from
// BENCH_PROFILE=DIR npm run bench:api): self time per function, and the share of all samples.
//   node scripts/profile-top.mjs DIR_OR_FILE.cpuprofile [count]
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join } from 'node:path'

const [target, countArg] = process.argv.slice(2)
if (!target) throw new Error('usage: node scripts/profile-top.mjs DIR_OR_FILE.cpuprofile [count]')
const count = Number(countArg || 10)
const files = statSync(target).isDirectory()
  ? readdirSync(target).filter(f => f.endsWith('.cpuprofile')).map(f => join(target, f))
  : [target]

for (const file of files) {
  const profile = JSON.parse(readFileSync(file, 'utf8'))
  const nodes = new Map(profile.nodes.map(n => [n.id, n]))
  const selfUs = new Map()
  // timeDeltas[i] is the time before sample i; attribute it to the sampled node.
  profile.samples.forEach((id, i) => selfUs.set(id, (selfUs.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)))
  const byFunction = new Map()
  let total = 0
  for (const [id, us] of selfUs) {
    const { callFrame: f } = nodes.get(id)
    const where = f.url ? `${f.url.replace(/^.*\/(node_modules|\.output)\//, '$1/').replace(/^file:\/\//, '')}:${f.lineNumber + 1}` : ''
    const key = `${f.functionName || '(anonymous)'} ${where}`.trim()
    byFunction.set(key, (byFunction.get(key) ?? 0) + us)
    total += us
  }
  const busy = [...byFunction].filter(([k]) => k !== '(idle)' && k !== '(program)')
  const busyTotal = busy.reduce((s, [, us]) => s + us, 0)
  console.log(`\n${file}: ${(total / 1e6).toFixed(1)} s sampled, ${(busyTotal / 1e6).toFixed(1)} s busy (not idle or (program))`)
  console.log('self ms'.padStart(9), 'busy %'.padStart(7), ' function')
  for (const [key, us] of busy.sort((a, b) => b[1] - a[1]).slice(0, count))
    console.log((us / 1000).toFixed(0).padStart(9), (100 * us / busyTotal).toFixed(1).padStart(7), ` ${key}`)
}
