export default defineEventHandler(async (event) => {
  try {
    await useDb().raw('select 1')
    return { status: 'ok', database: 'up' }
  }
  catch {
    setResponseStatus(event, 503)
    return { status: 'degraded', database: 'down', message: 'The database is not reachable' }
  }
})
