import type { HighlightSegment } from '@/lib/search/types';

/** Highlight segments as text with <mark>: the segments are plain strings, so nothing is ever parsed as markup. */
export function Highlighted({ segments, fallback }: { segments?: HighlightSegment[]; fallback: string }) {
  if (!segments?.length) return <>{fallback}</>;
  return <>{segments.map((s, i) => (s.match ? <mark key={i} className="rounded bg-amber-100 px-0.5 text-inherit">{s.text}</mark> : <span key={i}>{s.text}</span>))}</>;
}
