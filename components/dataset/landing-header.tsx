import Link from 'next/link';
import type { LandingCreator, LandingView } from '@/lib/datasets/landing-types';
import { CopyButton } from './copy-button';
import { LocalDateTime } from './local-date-time';
import { StateBadges } from './state-badges';
import { VersionPicker } from './version-picker';

function Creator({ creator }: { creator: LandingCreator }) {
  return (
    <li className="inline">
      <span className="font-medium text-slate-900">{creator.name}</span>
      {creator.orcidUrl && (
        <a href={creator.orcidUrl} rel="noopener noreferrer" aria-label={`ORCID iD of ${creator.name}: ${creator.orcid}`}
          className="ml-1 inline-flex translate-y-[-1px] items-center rounded bg-lime-700 px-1 text-[0.65rem] font-bold leading-4 text-white hover:bg-lime-800">
          iD
        </a>
      )}
      {creator.affiliations.length > 0 && <span className="text-slate-600"> ({creator.affiliations.join('; ')})</span>}
    </li>
  );
}

function DoiLine({ view }: { view: LandingView }) {
  const { version } = view;
  if (!version.doi || !version.doiUrl) {
    return <p className="text-sm text-slate-700">DOI: being assigned; it appears here as soon as the DOI agency confirms it.</p>;
  }
  const isPublic = version.state === 'published' || version.state === 'withdrawn';
  return (
    <div className="flex flex-col gap-1 text-sm">
      <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
        <span className="font-semibold text-slate-800">DOI</span>
        {isPublic ? (
          <a href={version.doiUrl} className="break-all font-mono text-copper-800 underline decoration-copper-300 underline-offset-2">{version.doiUrl}</a>
        ) : (
          <span className="break-all font-mono text-slate-800">{version.doi}</span>
        )}
        <CopyButton text={version.doiUrl} label="Copy the DOI link" doneMessage="DOI copied" />
      </p>
      {!isPublic && <p className="text-xs text-slate-600">Reserved as a draft DOI: it resolves once this version is published.</p>}
      {version.state === 'published' && !version.doiRegistered && (
        <p className="text-xs text-amber-900">Registration pending: the DOI agency has not confirmed it yet. We retry automatically; the link works once it has.</p>
      )}
      {view.dataset.conceptDoiUrl && (
        <p className="text-xs text-slate-600">
          All versions: <a href={view.dataset.conceptDoiUrl} className="break-all font-mono underline">{view.dataset.conceptDoiUrl}</a>
        </p>
      )}
    </div>
  );
}

export type LandingHeaderProps = { view: LandingView };

/** Group, title, creators with ORCID links, state and embargo badges, version picker and the DOI. */
export function LandingHeader({ view }: LandingHeaderProps) {
  const { version, group, creators } = view;
  return (
    <header className="flex flex-col gap-3 border-b border-slate-200 pb-6">
      {group ? (
        <p className="text-sm text-slate-600">
          <Link href={`/groups/${group.slug}`} className="font-medium text-copper-800 hover:underline">{group.name}</Link>
          {group.institution && <span> · {group.institution}</span>}
        </p>
      ) : (
        <p className="text-sm text-slate-600">Authors and group are hidden in this anonymous review copy.</p>
      )}
      <h1 className="text-2xl font-semibold tracking-tight break-words text-slate-900 sm:text-3xl">{version.title.trim() || 'Untitled dataset'}</h1>
      {creators && creators.length > 0 && (
        <div className="text-sm">
          <h2 className="sr-only">Creators</h2>
          <ul className="leading-relaxed [&>li:not(:last-child)]:after:content-[';_']">
            {creators.map((c, i) => <Creator key={`${c.name}-${i}`} creator={c} />)}
          </ul>
        </div>
      )}
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <StateBadges state={version.state} embargo={view.embargo} />
        <VersionPicker versions={view.versions} />
        {version.publishedAt && (
          <span className="text-sm text-slate-600">Published <LocalDateTime iso={version.publishedAt} /></span>
        )}
      </div>
      <DoiLine view={view} />
    </header>
  );
}
