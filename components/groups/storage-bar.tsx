import type { GroupStorage } from '@/lib/groups/group-storage';

export type StorageBarProps = { storage: GroupStorage; groupName: string };

const FILL: Record<GroupStorage['level'], string> = { ok: 'fill-copper-500', high: 'fill-amber-500', full: 'fill-red-600' };

/** The group's storage use against its quota, as a bar and in words; warns near and at the limit. */
export function StorageBar({ storage, groupName }: StorageBarProps) {
  const width = Math.min(100, storage.percentUsed);
  return (
    <section aria-labelledby="storage-heading" className="rounded-lg border border-slate-200 bg-white p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="storage-heading" className="text-sm font-semibold text-slate-900">Storage</h2>
        <p className="num text-sm text-slate-700">{storage.summary}</p>
      </div>
      {/* SVG attributes, not a style attribute, so a strict Content-Security-Policy (no inline styles) keeps the bar. */}
      <svg
        role="meter"
        aria-label={`Storage used by ${groupName}`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={storage.percentUsed}
        aria-valuetext={storage.summary}
        className="mt-2 block h-3 w-full"
      >
        <rect width="100%" height="100%" rx="6" className="fill-slate-200" />
        {storage.usedBytes > 0 && <rect width={`${Math.max(width, 1)}%`} height="100%" rx="6" className={FILL[storage.level]} />}
      </svg>
      {storage.level === 'high' && <p className="mt-2 text-sm text-amber-900">Nearly full. Ask a site admin for more room before the next large upload.</p>}
      {storage.level === 'full' && <p className="mt-2 text-sm text-red-800">Full: new uploads are refused until files are removed or the quota is raised by a site admin.</p>}
      <p className="mt-2 text-xs text-slate-500">Files stored once per content (SHA-256) count once, however many versions use them.</p>
    </section>
  );
}
