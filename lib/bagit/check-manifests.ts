// Completeness of a bag's manifests against the files present (RFC 8493 §2.1.3, §2.2.1, §2.2.3, §3). Pure.
import { showPath, unsafeBagPathReason } from './bag-paths';
import type { FetchEntry, ManifestEntries } from './parse-tag-files';

export type Manifest = { fileName: string; algorithm: string; kind: 'payload' | 'tag'; parsed: ManifestEntries };

/** Which present file a manifest path names: the same string, or failing that the same string after NFC normalisation. */
export type PathResolver = (listed: string) => { path: string; normalised: boolean } | undefined;

export function pathResolver(present: Iterable<string>): PathResolver {
  const exact = new Set(present);
  const byNfc = new Map([...exact].map((p) => [p.normalize('NFC'), p]));
  return (listed) => {
    if (exact.has(listed)) return { path: listed, normalised: false };
    const other = byNfc.get(listed.normalize('NFC'));
    return other === undefined ? undefined : { path: other, normalised: true };
  };
}

export type ManifestCheck = { problems: string[]; warnings: string[]; toHash: Map<string, Map<string, string>> };

/**
 * Checks every manifest line names a present file of the right kind, and every payload file is in every payload
 * manifest. Returns, per present file, the digests to verify by algorithm.
 */
export function checkManifests(manifests: Manifest[], present: Set<string>, fetched: FetchEntry[]): ManifestCheck {
  const out: ManifestCheck = { problems: [], warnings: [], toHash: new Map() };
  const resolve = pathResolver(present);
  const inFetch = new Set(fetched.map((f) => f.path));
  const payload = [...present].filter((p) => p.startsWith('data/'));
  for (const m of manifests) {
    const listed = new Set<string>();
    for (const [path, digest] of m.parsed.entries) {
      const unsafe = unsafeBagPathReason(path);
      if (unsafe) {
        out.problems.push(`${m.fileName}: the path ${showPath(path)} ${unsafe}`);
        continue;
      }
      if (m.kind === 'payload' && !path.startsWith('data/')) {
        out.problems.push(`${m.fileName}: lists ${showPath(path)}, which is outside the payload directory data/`);
        continue;
      }
      if (m.kind === 'tag' && path.startsWith('data/')) {
        out.problems.push(`${m.fileName}: lists the payload file ${showPath(path)}; tag manifests list tag files only`);
        continue;
      }
      if (m.kind === 'tag' && /^tagmanifest-[^/]+\.txt$/.test(path)) {
        out.problems.push(`${m.fileName}: lists the tag manifest ${path}; tag manifests must not list tag manifests`);
        continue;
      }
      const found = resolve(path);
      if (!found) {
        out.problems.push(
          inFetch.has(path)
            ? `${showPath(path)}: listed in fetch.txt but not fetched yet (this verifier does not download; fetch it, then verify again)`
            : `${m.fileName}: lists ${showPath(path)}, which is not in the bag`,
        );
        continue;
      }
      if (found.normalised) out.warnings.push(`${m.fileName}: ${showPath(path)} matches ${showPath(found.path)} only after Unicode normalisation`);
      listed.add(found.path);
      const digests = out.toHash.get(found.path) ?? new Map<string, string>();
      digests.set(m.algorithm, digest);
      out.toHash.set(found.path, digests);
    }
    if (m.kind === 'payload') {
      for (const p of payload) if (!listed.has(p)) out.problems.push(`${m.fileName}: does not list the payload file ${showPath(p)}`);
    }
  }
  return out;
}

/** fetch.txt lines: payload paths only, each in every payload manifest, length matching when the file is present. */
export function checkFetch(entries: FetchEntry[], payloadManifests: Manifest[], sizes: Map<string, number>): string[] {
  const problems: string[] = [];
  for (const e of entries) {
    const unsafe = unsafeBagPathReason(e.path);
    if (unsafe) problems.push(`fetch.txt: the path ${showPath(e.path)} ${unsafe}`);
    else if (!e.path.startsWith('data/')) problems.push(`fetch.txt: lists ${showPath(e.path)}, which is not a payload file`);
    for (const m of payloadManifests)
      if (!m.parsed.entries.has(e.path)) problems.push(`fetch.txt: ${showPath(e.path)} is not listed in ${m.fileName}`);
    const size = sizes.get(e.path);
    if (size !== undefined && e.lengthBytes !== undefined && size !== e.lengthBytes)
      problems.push(`fetch.txt: ${showPath(e.path)} declares ${e.lengthBytes} bytes, the file has ${size}`);
  }
  return problems;
}
