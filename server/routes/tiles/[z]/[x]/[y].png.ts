import { join } from 'node:path'

// Public chart tiles: no session, immutable (the style version is part of the disk cache path).
export default defineEventHandler(async (event) => {
  const params = getRouterParams(event)
  // The router names the last segment after the file, "y.png", and keeps the suffix in its value.
  const tile = parseTileAddress(params.z, params.x, params['y.png'])
  if (!tile) throw createError({ statusCode: 400, statusMessage: 'Not a tile: zoom 0–8, x and y within the zoom' })
  // Without the event: the per-request copy of the runtime config costs more than serving a cached tile.
  const cacheDir = useRuntimeConfig().tileCacheDir || join(process.cwd(), '.data/tiles')
  const { png, etag } = await getTile(tile, cacheDir)
  setResponseHeaders(event, {
    'Content-Type': 'image/png',
    'Cache-Control': 'public, max-age=31536000, immutable',
    'ETag': etag,
  })
  if (getRequestHeader(event, 'if-none-match') === etag) {
    setResponseStatus(event, 304)
    return null
  }
  return png
})
