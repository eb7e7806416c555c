import type { Dimension } from './dimensions';
import { PREFIX_SYMBOLS, PREFIX_WORDS, UNIT_WORDS } from './from-text-words';
import { unitInfo } from './unit-info';

/** A UCUM code read from header text; `ambiguous` marks a guess the user should confirm. */
export type UcumFromText = { ucum: string; reason: string; ambiguous?: boolean };
/** Optional context from the column (e.g. its name says "Temperature"). */
export type UcumFromTextHint = { dimension?: Dimension };

// Unicode spellings to ASCII before parsing: µ (U+00B5) and μ (U+03BC) → u, Ω/Ω → Ohm, ° → deg, □ → sq.
function normalise(text: string): string {
  return text
    .replace(/º/g, '°') // masculine ordinal, often typed for the degree sign; NFKC would make it 'o'
    .normalize('NFKC') // ² → 2, ⁻ → −, Ω (U+2126) → Ω, µ → μ
    .replace(/[μµ]/g, 'u')
    .replace(/Ω/g, 'Ohm')
    .replace(/[−–]/g, '-')
    .replace(/(?:°|\bdeg(?:ree)?s?\.?)\s*C\b/gi, 'Cel')
    .replace(/(?:°|\bdeg(?:ree)?s?\.?)\s*F\b/gi, '[degF]')
    .replace(/°/g, 'deg')
    .replace(/□/g, 'sq')
    .replace(/\s+per\s+/gi, '/')
    .replace(/\bsqrt\s*\(?\s*Hz\s*\)?|√\s*Hz|\brtHz\b/gi, '√Hz')
    .trim();
}

function stripWrapping(text: string): string {
  let s = text.trim();
  while (/^\(.*\)$|^\[.*\]$|^\{.*\}$/.test(s) && !(s.startsWith('[') && unitInfo(s))) s = s.slice(1, -1).trim(); // keep [degF], [ppm]
  return s;
}

/** One header atom (no exponent) to UCUM, keeping the prefix's case: 'mohm' → 'mOhm', 'Mohm' → 'MOhm'. */
function mapAtom(atom: string): string | undefined {
  const word = UNIT_WORDS[atom.toLowerCase()];
  if (word) return word;
  if (atom === 'Vs') return 'V.s'; // mobility headers write cm^2/Vs
  const longPrefix = /^(pico|nano|micro|milli|centi|kilo|mega|giga)([a-z]{3,})$/i.exec(atom);
  if (longPrefix && UNIT_WORDS[longPrefix[2].toLowerCase()]) {
    return PREFIX_WORDS[longPrefix[1].toLowerCase()] + UNIT_WORDS[longPrefix[2].toLowerCase()];
  }
  const shortPrefix = /^([pnumckKMG])([A-Za-z]{2,})$/.exec(atom);
  if (shortPrefix && UNIT_WORDS[shortPrefix[2].toLowerCase()]) {
    return PREFIX_SYMBOLS[shortPrefix[1]] + UNIT_WORDS[shortPrefix[2].toLowerCase()];
  }
  if (atom === 'sq') return '{sq}';
  return unitInfo(atom) || atom === '[degF]' ? atom : undefined;
}

function mapFactor(token: string): string | undefined {
  const m = /^([A-Za-z[\]{}%]+)(-?\d+)?$/.exec(token);
  if (!m) return undefined;
  const atom = mapAtom(m[1]);
  if (!atom) return undefined;
  if (!m[2]) return atom;
  return atom.includes('.') ? undefined : atom + m[2];
}

function mapProduct(part: string): string[] | undefined {
  const tokens = part
    .replace(/[()]/g, ' ')
    .split(/[\s.*·]+|(?<=[A-Za-z\]])-(?=[A-Za-z[])/)
    .filter((t) => t !== '');
  const out: string[] = [];
  for (const t of tokens) {
    const f = mapFactor(t);
    if (!f) return undefined;
    out.push(...f.split('.'));
  }
  return out;
}

