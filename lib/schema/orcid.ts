// ORCID iD check digit: ISO 7064 MOD 11-2, as ORCID documents for its identifiers ("Structure of the ORCID Identifier").
export function orcidCheckDigit(base15: string): string {
  let total = 0;
  for (const ch of base15) total = (total + Number(ch)) * 2;
  const result = (12 - (total % 11)) % 11;
  return result === 10 ? 'X' : String(result);
}

/** True when `text` is an ORCID iD (bare or https://orcid.org/ form) whose check digit matches. */
export function isValidOrcid(text: string): boolean {
  const m = /^(?:https:\/\/orcid\.org\/)?(\d{4})-(\d{4})-(\d{4})-(\d{3}[\dX])$/.exec(text);
  if (!m) return false;
  const digits = m.slice(1).join('');
  return orcidCheckDigit(digits.slice(0, 15)) === digits[15];
}
