// Route file import: `mode=preview` (default) shows what the file holds and creates nothing;
// `mode=create` makes a draft plan from it, only when every waypoint was read.
export default defineRoleHandler(EDITORS, async (event, user) => {
  const upload = await readRouteUpload(event)
  const parsed = readRouteFileUpload(upload)
  if (upload.mode === 'preview') return previewRoute(parsed, upload.fields)
  const created = await createPlanFromRoute(user, parsed, upload.fields)
  setResponseStatus(event, 201)
  return { ...created, format: parsed.format, waypointCount: parsed.waypoints.length, warnings: parsed.warnings }
})
