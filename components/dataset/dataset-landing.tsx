import Link from 'next/link';
import type { ReactNode } from 'react';
import type { UsageTotals } from '@/lib/counter/usage-totals';
import type { LandingView } from '@/lib/datasets/landing-types';
import { plural } from '@/lib/format/plural';
import { CitationBox } from './citation-box';
import { CurvesPanel } from './curves-panel';
import { DerivedSection } from './derived-section';
import { FilesTable } from './files-table';
import { LandingHeader } from './landing-header';
import { LocalDateTime } from './local-date-time';
import { MarkdownDescription } from './markdown-description';
import { RecordCards, RecordExtras } from './record-cards';
import { LockIcon } from './state-badges';
import { VersionsList } from './versions-list';

const SECTIONS = [
  ['overview', 'Overview'], ['curves', 'Curves'], ['derived', 'Derived'], ['files', 'Files'], ['versions', 'Versions'],
] as const;

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="flex scroll-mt-4 flex-col gap-4">
      <h2 id={`${id}-heading`} className="text-lg font-semibold text-slate-900">{title}</h2>
      {children}
    </section>
  );
}

function Quiet({ children }: { children: ReactNode }) {
  return <p className="rounded-md border border-dashed border-slate-300 bg-white p-4 text-sm text-slate-700">{children}</p>;
}

function Locked({ children }: { children: ReactNode }) {
  return (
    <p className="flex items-start gap-2 rounded-md border border-amber-300 bg-amber-50 p-4 text-sm text-amber-950">
      <span className="mt-0.5"><LockIcon /></span><span>{children}</span>
    </p>
  );
}

/** Why there is nothing to plot or tabulate, with what happens next. */
function NoAnalysis({ view, what }: { view: LandingView; what: string }) {
  const { pending, failed } = view.analysis;
  if (pending > 0) return <Quiet>{plural(pending, 'file')} {pending === 1 ? 'is' : 'are'} still being analysed; the {what} appear here when that finishes. Reload the page in a minute.</Quiet>;
  if (failed > 0) return <Quiet>{plural(failed, 'file')} could not be read as a data table, so there are no {what}. The files themselves are listed below.</Quiet>;
  return <Quiet>No {what}: none of this version&apos;s files is a data table Ohmstead can read.</Quiet>;
}

function Tombstone({ view }: { view: LandingView }) {
  const w = view.withdrawal!;
  return (
    <div role="note" className="rounded-lg border-2 border-red-300 bg-red-50 p-4 text-sm text-red-950">
      <p className="text-base font-semibold">This version was withdrawn{w.at && <> on <LocalDateTime iso={w.at} /></>}.</p>
      {w.reason && <p className="mt-1"><span className="font-semibold">Reason:</span> {w.reason}</p>}
      <p className="mt-1">Its DOI keeps resolving to this page, and the record below stays citable; the files and curves are no longer available.</p>
    </div>
  );
}

const WORKSPACE_ACTIONS = new Set(['edit', 'submit', 'publish', 'return_to_draft']);

export type DatasetLandingProps = {
  view: LandingView;
  /** Shown above everything, e.g. the reviewer view's "confidential review copy" band. */
  banner?: ReactNode;
  /** COUNTER totals for this version, when the page counts visits (not in the reviewer view). */
  usage?: UsageTotals;
};

function UsageNote({ usage }: { usage: UsageTotals }) {
  return (
    <section aria-labelledby="usage-heading" className="flex flex-col gap-1 rounded-lg border border-slate-200 bg-white p-4 text-sm text-slate-700">
      <h2 id="usage-heading" className="font-semibold text-slate-900">Use of this version</h2>
      <p className="tabular-nums">{plural(usage.investigations.unique, 'unique view')} · {plural(usage.requests.unique, 'unique download')}</p>
      <p className="text-xs text-slate-600">Counted as in the COUNTER Code of Practice for Research Data: robots excluded, repeat clicks within 30 s count once.</p>
    </section>
  );
}

/** The whole dataset page below the site header: every section as getLandingView() allowed it. */
export function DatasetLanding({ view, banner, usage }: DatasetLandingProps) {
  const { record } = view;
  const curvesLocked = view.withdrawal
    ? 'The curves and derived values left this page with the files when the version was withdrawn.'
    : view.curvesLock?.reason;
  const toWorkspace = view.allowedActions.some((a) => WORKSPACE_ACTIONS.has(a));
  return (
    <article className="flex flex-col gap-6">
      {view.jsonLd && <script type="application/ld+json" dangerouslySetInnerHTML={{ __html: view.jsonLd }} />}
      {banner}
      {view.withdrawal && <Tombstone view={view} />}
      <LandingHeader view={view} />
      <nav aria-label="On this page" className="-mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm">
        {SECTIONS.map(([id, label]) => <a key={id} href={`#${id}`} className="text-copper-800 hover:underline">{label}</a>)}
        {toWorkspace && <Link href={`/deposit/${view.version.id}`} className="font-semibold text-copper-800 underline">Open in the workspace</Link>}
      </nav>
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <aside className="flex min-w-0 flex-col gap-6 lg:order-2">
          <section aria-labelledby="cite-heading" className="flex flex-col gap-3 rounded-lg border border-slate-200 bg-white p-4">
            <h2 id="cite-heading" className="font-semibold text-slate-900">Cite this version</h2>
            {view.citations ? <CitationBox citations={view.citations} /> : <p className="text-sm text-slate-700">{view.citationNote}</p>}
          </section>
          <RecordExtras record={record} />
          {usage && <UsageNote usage={usage} />}
        </aside>
        <div className="flex min-w-0 flex-col gap-10 lg:order-1">
          <Section id="overview" title="Overview">
            {record.description ? <MarkdownDescription markdown={record.description} /> : <Quiet>The authors gave no description.</Quiet>}
            {!view.recordComplete && view.version.state !== 'draft' && (
              <p className="text-xs text-slate-600">Some fields of the measurement record are missing in this version.</p>
            )}
            <RecordCards record={record} />
          </Section>
          <Section id="curves" title="Curves">
            {view.curves ? (view.curves.files.length > 0 ? <CurvesPanel curves={view.curves} compareVersionId={view.version.state === 'published' && !banner ? view.version.id : undefined} /> : <NoAnalysis view={view} what="curves" />)
              : <Locked>{curvesLocked}</Locked>}
          </Section>
          <Section id="derived" title="Derived quantities and quality flags">
            {view.derived ? (view.derived.length > 0 ? <DerivedSection files={view.derived} /> : <NoAnalysis view={view} what="derived quantities" />)
              : <Locked>{curvesLocked}</Locked>}
          </Section>
          <Section id="files" title="Files">
            {view.files ? <FilesTable files={view.files} lock={view.filesLock} /> : <Quiet>The files were removed from view when this version was withdrawn.</Quiet>}
          </Section>
          <Section id="versions" title="Versions">
            <VersionsList versions={view.versions} />
          </Section>
        </div>
      </div>
    </article>
  );
}
