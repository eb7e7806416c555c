import type { Fact, LandingRecord } from '@/lib/datasets/landing-types';

function Facts({ facts }: { facts: Fact[] }) {
  return (
    <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1 text-sm">
      {facts.map((f) => (
        <div key={f.label} className="contents">
          <dt className="text-slate-600">{f.label}</dt>
          <dd className="num break-words text-slate-900">{f.value}</dd>
        </div>
      ))}
    </dl>
  );
}

function Card({ title, groups }: { title: string; groups: { heading?: string; facts: Fact[] }[] }) {
  const shown = groups.filter((g) => g.facts.length > 0);
  return (
    <section aria-label={title} className="flex flex-col gap-3 rounded-lg border border-slate-200 bg-white p-4">
      <h3 className="font-semibold text-slate-900">{title}</h3>
      {shown.length === 0 ? (
        <p className="text-sm text-slate-600">Not recorded.</p>
      ) : (
        shown.map((g, i) => (
          <div key={g.heading ?? i} className="flex flex-col gap-1">
            {g.heading && <h4 className="text-xs font-semibold uppercase tracking-wide text-copper-800">{g.heading}</h4>}
            <Facts facts={g.facts} />
          </div>
        ))
      )}
    </section>
  );
}

export type RecordCardsProps = { record: LandingRecord };

/** Sample (with geometry and contacts) and measurement (excitation, detection, conditions) side by side. */
export function RecordCards({ record }: RecordCardsProps) {
  const sampleFacts = record.sampleName ? [{ label: 'Name', value: record.sampleName }, ...record.sample] : record.sample;
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <Card title="Sample" groups={[{ facts: sampleFacts }, { heading: 'Geometry', facts: record.geometry }, { heading: 'Contacts', facts: record.contacts }]} />
      <Card title="Measurement" groups={[
        { facts: record.measurement },
        { heading: 'Excitation', facts: record.excitation },
        { heading: 'Detection', facts: record.detection },
        { heading: 'Conditions', facts: record.environment },
      ]} />
    </div>
  );
}

/** Keywords, licence, related work and funding, where the record has them. */
export function RecordExtras({ record }: RecordCardsProps) {
  if (!record.keywords.length && !record.license && !record.related.length && !record.funding.length) return null;
  return (
    <section aria-labelledby="about-heading" className="flex flex-col gap-3 rounded-lg border border-slate-200 bg-white p-4">
      <h2 id="about-heading" className="font-semibold text-slate-900">Licence and links</h2>
      <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-2 text-sm">
        {record.keywords.length > 0 && (
          <>
            <dt className="font-medium text-slate-700">Keywords</dt>
            <dd className="flex flex-wrap gap-1">
              {record.keywords.map((k) => <span key={k} className="rounded-full bg-slate-100 px-2 py-0.5 text-xs text-slate-800">{k}</span>)}
            </dd>
          </>
        )}
        {record.license && (
          <>
            <dt className="font-medium text-slate-700">Licence</dt>
            <dd><a href={record.license.url} rel="noopener noreferrer" className="text-copper-800 underline">{record.license.name}</a> <span className="text-slate-500">({record.license.id})</span></dd>
          </>
        )}
        {record.related.length > 0 && (
          <>
            <dt className="font-medium text-slate-700">Related</dt>
            <dd>
              <ul>
                {record.related.map((r) => (
                  <li key={`${r.relation}-${r.identifier}`} className="break-all">
                    {r.relation}: {r.href ? <a href={r.href} rel="nofollow ugc noopener noreferrer" className="text-copper-800 underline">{r.identifier}</a> : r.identifier}
                  </li>
                ))}
              </ul>
            </dd>
          </>
        )}
        {record.funding.length > 0 && (
          <>
            <dt className="font-medium text-slate-700">Funding</dt>
            <dd><ul>{record.funding.map((f, i) => <li key={i}>{f.funder}{f.award && <span className="text-slate-600"> — {f.award}</span>}</li>)}</ul></dd>
          </>
        )}
      </dl>
    </section>
  );
}
