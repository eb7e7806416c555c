import Link from 'next/link';
import { LocalDateTime } from '@/components/dataset/local-date-time';
import type { PublishedDatasetItem } from '@/lib/groups/list-groups';

export type GroupDatasetsProps = { datasets: PublishedDatasetItem[]; groupName: string };

/** The group's published datasets, each by its latest published version. */
export function GroupDatasets({ datasets, groupName }: GroupDatasetsProps) {
  if (datasets.length === 0) {
    return <p className="rounded-lg border border-dashed border-slate-300 bg-white p-5 text-sm text-slate-600">{groupName} has not published a dataset yet.</p>;
  }
  return (
    <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
      {datasets.map((d) => (
        <li key={d.datasetId} className="px-4 py-3">
          <Link href={d.url} className="font-medium text-slate-900 hover:text-copper-800 hover:underline">{d.title}</Link>
          <p className="mt-1 font-mono text-xs text-slate-600">
            {d.doi ?? 'DOI being registered'} · v{d.versionNumber}
            {d.publishedAt && <> · published <LocalDateTime iso={d.publishedAt} withTime={false} /></>}
          </p>
          {d.embargoUntil && <p className="mt-1 text-xs text-amber-800">Files under embargo until {d.embargoUntil} (00:00 UTC)</p>}
        </li>
      ))}
    </ul>
  );
}
