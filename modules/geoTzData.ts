// geo-tz reads its boundary data with fs at run time, which the server bundle's file tracing
// cannot see; list the data files so that they ship in .output beside the package.
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import { defineNuxtModule } from '@nuxt/kit'

export default defineNuxtModule({
  meta: { name: 'geo-tz-data' },
  setup(_options, nuxt) {
    // the main entry is dist/find-1970.js; the data folder sits beside dist/
    const data = join(dirname(createRequire(import.meta.url).resolve('geo-tz')), '..', 'data')
    nuxt.hook('nitro:config', (config) => {
      config.externals ??= {}
      config.externals.traceInclude = [...(config.externals.traceInclude ?? []),
        join(data, 'timezones-1970.geojson.geo.dat'), join(data, 'timezones-1970.geojson.index.json')]
    })
  },
})
