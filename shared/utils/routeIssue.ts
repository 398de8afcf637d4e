/** Where a problem in a route file is, as a person reads it: `line 4`, `waypoint #3 (line 12)`. */
export function routeIssuePlace(issue: { line?: number, element?: string }): string {
  if (issue.element && issue.line) return `${issue.element} (line ${issue.line})`
  if (issue.element) return issue.element
  if (issue.line) return `line ${issue.line}`
  return 'whole file'
}
