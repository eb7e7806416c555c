// A corpus of classic XSS payloads through every text field a published record shows: title, Markdown description,
// creator names and affiliations, keywords, file names and the group's name and institution, rendered with
// react-dom/server exactly as the landing page and the search-result card render them. No payload may leave a tag,
// an event-handler attribute or a script URL behind; the JSON-LD block (data, never executed) may not be closed early.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DatasetLanding } from '@/components/dataset/dataset-landing';
import { PublishedCard } from '@/components/datasets/published-card';
import { db } from '@/lib/db';
import { getLandingView } from '@/lib/datasets/get-landing-view';
import { listRecentPublished } from '@/lib/datasets/repo';
import { anonymous, closeDb, dropLandingLabs, dropOwnBlobs, fixtureMeta, insertAnalysedFile, insertDataset, insertVersion, makeLandingLab, type LandingLab } from '../landing/fixtures';

// Classic payloads (OWASP XSS filter evasion cheat sheet forms) plus Markdown and JSON-LD specific ones.
const CORPUS = [
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  '<svg onload=alert(1)>',
  '<svg><script>alert(1)</script></svg>',
  '"><script>alert(1)</script>',
  "'><img src=x onerror=alert(1)>",
  '<a href="javascript:alert(1)">x</a>',
  'javascript:alert(1)',
  '<iframe src="javascript:alert(1)"></iframe>',
  '<body onload=alert(1)>',
  '<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>',
  '[x](javascript:alert(1))',
  '[x](JaVaScRiPt:alert(1)) [y](&#106;avascript:alert(1)) [z](data:text/html,<script>alert(1)</script>)',
  '![x](javascript:alert(1))',
  '</script><script>alert(1)</script>',
  '<div style="background:url(javascript:alert(1))">',
  '{{constructor.constructor("alert(1)")()}}',
];

const DANGEROUS_TAGS = /<(script|iframe|object|embed|form|base|meta|style|link|math|body|img)[\s>/]/gi;

