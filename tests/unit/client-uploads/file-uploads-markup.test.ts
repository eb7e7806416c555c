// Server-rendered markup of the widget (what the browser gets before hydration): rows, bars and labels.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it, vi } from 'vitest';
import type { FileView } from '@/lib/client/uploads/types';

// Outside a Next.js app the App Router context is missing; the widget only calls refresh() after an upload.
vi.mock('next/navigation', () => ({ useRouter: () => ({ refresh: () => undefined }) }));
const { FileUploads } = await import('@/components/deposit/upload/file-uploads');

const file = (over: Partial<FileView>): FileView => ({
  id: 'f1', name: 'rho-T film A.csv', role: 'raw', sizeBytes: 1_288_490_189, sha256: 'ab'.repeat(32), uploadState: 'verified',
  analysisState: 'done', analysisProgress: 1, analysisError: null, createdAt: '2026-12-02T10:00:00.000Z', ...over,
});

describe('FileUploads markup', () => {
  it('renders one labelled progress bar per file, with the phase in words, and the editing controls', () => {
    const html = renderToStaticMarkup(createElement(FileUploads, {
      versionId: 'v1',
      canEdit: true,
      initialFiles: [
        file({}),
        file({ id: 'f2', name: 'hall 2K.dat', sizeBytes: 2048, analysisState: 'running', analysisProgress: 0.4 }),
        file({ id: 'f3', name: 'sweep.csv', uploadState: 'pending', sha256: null, analysisState: 'none' }),
      ],
    }));
    expect(html.match(/role="progressbar"/g)).toHaveLength(3);
    expect(html).toContain('aria-label="Progress of rho-T film A.csv" aria-valuemin="0" aria-valuemax="100" aria-valuenow="100" aria-valuetext="ready"');
    expect(html).toContain('aria-valuenow="40" aria-valuetext="analysing 40\u00a0%"');
    expect(html).toContain('unfinished: pick the file again to resume');
    expect(html).toContain('1.20 GiB');
    expect(html).toContain('2 files stored');
    expect(html).toMatch(/<input id="[^"]+" type="file" multiple="" aria-describedby="[^"]+" class="peer sr-only"\/><label for="[^"]+"[^>]*>Choose files…<\/label>/);
    expect(html).toContain('Pick sweep.csv again to resume');
    expect(html).toContain('aria-label="Remove rho-T film A.csv"');
    expect(html).toContain('<option value="raw" selected="">Raw (instrument export)</option>');
    expect(html).toContain('role="status" aria-live="polite"');
  });

  it('shows no controls to a viewer who may not edit', () => {
    const html = renderToStaticMarkup(createElement(FileUploads, { versionId: 'v1', canEdit: false, initialFiles: [file({})] }));
    expect(html).not.toContain('type="file"');
    expect(html).not.toContain('<button');
    expect(html).not.toContain('<select');
    expect(html).toContain('aria-valuetext="ready"');
    expect(renderToStaticMarkup(createElement(FileUploads, { versionId: 'v1', canEdit: false, initialFiles: [] }))).toContain('No files in this version yet.');
  });
});
