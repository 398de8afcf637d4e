const IMO_WEIGHTS = [7, 6, 5, 4, 3, 2] as const

/**
 * IMO ship identification number: seven digits, the last a check digit equal to
 * (7·d1 + 6·d2 + 5·d3 + 4·d4 + 3·d5 + 2·d6) mod 10 (IMO Resolution A.600(15), kept by A.1117(30)).
 * Accepts the digits alone or with the customary "IMO" prefix ("IMO 9074729").
 */
export function isValidImoNumber(text: string): boolean {
  const digits = normaliseImoNumber(text)
  if (digits === null) return false
  let sum = 0
  for (let i = 0; i < 6; i++) sum += Number(digits[i]) * IMO_WEIGHTS[i]!
  return sum % 10 === Number(digits[6])
}

/** The seven digits of an IMO number written with or without the "IMO" prefix, or null when it is not seven digits. */
export function normaliseImoNumber(text: string): string | null {
  const match = /^\s*(?:IMO[\s-]*)?(\d{7})\s*$/i.exec(text)
  return match ? match[1]! : null
}
