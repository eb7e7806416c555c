import type { Metadata } from 'next';
import Link from 'next/link';
import { PageTitle } from '@/components/ui/page-title';
import { env } from '@/lib/env';
import { apiPageModel } from '@/lib/openapi/api-page-model';
import { API_BASE_PATH } from '@/lib/openapi/build-openapi';
import { OPERATIONS } from '@/lib/openapi/routes';
import { openApiDocument } from '@/lib/openapi/serve-openapi';
import { MethodBadge, OperationCard, PathText } from './operation-card';

export const metadata: Metadata = { title: 'API', description: 'The Ohmstead REST API: routes, token scopes, request bodies, answers and curl examples.' };

const SCOPES: [string, string][] = [
  ['read', 'GET routes: drafts, versions, files, analyses, groups.'],
  ['deposit', 'Every other write: datasets, uploads, records, submitting, groups. Includes read.'],
  ['publish', 'Publish, return and withdraw versions (where your group role allows). Includes read.'],
  ['admin', 'Site administration. Includes every other scope.'],
];

export default function ApiDocsPage() {
  const doc = openApiDocument();
  const tags = apiPageModel(doc, OPERATIONS);
  const origin = env().NEXTAUTH_URL.replace(/\/$/, '');
  const openApiUrl = `${API_BASE_PATH}/openapi.json`;
  return (
    <div className="max-w-4xl">
      <PageTitle lead={<>Script Ohmstead from the lab PC: start datasets, upload files, save the measurement record, publish, find and download. This page is built from the same document as <a href={openApiUrl} className="font-mono text-copper-700 underline">{openApiUrl}</a> (OpenAPI 3.1, with the JSON Schemas the server validates with).</>}>
        API
      </PageTitle>

      <section aria-labelledby="start" className="rounded-lg border border-slate-200 bg-white p-5 text-sm text-slate-700">
        <h2 id="start" className="text-lg font-semibold text-slate-900">Getting started</h2>
        <ol className="mt-2 list-decimal space-y-2 pl-5">
          <li>Create a personal access token at <Link href="/settings/tokens" className="text-copper-700 underline">Settings → API tokens</Link> with the scopes your script needs. It is shown once; keep it out of notebooks you share.</li>
          <li>Send it on every request as <code className="font-mono">Authorization: Bearer ohm_…</code>. The examples below read it from a shell variable:
            <pre className="mt-2 overflow-x-auto rounded-md bg-slate-900 p-3 font-mono text-xs text-slate-100"><code>{`# the token from /settings/tokens\nexport OHMSTEAD_TOKEN=ohm_…\nexport OHMSTEAD=${origin}`}</code></pre>
          </li>
          <li>Every refusal answers <code className="font-mono">{'{ "error": { "code", "message", "details", "requestId" } }'}</code>; <code className="font-mono">details.fieldErrors</code> names the fields to fix. Past 600 requests a minute per token the API answers 429 with <code className="font-mono">Retry-After</code>.</li>
        </ol>
        <h3 className="mt-4 font-semibold text-slate-900">Token scopes</h3>
        <dl className="mt-1 grid gap-x-4 gap-y-1 sm:grid-cols-[6rem_1fr]">
          {SCOPES.map(([scope, text]) => (
            <div key={scope} className="contents">
              <dt className="font-mono font-semibold">{scope}</dt>
              <dd className="mb-1 sm:mb-0">{text}</dd>
            </div>
          ))}
        </dl>
        <p className="mt-3">Uploading is three steps: <em>begin</em> with the file&apos;s size and SHA-256, <em>PUT</em> each part to its presigned storage URL, then <em>complete</em>; the server checks the digest before it keeps the file. The README has the whole deposit in curl and in Python.</p>
      </section>

      <nav aria-labelledby="contents" className="mt-8">
        <h2 id="contents" className="text-lg font-semibold">Routes</h2>
        <ul className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
          {tags.map((t) => (
            <li key={t.anchor}><a href={`#${t.anchor}`} className="text-copper-700 underline">{t.name}</a> <span className="text-slate-500">({t.operations.length})</span></li>
          ))}
        </ul>
      </nav>

      {tags.map((t) => (
        <section key={t.anchor} aria-labelledby={t.anchor} className="mt-10">
          <h2 id={t.anchor} className="scroll-mt-4 text-xl font-semibold">{t.name}</h2>
          <p className="mt-1 text-sm text-slate-600">{t.description}</p>
          <ul className="mt-3 space-y-1 text-sm" aria-label={`${t.name}: routes at a glance`}>
            {t.operations.map((op) => (
              <li key={op.anchor} className="flex items-baseline gap-2">
                <MethodBadge method={op.method} />
                <a href={`#${op.anchor}`} className="min-w-0 break-words font-mono text-slate-800 hover:underline"><PathText path={op.path} /></a>
              </li>
            ))}
          </ul>
          <div className="mt-4 space-y-3">
            {t.operations.map((op) => <OperationCard key={op.anchor} op={op} />)}
          </div>
        </section>
      ))}

      <p className="mt-10 text-sm text-slate-600">
        Paths are relative to <code className="font-mono">{origin}{API_BASE_PATH}</code>. Machine-readable: <a href={openApiUrl} className="font-mono text-copper-700 underline">{openApiUrl}</a>.
      </p>
    </div>
  );
}
