import type { ReactNode } from 'react';
import type { OperationView } from '@/lib/openapi/api-page-model';

const METHOD_STYLES: Record<string, string> = {
  GET: 'bg-slate-700 text-white',
  POST: 'bg-copper-700 text-white',
  PUT: 'bg-amber-800 text-white',
  PATCH: 'bg-amber-800 text-white',
  DELETE: 'bg-red-800 text-white',
};

export function MethodBadge({ method }: { method: string }) {
  return <span className={`inline-block w-16 shrink-0 rounded px-1.5 py-0.5 text-center font-mono text-xs font-semibold ${METHOD_STYLES[method] ?? 'bg-slate-500 text-white'}`}>{method}</span>;
}

/** A path that wraps only at its slashes on narrow screens. */
export function PathText({ path }: { path: string }) {
  return <>{path.split('/').map((segment, i) => (i === 0 ? segment : <span key={i}><wbr />/{segment}</span>))}</>;
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="mt-4">
      <h4 className="text-xs font-semibold uppercase tracking-wide text-slate-500">{title}</h4>
      <div className="mt-1.5">{children}</div>
    </section>
  );
}

/** One operation: method and path, who may call it, parameters, body fields, answers, refusals and a curl command. */
export function OperationCard({ op }: { op: OperationView }) {
  return (
    <details id={op.anchor} className="group scroll-mt-4 rounded-lg border border-slate-200 bg-white open:shadow-sm">
      <summary className="flex cursor-pointer list-none flex-wrap items-baseline gap-x-3 gap-y-1 px-4 py-3 hover:bg-slate-50 [&::-webkit-details-marker]:hidden">
        <span className="flex min-w-0 flex-1 basis-72 items-baseline gap-2">
          <span aria-hidden="true" className="inline-block w-3 shrink-0 text-slate-400 transition-transform group-open:rotate-90">›</span>
          <MethodBadge method={op.method} />
          <code className="min-w-0 break-words font-mono text-sm text-slate-900"><PathText path={op.path} /></code>
        </span>
        <span className="pl-5 text-sm text-slate-600 sm:pl-0 sm:text-right">{op.summary}</span>
      </summary>
      <div className="border-t border-slate-100 px-4 pb-5 pt-3 text-sm">
        {op.description && <p className="max-w-3xl text-slate-700">{op.description}</p>}
        <p className="mt-3 rounded-md bg-slate-50 px-3 py-2 text-slate-700">
          <span className="font-semibold">Who may call it: </span>{op.access.text}
        </p>
        {op.params.length > 0 && (
          <Section title="Parameters">
            <ul className="space-y-1.5">
              {op.params.map((p) => (
                <li key={`${p.location}-${p.name}`}>
                  <code className="font-mono font-semibold">{p.name}</code>{' '}
                  <span className="text-slate-500">({p.location}, {p.type}{p.required ? ', required' : ''})</span>
                  {p.description && <span className="text-slate-700"> — {p.description}</span>}
                </li>
              ))}
            </ul>
          </Section>
        )}
        {op.body && (
          <Section title={op.body.required ? 'Request body' : 'Request body (optional)'}>
            <p className="mb-1.5 text-slate-700">
              JSON, schema <code className="font-mono">{op.body.schemaName}</code>{op.body.description ? `. ${op.body.description}` : '.'}
            </p>
            <ul className="space-y-1.5">
              {op.body.fields.map((f) => (
                <li key={f.name} className="break-words">
                  <code className="font-mono font-semibold">{f.name}</code>{' '}
                  <span className="text-slate-500">({f.type}{f.required ? ', required' : ''}{f.limits.length ? `; ${f.limits.join(', ')}` : ''})</span>
                  {f.description && <span className="text-slate-700"> — {f.description}</span>}
                </li>
              ))}
            </ul>
          </Section>
        )}
        <Section title="Answers">
          <ul className="space-y-1">
            {op.responses.map((r) => (
              <li key={r.status}>
                <span className="font-mono font-semibold text-emerald-800">{r.status}</span> {r.description}
                {r.body && <span className="text-slate-500"> · {r.body}</span>}
              </li>
            ))}
          </ul>
        </Section>
        <Section title="Refusals (Error body)">
          <ul className="space-y-1">
            {op.errors.map((r) => (
              <li key={r.status}><span className="font-mono font-semibold text-red-800">{r.status}</span> {r.description}</li>
            ))}
          </ul>
        </Section>
        <Section title="Example">
          <pre className="overflow-x-auto rounded-md bg-slate-900 p-3 font-mono text-xs leading-relaxed text-slate-100"><code>{op.curl}</code></pre>
        </Section>
      </div>
    </details>
  );
}
