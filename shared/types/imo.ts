import { z } from 'zod'
import { isValidImoNumber, normaliseImoNumber } from '../utils/imo'

/** An IMO ship number: parsed to its seven digits (a leading "IMO" is dropped), check digit verified. */
export const imoNumberSchema = z.string({ error: 'must be a text of seven digits' })
  .trim()
  .refine(text => normaliseImoNumber(text) !== null, 'must be seven digits (e.g. IMO 9074729)')
  .refine(text => normaliseImoNumber(text) === null || isValidImoNumber(text), 'check digit does not match (IMO number checksum)')
  .transform(text => normaliseImoNumber(text)!)
export type ImoNumber = z.output<typeof imoNumberSchema>