/** Every attribute name of every real tag (React quotes and escapes values, so a payload inside a value is one value). */
function attributeNames(html: string): string[] {
  const tags = html.match(/<[a-z][a-z0-9-]*(?:\s+[^\s=>"']+(?:="[^"]*")?)*\s*\/?>/gi) ?? [];
  return tags.flatMap((tag) => [...tag.matchAll(/\s([^\s=>"']+)(?:="[^"]*")?/g)].map((m) => m[1]!.toLowerCase()));
}

/** Attribute values with HTML character references decoded and whitespace/control characters removed, as a browser reads a URL. */
function urlAttributes(html: string): string[] {
  const values = [...html.matchAll(/\s(?:href|src|action|formaction|xlink:href|poster|srcset)="([^"]*)"/gi)].map((m) => m[1]!);
  return values.map((v) =>
    v
      .replace(/&#x([0-9a-f]+);?/gi, (_, h: string) => String.fromCodePoint(parseInt(h, 16)))
      .replace(/&#(\d+);?/g, (_, d: string) => String.fromCodePoint(Number(d)))
      .replace(/&amp;/g, '&').replace(/&quot;/g, '"').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&#x27;|&#39;/g, "'")
      .replace(/[\u0000-\u0020]/g, '')
      .toLowerCase(),
  );
}

function assertInert(html: string, baselineSvgs: number): void {
  const withoutLd = html.replace(/<script type="application\/ld\+json">[\s\S]*?<\/script>/g, '');
  expect(withoutLd.match(DANGEROUS_TAGS) ?? []).toEqual([]);
  expect(attributeNames(withoutLd).filter((name) => name.startsWith('on'))).toEqual([]);
  expect((html.match(/<svg[\s>]/g) ?? []).length).toBe(baselineSvgs);
  for (const url of urlAttributes(html)) expect(url).not.toMatch(/^(javascript|vbscript|data):/);
}

let lab: LandingLab;
const rendered: { payload: string; landing: string; card: string; jsonLd: string | null }[] = [];
let baselineSvgs = 0;

async function publish(title: string, payload: string) {
  const meta = fixtureMeta('cu-wire-rt.meta.json');
  const { datasetId } = await insertDataset(lab);
  const record = {
    ...meta,
    title,
    description: `Intro ${payload}\n\n${payload}\n\n* ${payload}`,
    creators: [{ name: payload, affiliation: [{ name: payload }] }, { name: `Imogen Vale ${payload}` }],
    keywords: [payload, 'copper'],
  };
  const { versionId } = await insertVersion(datasetId, lab, { number: 1, state: 'published', metadata: record, publishedAt: new Date(Date.UTC(2026, 11, 2)) });
  const fileId = await insertAnalysedFile(versionId, 'cu-wire-rt.csv', meta);
  await db()('files').where({ id: fileId }).update({ name: `${payload}.csv` });
  return { datasetId, versionId };
}

beforeAll(async () => {
  lab = await makeLandingLab();
  const base = await publish('A plain copper wire', 'plain text');
  baselineSvgs = (renderToStaticMarkup(createElement(DatasetLanding, { view: await getLandingView({ target: { datasetId: base.datasetId }, actor: anonymous }) })).match(/<svg[\s>]/g) ?? []).length;
  for (const [i, payload] of CORPUS.entries()) {
    // The group's own name and institution carry the payload too (shown in the landing header and on search cards).
    await db()('groups').where({ id: lab.groupId }).update({ name: `${payload} ${i}`, institution: payload });
    const title = `XSS corpus ${i} ${lab.slug} ${payload}`;
    const { datasetId } = await publish(title, payload);
    const view = await getLandingView({ target: { datasetId }, actor: anonymous });
    const [card] = await listRecentPublished(1, `XSS corpus ${i} ${lab.slug}`);
    rendered.push({
      payload,
      landing: renderToStaticMarkup(createElement(DatasetLanding, { view })),
      card: renderToStaticMarkup(createElement(PublishedCard, { dataset: card! })),
      jsonLd: view.jsonLd ?? null,
    });
  }
}, 120_000);

afterAll(async () => {
  await dropLandingLabs();
  await dropOwnBlobs();
  await closeDb();
});

describe('the inertness check itself', () => {
  it.each([
    ['an event handler', '<p title="a"><img src=x onerror=alert(1)></p>'],
    ['a quoted event handler', '<a title="x" onclick="alert(1)">x</a>'],
    ['an entity-encoded javascript: URL', '<a href="jav&#x61;script:alert(1)">x</a>'],
    ['a script tag', '<div><script>alert(1)</script></div>'],
  ])('catches %s', (_what, html) => {
    expect(() => assertInert(html, 0)).toThrow();
  });

  it('lets an escaped payload inside a quoted attribute pass', () => {
    expect(() => assertInert('<p title="&lt;img src=x onerror=alert(1)&gt;">&lt;svg onload=alert(1)&gt;</p>', 0)).not.toThrow();
  });
});

describe.each(CORPUS.map((payload, i) => [i, payload] as const))('payload %i %j', (i) => {
  it('the landing page keeps it as text: no new tag, no event handler, no script URL', () => {
    const { landing, payload } = rendered[i]!;
    assertInert(landing, baselineSvgs);
    // It is still shown, escaped: the title reaches the page as text.
    expect(landing).toContain(`XSS corpus ${i}`);
    if (payload.includes('<')) expect(landing).toContain('&lt;');
  });

  it('the JSON-LD block cannot be closed early and parses back to the same title', () => {
    const { jsonLd, landing, payload } = rendered[i]!;
    expect(jsonLd).not.toBeNull();
    expect(jsonLd).not.toMatch(/[<>]/);
    expect((JSON.parse(jsonLd!) as { name: string }).name).toBe(`XSS corpus ${i} ${lab.slug} ${payload}`);
    expect(landing.match(/<script/g)).toHaveLength(1);
  });

  it('the search-result card shows the title and group name as text', () => {
    const { card, payload } = rendered[i]!;
    assertInert(card, 0);
    if (payload.includes('<')) expect(card).toContain('&lt;');
  });
});
