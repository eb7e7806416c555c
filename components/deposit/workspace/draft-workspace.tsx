'use client';

import { useCallback, useMemo, useState, type ReactNode } from 'react';
import { FileUploads } from '@/components/deposit/upload/file-uploads';
import type { UnitChoice } from '@/components/deposit/columns/unit-choice';
import { checkRecord } from '@/components/deposit/record/record-check';
import type { FileView } from '@/lib/client/uploads/types';
import { ColumnsSection } from './columns-section';
import { DraftHeader, type DraftHeading } from './draft-header';
import { DerivedSection } from './derived-section';
import { RecordSection } from './record-section';
import { SaveIndicator } from './save-indicator';
import { summarySources } from './summary-sources';
import { useAutosave } from './use-autosave';
import { useFileAnalyses } from './use-file-analyses';
import { useLocalPreviews } from './use-local-previews';
import { UnsentOffer } from './unsent-offer';
import { PreviewPanel } from '@/components/deposit/preview/preview-panel';

export type DraftWorkspaceProps = {
  versionId: string;
  record: unknown;
  updatedAt: string;
  files: FileView[];
  canEdit: boolean;
  catalogue: UnitChoice[];
  heading: DraftHeading;
};

const SECTIONS = [
  { id: 'files', title: 'Files' },
  { id: 'columns', title: 'Columns & units' },
  { id: 'preview', title: 'Preview' },
  { id: 'record', title: 'Measurement record' },
  { id: 'derived', title: 'Derived & flags' },
] as const;

function Section({ id, n, title, lead, children }: { id: string; n: number; title: string; lead: string; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="scroll-mt-28">
      <h2 id={`${id}-heading`} className="flex items-baseline gap-2 text-lg font-semibold text-slate-900">
        <span className="num text-sm font-semibold text-copper-700">{n}</span> {title}
      </h2>
      <p className="mb-3 text-sm text-slate-600">{lead}</p>
      {children}
    </section>
  );
}

/** A draft's workspace: files, column mapping with preview, the measurement record, derived values and flags. */
export function DraftWorkspace({ versionId, record: initialRecord, updatedAt, files: initialFiles, canEdit, catalogue, heading }: DraftWorkspaceProps) {
  const [files, setFiles] = useState(initialFiles);
  const { analyses, refresh } = useFileAnalyses(files);
  const autosave = useAutosave({ versionId, initialRecord, serverUpdatedAt: updatedAt, canEdit, onAnalysisInputsSaved: refresh });
  const { record, setRecord } = autosave;
  const local = useLocalPreviews(record);
  const check = useMemo(() => checkRecord(record), [record]);
  const sources = useMemo(() => summarySources(files, analyses, local.previews), [files, analyses, local.previews]);
  const errors = useMemo(() => ({ ...autosave.state.serverErrors, ...check.inline }), [autosave.state.serverErrors, check.inline]);
  const onFiles = useCallback((next: FileView[]) => setFiles(next), []);

  const title = (record as { title?: unknown } | null)?.title;
  return (
    <div className="flex flex-col gap-8">
      <DraftHeader title={typeof title === 'string' ? title : ''} heading={heading} />
      <div className="sticky top-0 z-10 -mx-4 flex flex-wrap items-center justify-between gap-3 border-b border-slate-200 bg-slate-50/95 px-4 py-2 backdrop-blur">
        <nav aria-label="Draft sections">
          <ol className="flex flex-wrap gap-1 text-sm">
            {SECTIONS.map((s, i) => (
              <li key={s.id}>
                <a href={`#${s.id}`} className="rounded px-2 py-1 text-slate-700 hover:bg-slate-200 hover:text-slate-900">
                  <span className="num text-copper-700">{i + 1}</span> {s.title}
                </a>
              </li>
            ))}
          </ol>
        </nav>
        <SaveIndicator state={autosave.state} canEdit={canEdit} />
      </div>
      {autosave.offered && <UnsentOffer offered={autosave.offered} onRestore={autosave.acceptOffered} onDiscard={autosave.discardOffered} />}

      <Section id="files" n={1} title="Files" lead="Raw instrument exports and processed tables. Each file is checked and stored once; tables are analysed on the server.">
        {/* Capture the picked or dropped files (before the upload widget takes them) for the instant in-browser preview. */}
        <div
          onChangeCapture={(e) => {
            const input = e.target as HTMLInputElement;
            if (input.type === 'file' && input.files) local.addFiles(Array.from(input.files));
          }}
          onDropCapture={(e) => local.addFiles(Array.from(e.dataTransfer.files))}
        >
          <FileUploads versionId={versionId} initialFiles={initialFiles} canEdit={canEdit} onChange={onFiles} />
        </div>
      </Section>

      <Section id="columns" n={2} title="Columns & units" lead="What each column holds, as we read it from the header, with the reason. Correct any guess: your mapping is kept in the record and the files are analysed again.">
        <ColumnsSection files={files} analyses={analyses} sources={sources} localErrors={local.previews} record={record} catalogue={catalogue}
          readOnly={!canEdit} onColumnsChange={(columns) => setRecord({ ...(record as object), columns })} />
      </Section>

      <Section id="preview" n={3} title="Preview" lead="The curves as mapped, in practitioner units; they redraw as you change the mapping.">
        <PreviewPanel sources={sources} record={record} catalogue={catalogue} />
      </Section>

      <Section id="record" n={4} title="Measurement record" lead="Checked as you type against the same schema the server uses. Everything is saved as you go, even values that still need fixing.">
        <RecordSection record={record} onChange={setRecord} errors={errors} check={check} sources={sources} readOnly={!canEdit} />
      </Section>

      <Section id="derived" n={5} title="Derived & flags" lead="Computed from the files with your geometry and settings. Flags advise; they never block a deposit.">
        <DerivedSection sources={sources} />
      </Section>
    </div>
  );
}
