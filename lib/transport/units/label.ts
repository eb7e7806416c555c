// Practitioner-facing label for a UCUM code: 'uOhm.cm' → 'µΩ·cm', 'cm2/(V.s)' → 'cm²/(V·s)'.
const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};
const WHOLE: Record<string, string> = { Cel: '°C', '[degF]': '°F', deg: '°', '1': '1', '%': '%', 'Ohm/{sq}': 'Ω/sq' };

function labelToken(token: string): string {
  const m = /^([A-Za-z[\]_%]+)(-?\d+)?$/.exec(token);
  if (!m) return token;
  let atom = m[1].replace('Ohm', 'Ω').replace('[degF]', '°F');
  if (atom === 'Cel') atom = '°C';
  if (atom.length > 1 && atom.startsWith('u')) atom = 'µ' + atom.slice(1);
  const exp = m[2] ? [...m[2]].map((c) => SUPERSCRIPT[c]).join('') : '';
  return atom + exp;
}

export function labelFromUcum(ucum: string): string {
  if (WHOLE[ucum]) return WHOLE[ucum];
  return ucum
    .split(/([./()])/)
    .map((part) => (part === '.' ? '·' : /^[/()]$/.test(part) || part === '' ? part : labelToken(part)))
    .join('')
    .replace('{sq}', 'sq');
}
