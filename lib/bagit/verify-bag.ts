// Verifies a BagIt 1.0 bag (RFC 8493), a directory or a zip of one: structure, completeness, Payload-Oxum and digests.
import { mkdtemp, readFile, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { showPath } from './bag-paths';
import { checkFetch, checkManifests, type Manifest } from './check-manifests';
import { DIGEST_HEX_LENGTH, decodeTagText, parseBagitTxt, parseFetch, parseManifest, parseTagElements, type FetchEntry } from './parse-tag-files';
import { checkPayloadOxum } from './payload-oxum';
import { hashFile, readBagTree, type BagTree } from './read-bag-tree';
import { extractZip, findBagRoot } from './unzip-bag';

export type BagReport = {
  valid: boolean;
  /** Each a one-line sentence naming the file concerned; any problem makes the bag invalid. */
  problems: string[];
  /** Accepted, but worth a look (RFC "SHOULD"s, Unicode-normalised matches, an older BagIt-Version). */
  warnings: string[];
  payloadFiles: number;
  payloadBytes: number;
  /** Algorithms of the payload manifests, e.g. ["sha256", "sha512"]. */
  algorithms: string[];
};

const MANIFEST_NAME = /^(tag)?manifest-([^/]+)\.txt$/;

type Context = { tree: BagTree; encoding: string; report: BagReport };

async function readTagText(ctx: Context, rel: string): Promise<string | undefined> {
  const file = ctx.tree.files.get(rel);
  if (!file) return undefined;
  const text = decodeTagText(await readFile(file.absPath), ctx.encoding);
  if (text === undefined) ctx.report.problems.push(`${rel}: is not valid ${ctx.encoding} (the bag's Tag-File-Character-Encoding)`);
  return text;
}

async function readManifests(ctx: Context): Promise<Manifest[]> {
  const manifests: Manifest[] = [];
  for (const rel of ctx.tree.files.keys()) {
    const m = MANIFEST_NAME.exec(rel);
    if (!m) continue;
    const algorithm = m[2]!;
    if (DIGEST_HEX_LENGTH[algorithm] === undefined) {
      ctx.report.problems.push(`${rel}: the algorithm "${algorithm}" is not supported (${Object.keys(DIGEST_HEX_LENGTH).join(', ')})`);
      continue;
    }
    const text = await readTagText(ctx, rel);
    if (text === undefined) continue;
    const parsed = parseManifest(text, rel, algorithm);
    ctx.report.problems.push(...parsed.problems);
    ctx.report.warnings.push(...parsed.warnings);
    manifests.push({ fileName: rel, algorithm, kind: m[1] ? 'tag' : 'payload', parsed });
  }
  return manifests;
}

async function checkBagInfo(ctx: Context, payloadBytes: number, payloadFiles: number): Promise<void> {
  const text = await readTagText(ctx, 'bag-info.txt');
  if (text === undefined) return;
  const info = parseTagElements(text, 'bag-info.txt');
  ctx.report.problems.push(...info.problems);
  ctx.report.warnings.push(...info.warnings);
  const oxums = info.elements.filter((e) => e.label.toLowerCase() === 'payload-oxum');
  if (oxums.length > 1) ctx.report.problems.push(`bag-info.txt: Payload-Oxum appears ${oxums.length} times`);
  for (const e of oxums) ctx.report.problems.push(...checkPayloadOxum(e.value.trim(), { octets: payloadBytes, streams: payloadFiles }));
}

async function verifyDigests(ctx: Context, toHash: Map<string, Map<string, string>>): Promise<void> {
  for (const [rel, expected] of toHash) {
    const actual = await hashFile(ctx.tree.files.get(rel)!.absPath, [...expected.keys()]);
    for (const [algorithm, digest] of expected) {
      const got = actual.get(algorithm)!;
      if (got !== digest) ctx.report.problems.push(`${showPath(rel)}: ${algorithm} is ${got}, the manifest says ${digest}`);
    }
  }
}

/** Verifies the bag whose base directory (the one holding bagit.txt) is root. */
export async function verifyBagDirectory(root: string): Promise<BagReport> {
  const report: BagReport = { valid: false, problems: [], warnings: [], payloadFiles: 0, payloadBytes: 0, algorithms: [] };
  const tree = await readBagTree(root);
  report.problems.push(...tree.problems);
  const bagit = tree.files.get('bagit.txt');
  if (!bagit) {
    report.problems.push('bagit.txt: missing, so this is not a bag');
    return report;
  }
  const declaration = parseBagitTxt(await readFile(bagit.absPath));
  report.problems.push(...declaration.problems);
  report.warnings.push(...declaration.warnings);
  let encoding = declaration.encoding ?? 'utf-8';
  if (decodeTagText(new Uint8Array(0), encoding) === undefined) {
    report.problems.push(`bagit.txt: the Tag-File-Character-Encoding "${encoding}" is not one this verifier knows; tag files read as UTF-8`);
    encoding = 'utf-8';
  }
  const ctx: Context = { tree, encoding, report };
  if (!tree.directories.has('data')) report.problems.push('data/: the payload directory is missing');
  const payload = [...tree.files].filter(([rel]) => rel.startsWith('data/'));
  report.payloadFiles = payload.length;
  report.payloadBytes = payload.reduce((sum, [, f]) => sum + f.sizeBytes, 0);

  const manifests = await readManifests(ctx);
  const payloadManifests = manifests.filter((m) => m.kind === 'payload');
  report.algorithms = payloadManifests.map((m) => m.algorithm);
  if (payloadManifests.length === 0) report.problems.push('manifest-<algorithm>.txt: the bag has no payload manifest');
  let fetched: FetchEntry[] = [];
  const fetchText = await readTagText(ctx, 'fetch.txt');
  if (fetchText !== undefined) {
    const parsed = parseFetch(fetchText);
    fetched = parsed.entries;
    report.problems.push(...parsed.problems, ...checkFetch(fetched, payloadManifests, new Map(payload.map(([rel, f]) => [rel, f.sizeBytes]))));
    report.warnings.push(...parsed.warnings);
  }
  const check = checkManifests(manifests, new Set(tree.files.keys()), fetched);
  report.problems.push(...check.problems);
  report.warnings.push(...check.warnings);
  for (const t of manifests.filter((m) => m.kind === 'tag')) {
    for (const rel of tree.files.keys()) {
      if (rel.startsWith('data/') || MANIFEST_NAME.exec(rel)?.[1] || t.parsed.entries.has(rel)) continue;
      report.warnings.push(`${t.fileName}: does not list the tag file ${showPath(rel)}`);
    }
  }
  await checkBagInfo(ctx, report.payloadBytes, report.payloadFiles);
  await verifyDigests(ctx, check.toHash);
  report.valid = report.problems.length === 0;
  return report;
}

/** Verifies a bag given as a directory or as a zip (unpacked into a temporary directory that is removed afterwards). */
export async function verifyBag(target: string): Promise<BagReport> {
  const info = await stat(target);
  if (info.isDirectory()) return verifyBagDirectory(target);
  const dir = await mkdtemp(path.join(tmpdir(), 'ohmstead-bag-'));
  try {
    try {
      await extractZip(target, dir);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      return { valid: false, problems: [`${path.basename(target)}: cannot be unpacked safely: ${message}`], warnings: [], payloadFiles: 0, payloadBytes: 0, algorithms: [] };
    }
    return await verifyBagDirectory(await findBagRoot(dir));
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