/** Header expression to a UCUM code: factors joined by '.', all denominators grouped in parentheses. */
function parseExpression(s: string): string | undefined {
  const [numText, ...denTexts] = s.replace(/\^|\*\*/g, '').replace(/\((-?\d+)\)/g, '$1').split('/');
  const numAll = numText.trim() === '1' ? [] : mapProduct(numText);
  const den = denTexts.length ? mapProduct(denTexts.join(' ')) : [];
  if (!numAll || !den || (numAll.length === 0 && den.length === 0)) return undefined;
  // cm2 V-1 s-1 → cm2/(V.s); a lone negative power (cm-3) keeps the catalogue's spelling.
  const isNegative = (f: string) => /-\d+$/.test(f);
  const moveDown = numAll.some((f) => !isNegative(f));
  const num = moveDown ? numAll.filter((f) => !isNegative(f)) : numAll;
  if (moveDown) for (const f of numAll.filter(isNegative)) den.push(f.replace(/-(\d+)$/, (_m, e: string) => (e === '1' ? '' : e)));
  if (num.length === 0 && den.length === 1 && /^[a-zA-Z]+\d?$/.test(den[0])) {
    const m = /^([a-zA-Z]+)(\d?)$/.exec(den[0]) as RegExpExecArray;
    return `${m[1]}-${m[2] || '1'}`; // 1/cm3 → cm-3, the catalogue's spelling
  }
  const numCode = num.length ? num.join('.') : '1';
  if (den.length === 0) return numCode;
  return den.length === 1 ? `${numCode}/${den[0]}` : `${numCode}/(${den.join('.')})`;
}

function bareCelsiusOrCoulomb(hint?: UcumFromTextHint): UcumFromText {
  if (hint?.dimension === 'charge') return { ucum: 'C', reason: "bare 'C' read as coulomb (column hint: charge)" };
  if (hint?.dimension === 'temperature') return { ucum: 'Cel', reason: "bare 'C' read as degree Celsius (column hint: temperature)" };
  return {
    ucum: 'Cel',
    reason: "bare 'C' read as degree Celsius, as instrument headers use it; in UCUM 'C' is coulomb — please confirm",
    ambiguous: true,
  };
}

/** True for amplitude-density text (V/√Hz, V/rtHz): UCUM cannot express it; square the values into 'V2/Hz'. */
export function isAmplitudeDensityText(text: string): boolean {
  return normalise(stripWrapping(text)).includes('√Hz');
}

/** Maps unit text from a file header to a UCUM code Ohmstead knows, with the reason; undefined if unreadable. */
export function ucumFromText(text: string, hint?: UcumFromTextHint): UcumFromText | undefined {
  const raw = stripWrapping(text);
  if (raw === '') return undefined;
  if (raw === 'C') return bareCelsiusOrCoulomb(hint);
  if (raw === 'F' && hint?.dimension === 'temperature') return { ucum: '[degF]', reason: "bare 'F' read as degree Fahrenheit (column hint: temperature)" };
  const exact = unitInfo(raw) !== undefined;
  const s = normalise(raw);
  if (s.includes('√Hz')) return undefined; // amplitude density: see isAmplitudeDensityText
  const ucum = exact ? raw : parseExpression(s);
  if (!ucum || !unitInfo(ucum)) return undefined;
  const letters = raw.replace(/[^A-Za-z]/g, '');
  if (letters.length > 1 && letters === letters.toUpperCase() && /(^|[./(])M[A-Za-z]/.test(ucum)) {
    return { ucum, reason: `read '${text}' as ${ucum}; the text is all capitals, so 'M' was taken as mega — it may mean milli`, ambiguous: true };
  }
  return { ucum, reason: exact ? 'already a UCUM code' : `read '${text}' as ${unitInfo(ucum)?.label ?? ucum}` };
}
