import { z } from 'zod'

export const routeFileFormats = ['csv', 'gpx', 'rtz'] as const
export type RouteFileFormatName = typeof routeFileFormats[number]

export const routeExportQuerySchema = z.object({
  format: z.enum(routeFileFormats, { error: 'format must be csv, gpx or rtz' }),
})

export const routeImportModes = ['preview', 'create'] as const
export type RouteImportMode = typeof routeImportModes[number]

/** The text fields of an import upload; numbers arrive as text in multipart bodies. */
export const routeImportFieldsSchema = z.object({
  mode: z.enum(routeImportModes, { error: 'mode must be preview or create' }).optional(),
})

export interface RouteImportIssue { line?: number, element?: string, message: string }
