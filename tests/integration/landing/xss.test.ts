// Hostile text in a published record (title, description, creator names) reaches the page only as text: through the
// JSON-LD script, the Markdown description and the header, rendered by React on the server as the page is.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DatasetLanding } from '@/components/dataset/dataset-landing';
import { getLandingView } from '@/lib/datasets/get-landing-view';
import type { LandingView } from '@/lib/datasets/landing-types';
import { anonymous, closeDb, dropLandingLabs, fixtureMeta, insertDataset, insertVersion, makeLandingLab } from './fixtures';

const IMG = '<img src=x onerror=alert(1)>';
const BREAKOUT = '</script><script>alert(1)</script>';
const TITLE = `Copper ${IMG} wire ${BREAKOUT}`;
const DESCRIPTION = [
  `Raw HTML: ${IMG}`,
  '',
  `<script>alert(2)</script>`,
  '',
  '[a javascript link](javascript:alert(3)) and [a data link](data:text/html;base64,PHNjcmlwdD5hbGVydCg0KTwvc2NyaXB0Pg==)',
  '',
  '![tracking pixel](https://tracker.example/p.gif) and [a fine link](https://example.org/notes) and `code`',
].join('\n');

let view: LandingView;
let html: string;
/** The page without its JSON-LD script (whose escaped copy of the description would match the checks below). */
let visible: string;

beforeAll(async () => {
  const lab = await makeLandingLab();
  const { datasetId } = await insertDataset(lab);
  const record = {
    ...fixtureMeta('cu-wire-rt.meta.json'),
    title: TITLE,
    description: DESCRIPTION,
    creators: [{ name: `Imogen ${IMG} Vale`, affiliation: [{ name: `Lab ${BREAKOUT}` }] }, { name: BREAKOUT }],
    keywords: [IMG],
  };
  await insertVersion(datasetId, lab, { number: 1, state: 'published', metadata: record, publishedAt: new Date(Date.UTC(2026, 11, 2)) });
  view = await getLandingView({ target: { datasetId }, actor: anonymous });
  html = renderToStaticMarkup(createElement(DatasetLanding, { view }));
  visible = html.replace(/<script type="application\/ld\+json">[\s\S]*?<\/script>/, '');
});

afterAll(async () => {
  await dropLandingLabs();
  await closeDb();
});

describe('hostile text on the landing page', () => {
  it('cannot end the JSON-LD script: <, > and & are \\u escapes, and the value parses back unchanged', () => {
    expect(view.jsonLd).not.toMatch(/[<>&]/);
    expect(view.jsonLd).toContain('\\u003c/script\\u003e\\u003cscript\\u003e');
    const ld = JSON.parse(view.jsonLd!);
    expect(ld.name).toBe(TITLE);
    expect(ld.creator[1].name).toBe(BREAKOUT);
    // Exactly one script element in the page body: the JSON-LD; its content holds no closing tag.
    expect(html.match(/<script/g)).toHaveLength(1);
    const script = /<script type="application\/ld\+json">([\s\S]*?)<\/script>/.exec(html);
    expect(script?.[1]).toBe(view.jsonLd);
  });

  it('renders title, creator names, affiliations and keywords as escaped text', () => {
    expect(html).not.toMatch(/<img[\s>]/);
    expect(html).toContain('Copper &lt;img src=x onerror=alert(1)&gt; wire &lt;/script&gt;&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('Imogen &lt;img src=x onerror=alert(1)&gt; Vale');
    expect(html).toContain('(Lab &lt;/script&gt;&lt;script&gt;alert(1)&lt;/script&gt;)');
  });

  it('drops raw HTML from the Markdown description and keeps only web links', () => {
    expect(visible).not.toContain('alert(2)');
    expect(visible).not.toContain('<script');
    expect(visible).toContain('<p>Raw HTML: </p>');
    expect(html).not.toMatch(/href="(javascript|data):/i);
    expect(html).toContain('<span>a javascript link</span>');
    expect(html).toContain('<span>a data link</span>');
    expect(html).toContain('<a href="https://example.org/notes" rel="nofollow ugc noopener noreferrer">a fine link</a>');
    // No third-party image loads from the page: the image becomes a link to it.
    expect(html).toContain('<a href="https://tracker.example/p.gif" rel="nofollow ugc noopener noreferrer">Image: tracking pixel</a>');
    expect(html).toContain('<code>code</code>');
  });

  it('keeps the escaped text in the citation formats too', () => {
    expect(view.citations?.text).toContain(TITLE);
    expect(html).not.toContain(`>${BREAKOUT}<`);
  });
});
