// Group slugs: the group's address (/groups/<slug>), made from its name, lower-case ASCII words joined by '-'.

export const SLUG_MIN = 3;
export const SLUG_MAX = 80;
export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** Paths under /groups that are pages, not groups. */
export const RESERVED_SLUGS: ReadonlySet<string> = new Set(['new', 'invitations', 'admin', 'api', 'members', 'audit']);

/** "Larkspur Cryogenic Lab (Ørsted wing)" → "larkspur-cryogenic-lab-orsted-wing"; at most 80 characters, cut at a word end. */
export function slugFromName(name: string): string {
  const ascii = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '') // combining marks left by NFKD (é → e)
    .replace(/ø/gi, 'o').replace(/æ/gi, 'ae').replace(/ß/g, 'ss').replace(/đ/gi, 'd').replace(/ł/gi, 'l')
    .toLowerCase();
  const words = ascii.split(/[^a-z0-9]+/).filter(Boolean);
  let slug = '';
  for (const w of words) {
    const next = slug ? `${slug}-${w}` : w;
    if (next.length > SLUG_MAX) break;
    slug = next;
  }
  return slug || (words[0] ?? '').slice(0, SLUG_MAX);
}

/** Why a slug cannot be used, or null when it can. */
export function slugProblem(slug: string): string | null {
  if (slug.length < SLUG_MIN || slug.length > SLUG_MAX) return `Use ${SLUG_MIN} to ${SLUG_MAX} characters.`;
  if (!SLUG_PATTERN.test(slug)) return 'Use lower-case letters a–z, digits and single hyphens between words.';
  if (RESERVED_SLUGS.has(slug)) return `"${slug}" is the name of a page on Ohmstead; choose another.`;
  return null;
}

/** The first free candidate: the base, then base-2 … base-99. Null when all of those are taken. */
export function firstFreeSlug(base: string, taken: ReadonlySet<string>): string | null {
  const usable = (s: string) => !taken.has(s) && slugProblem(s) === null;
  if (usable(base)) return base;
  for (let n = 2; n < 100; n += 1) {
    const suffix = `-${n}`;
    const candidate = `${base.slice(0, SLUG_MAX - suffix.length).replace(/-+$/, '')}${suffix}`;
    if (usable(candidate)) return candidate;
  }
  return null;
}
