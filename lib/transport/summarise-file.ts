import type { TransportDatasetDraft } from '@/lib/schema';
import { parseTransportTable, type ByteSource, type ColumnOverride, type ParseOptions } from './parse';
import { summariseTable } from './summary/summarise-table';
import type { FileSummary } from './summary/types';

export type SummariseFileOptions = {
  /** The dataset record (a draft is fine); its columns override the detected mapping, its geometry feeds ρ, R_s, μ. */
  metadata?: TransportDatasetDraft;
  fileName?: string;
  limits?: Pick<ParseOptions, 'maxBytes' | 'maxLineBytes' | 'maxRows'>;
  /** The source's size in bytes when known (file or object size): lets the parser allocate the columns once. */
  sizeBytes?: number;
  previewPoints?: number;
  encoding?: string;
  signal?: AbortSignal;
  onProgress?: (bytesRead: number) => void;
  /** Worker threads for the rows of large files (see ParseOptions.parallel); the summary does not depend on it. */
  parallel?: ParseOptions['parallel'];
};

function overrides(metadata: TransportDatasetDraft | undefined): ColumnOverride[] {
  return (metadata?.columns ?? [])
    .filter((c): c is typeof c & { name: string } => typeof c.name === 'string' && c.name !== '')
    .map((c) => ({ name: c.name, quantity: c.quantity, unit: c.unit, role: c.role }));
}

/**
 * Parses a transport file from a byte stream and summarises it: columns in SI, derived quantities, quality flags and
 * plot previews, as plain JSON. Throws TransportParseError when the file is not a readable table.
 */
export async function summariseFile(source: ByteSource, options: SummariseFileOptions = {}): Promise<FileSummary> {
  const table = await parseTransportTable(source, {
    ...options.limits,
    columns: overrides(options.metadata),
    encoding: options.encoding,
    sizeBytes: options.sizeBytes,
    signal: options.signal,
    onProgress: options.onProgress,
    parallel: options.parallel,
  });
  return summariseTable(table, options.metadata, { fileName: options.fileName, previewPoints: options.previewPoints });
}
