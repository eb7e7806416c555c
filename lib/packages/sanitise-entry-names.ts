// Turns authors' file names into safe, distinct paths under data/ that unzip the same on Linux, macOS and Windows.

// Names Windows reserves for devices, with or without an extension.
const WINDOWS_DEVICE = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])(\..*)?$/i;
const MAX_SEGMENT_BYTES = 255;

function truncateUtf8(segment: string, maxBytes: number): string {
  if (Buffer.byteLength(segment) <= maxBytes) return segment;
  const dot = segment.lastIndexOf('.');
  const ext = dot > 0 && segment.length - dot <= 16 ? segment.slice(dot) : '';
  let stem = segment.slice(0, segment.length - ext.length);
  while (Buffer.byteLength(stem + ext) > maxBytes) stem = [...stem].slice(0, -1).join('');
  return stem + ext;
}

/** One path segment: control and Windows-forbidden characters become "_", trailing dots and spaces go. */
function cleanSegment(raw: string): string {
  const s = raw
    .normalize('NFC')
    .replace(/[\u0000-\u001F\u007F-\u009F]/g, '_')
    .replace(/[<>:"|?*]/g, '_')
    .trim()
    .replace(/[. ]+$/, '');
  if (s === '') return '';
  return truncateUtf8(WINDOWS_DEVICE.test(s) ? `_${s}` : s, MAX_SEGMENT_BYTES);
}

/** A relative "/"-separated path: "/" and "\" separate folders; empty, "." and ".." segments are dropped. */
export function sanitiseEntryName(name: string): string {
  const path = name.split(/[\\/]+/).map(cleanSegment).filter(Boolean).join('/');
  return path === '' ? 'file' : path;
}

function withSuffix(path: string, n: number): string {
  const slash = path.lastIndexOf('/');
  const dir = path.slice(0, slash + 1);
  const base = path.slice(slash + 1);
  const dot = base.lastIndexOf('.');
  return dot > 0 ? `${dir}${base.slice(0, dot)}-${n}${base.slice(dot)}` : `${dir}${base}-${n}`;
}

/**
 * Sanitised paths for a list of names, in the same order, all distinct ignoring case (macOS and Windows fold it);
 * a later duplicate gets "-2", "-3"… before its extension. A file is never also a folder of another path.
 */
export function sanitiseEntryNames(names: readonly string[]): string[] {
  const files = new Set<string>();
  const folders = new Set<string>();
  const key = (p: string) => p.toLowerCase();
  const ancestors = (p: string) => p.split('/').slice(0, -1).map((_, i, segs) => segs.slice(0, i + 1).join('/'));
  return names.map((name) => {
    let base = sanitiseEntryName(name);
    // A folder named like an earlier file cannot exist beside it: keep the path flat instead.
    if (ancestors(base).some((a) => files.has(key(a)))) base = base.replace(/\//g, '_');
    let candidate = base;
    for (let n = 2; files.has(key(candidate)) || folders.has(key(candidate)); n++) candidate = withSuffix(base, n);
    files.add(key(candidate));
    for (const a of ancestors(candidate)) folders.add(key(a));
    return candidate;
  });
}
