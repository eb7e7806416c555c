// Spelling-tolerant chemical formulas: YBa2Cu3O7, YBa₂Cu₃O₇, yba2cu3o7 and "YBa2 Cu3 O7" all share one key.

// IUPAC periodic table, elements 1–118 (common knowledge).
const ELEMENT_LIST =
  'H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Ge As Se Br Kr Rb Sr Y Zr Nb Mo ' +
  'Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe Cs Ba La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au Hg Tl Pb ' +
  'Bi Po At Rn Fr Ra Ac Th Pa U Np Pu Am Cm Bk Cf Es Fm Md No Lr Rf Db Sg Bh Hs Mt Ds Rg Cn Nh Fl Mc Lv Ts Og';
export const ELEMENTS: ReadonlySet<string> = new Set(ELEMENT_LIST.split(' '));

// Lab shorthands for well-known compounds (common practice in the transport literature); key → formula keys it names.
export const FORMULA_ALIASES: Readonly<Record<string, readonly string[]>> = {
  ybco: ['yba2cu3o7', 'yba2cu3o6', 'yba2cu3o695', 'yba2cu3o69'],
  bscco: ['bi2sr2cacu2o8', 'bi2sr2ca2cu3o10'],
  lsmo: ['la07sr03mno3', 'la067sr033mno3', 'la1xsrxmno3'],
  lcmo: ['la07ca03mno3', 'la067ca033mno3', 'la1xcaxmno3'],
  sto: ['srtio3'],
  ito: ['in2o3sno2'],
};

const MEMO_LIMIT = 20_000;
const ALIAS_OF = new Map<string, string>();
for (const [alias, keys] of Object.entries(FORMULA_ALIASES)) for (const key of keys) ALIAS_OF.set(key, alias);

// Oxygen non-stoichiometry written after the formula (−δ, -x, +y) is not part of the compound's name.
const NON_STOICHIOMETRY = /\s*[-+±−]\s*[δxyzΔ]\s*$/u;

function fold(text: string): string {
  return text.normalize('NFKD').replace(/\p{M}/gu, '').trim().replace(NON_STOICHIOMETRY, '');
}

/** Case-, subscript- and space-insensitive key of a formula: 'YBa₂Cu₃O₇₋δ' → 'yba2cu3o7', 'La0.7Sr0.3MnO3' → 'la07sr03mno3'. */
export function formulaKey(formula: string): string {
  let key = FORMULA_KEYS.get(formula);
  if (key === undefined) {
    key = fold(formula).toLowerCase().replace(/[^\p{L}\p{N}]/gu, '').slice(0, 64);
    // Formulas repeat across versions; a bounded memo spares re-folding them on every add.
    if (FORMULA_KEYS.size >= MEMO_LIMIT) FORMULA_KEYS.clear();
    FORMULA_KEYS.set(formula, key);
  }
  return key;
}
const FORMULA_KEYS = new Map<string, string>();

// Composition variables that may follow a symbol: La1-xSrxMnO3.
const VARIABLE = /^[xyzδ]+$/u;

/** Element symbols of a correctly cased formula, in order of first appearance; [] when the text is not a formula. */
export function formulaElements(formula: string): string[] {
  return [...parsed(formula).symbols];
}

/** The same symbols lower-cased, as search keys (shared array: do not modify). */
export function elementKeys(formula: string): readonly string[] {
  return parsed(formula).keys;
}

function parsed(formula: string): { symbols: string[]; keys: string[] } {
  let found = ELEMENTS_OF.get(formula);
  if (!found) {
    if (ELEMENTS_OF.size >= MEMO_LIMIT) ELEMENTS_OF.clear();
    const symbols = parseElements(formula);
    ELEMENTS_OF.set(formula, (found = { symbols, keys: symbols.map((e) => e.toLowerCase()) }));
  }
  return found;
}
const ELEMENTS_OF = new Map<string, { symbols: string[]; keys: string[] }>();

function parseElements(formula: string): string[] {
  const text = fold(formula);
  if (!text || !/^[\p{L}\d.()[\]·•:+\-−/ ]+$/u.test(text) || !/^[(\[]?[A-Z]/.test(text)) return [];
  const found: string[] = [];
  for (const [word] of text.matchAll(/[A-Z][a-zδ]*/gu)) {
    const symbol = ELEMENTS.has(word)
      ? word
      : ELEMENTS.has(word.slice(0, 2)) && VARIABLE.test(word.slice(2))
        ? word.slice(0, 2)
        : ELEMENTS.has(word[0]) && VARIABLE.test(word.slice(1))
          ? word[0]
          : null;
    if (!symbol) return [];
    if (!found.includes(symbol)) found.push(symbol);
  }
  // Lower-case letters outside symbols (other than variables) mean a word, not a formula ("Niobium").
  const rest = text.replace(/[A-Z][a-zδ]*/gu, '').replace(/[\d.()[\]·•:+\-−/ xyzδ]/gu, '');
  return rest ? [] : found;
}

/** The alias a formula key is known by (ybco for yba2cu3o7), if any. */
export function formulaAlias(key: string): string | undefined {
  return ALIAS_OF.get(key);
}

/** Keys that identify a material for search and for the material facet: formula key, its alias, the name's key. */
export function materialKeys(material: string, formula: string): readonly string[] {
  // A one-word material name (YBCO, Bi₂Se₃) is a formula or shorthand too; a longer name is searched by its words,
  // so it plays no part here (and the memo is keyed by the formula alone).
  const name = /\s/.test(material.trim()) ? '' : material;
  const memo = name ? `${name}\u0000${formula}` : formula;
  const known = MATERIAL_KEYS.get(memo);
  if (known) return known;
  const keys = new Set<string>();
  for (const text of [formula, name]) {
    const key = formulaKey(text);
    if (!key) continue;
    keys.add(key);
    const alias = formulaAlias(key) ?? (FORMULA_ALIASES[key] ? key : undefined);
    if (alias) keys.add(alias);
  }
  // Materials repeat across versions; a bounded memo spares re-parsing them on every add and remove.
  if (MATERIAL_KEYS.size >= MEMO_LIMIT) MATERIAL_KEYS.clear();
  const list = [...keys];
  MATERIAL_KEYS.set(memo, list);
  return list;
}
const MATERIAL_KEYS = new Map<string, string[]>();
